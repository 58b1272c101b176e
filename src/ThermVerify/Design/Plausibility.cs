using System.Text.RegularExpressions;
using ThermVerify.Quantities;

namespace ThermVerify.Design;

/// <summary>A closed interval of magnitudes a value may take (zero is judged by the key's own sign rule).</summary>
internal readonly record struct PlausibleSpan(double SmallestMagnitude, double LargestMagnitude);

/// <summary>
/// The range every value of a design must lie in to be taken as meant: values far outside what any front end uses
/// (a 1e-300 V excitation, a 1e300 Hz noise corner, a 1e30 Ω resistor) are refused at load with the range, instead of
/// flowing into the analyses and their outputs as infinities. Each kind of quantity has a wide default; some keys have
/// a narrower one. Zero is not judged here (each key's sign rule says whether zero is allowed). The table is stated in
/// docs/design-file.md; the ranges are common practice, no source, kept wide on purpose.
/// </summary>
internal static partial class Plausibility
{
    private static readonly Dictionary<UnitKind, PlausibleSpan> ByKind = new()
    {
        [UnitKind.Dimensionless] = new(1e-30, 1e9),
        [UnitKind.Ohm] = new(1e-6, 1e12),
        [UnitKind.Volt] = new(1e-9, 1e3),
        [UnitKind.Ampere] = new(1e-18, 1),
        [UnitKind.Farad] = new(1e-18, 1),
        [UnitKind.Second] = new(1e-12, 1e5),
        [UnitKind.Hertz] = new(1e-3, 1e12),
        [UnitKind.Kelvin] = new(1e-6, 1e3),
        [UnitKind.Percent] = new(1e-12, 1),
        [UnitKind.Ppm] = new(1e-12, 1),
        [UnitKind.PpmPerKelvin] = new(1e-12, 1e-2),
        [UnitKind.Decibel] = new(1e-3, 300),
        [UnitKind.WattPerKelvin] = new(1e-6, 10),
        [UnitKind.VoltPerSecond] = new(1, 1e12),
        [UnitKind.VoltPerRootHertz] = new(1e-12, 1e-3),
        [UnitKind.AmperePerRootHertz] = new(1e-18, 1e-6),
        [UnitKind.Lsb] = new(1e-9, 1e6),
        [UnitKind.VoltPerKelvin] = new(1e-15, 1e-2),
        [UnitKind.Degree] = new(1e-3, 360),
        [UnitKind.KelvinPerSecond] = new(1e-9, 1e3),
        [UnitKind.Coulomb] = new(1e-18, 1e-6),
    };

    /// <summary>Keys whose plausible range is narrower than their kind's (key path without table-array indices).</summary>
    private static readonly Dictionary<string, PlausibleSpan> ByKey = new(StringComparer.Ordinal)
    {
        ["divider.excitation"] = new(1e-3, 1e3),
        ["adc.reference"] = new(1e-3, 1e3),
        ["current_source.current"] = new(1e-9, 0.1),
        ["current_source.reference_resistor"] = new(1e-3, 1e9),
        ["adc.sample_rate"] = new(1e-3, 1e10),
        ["adc.leakage_doubling"] = new(1, 1e3),
        ["adc.modulator_rate"] = new(100, 1e9),
        ["adc.data_rate"] = new(1e-3, 1e8),
        ["adc.gain"] = new(1e-3, 1e4),
        ["adc.noise_table.gain"] = new(1e-3, 1e4),
        ["buffer.gain_bandwidth"] = new(1, 1e11),
        ["buffer.gain"] = new(1, 1e6),
        ["amplifier.gain"] = new(1e-3, 1e4),
        ["buffer.dc_gain"] = new(20, 300),
        ["buffer.output_resistance"] = new(1e-6, 1e6),
        ["buffer.noise_corner"] = new(1e-3, 1e9),
        ["buffer.supply"] = new(1e-9, 1e3),
        // β is read as K or a plain number and has its own, narrower check (100 K .. 100000 K) in the sensor reader.
        ["sensor.beta"] = new(1e-30, 1e9),
        ["sensor.r25"] = new(1e-3, 1e12),
        ["sensor.r0"] = new(1e-3, 1e12),
    };

    /// <summary>Absolute temperatures: above absolute zero and at most 2000 °C (no sensor here reads beyond).</summary>
    public const double LowestCelsius = -273.15;
    public const double HighestCelsius = 2000;

    /// <summary>Null when the value is plausible for the key, else the problem and the hint.</summary>
    public static (string Problem, string Hint)? Judge(string keyPath, double value, UnitKind kind)
    {
        if (!double.IsFinite(value))
            return ("NaN and infinity are not values", "Write a finite number.");
        if (kind == UnitKind.Celsius)
        {
            return value > LowestCelsius && value <= HighestCelsius ? null
                : ($"{Show(value, kind)} is outside the plausible temperatures (above {Show(LowestCelsius, kind)}, at most {Show(HighestCelsius, kind)})",
                   "Check the number, its sign and its unit.");
        }
        if (value == 0) return null;
        var span = For(keyPath, kind);
        var magnitude = Math.Abs(value);
        if (magnitude >= span.SmallestMagnitude && magnitude <= span.LargestMagnitude) return null;
        var sign = value < 0 ? "the magnitude of " : "";
        return ($"{sign}{Show(value, kind)} is outside the plausible range {Show(span.SmallestMagnitude, kind)} .. {Show(span.LargestMagnitude, kind)}",
            "Check the number, its prefix and its exponent; docs/design-file.md lists the range of every key.");
    }

    public static PlausibleSpan For(string keyPath, UnitKind kind) =>
        ByKey.TryGetValue(Index().Replace(keyPath, ""), out var span) ? span : ByKind.GetValueOrDefault(kind, ByKind[UnitKind.Dimensionless]);

    private static string Show(double value, UnitKind kind)
    {
        try
        {
            return EngineeringFormat.Format(value, kind, 3);
        }
        catch (ArgumentException)
        {
            return value.ToString("G3", System.Globalization.CultureInfo.InvariantCulture);
        }
    }

    [GeneratedRegex(@"\[\d+\]")]
    private static partial Regex Index();
}
