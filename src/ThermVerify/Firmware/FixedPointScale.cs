using System.Globalization;

namespace ThermVerify.Firmware;

/// <summary>
/// How a table stores temperature: a signed integer counting 1/<see cref="UnitsPerKelvin"/> K above 0 °C.
/// The default, 100 per kelvin, is centi-degrees Celsius (0.01 K); 10 per kelvin is deci-degrees (0.1 K).
/// Conversion rounds half away from zero, the same rule the C routine uses, so ±½ unit is the rounding error.
/// </summary>
public readonly record struct FixedPointScale
{
    public static readonly FixedPointScale CentiKelvin = new(100);
    public static readonly FixedPointScale DeciKelvin = new(10);

    public FixedPointScale(int unitsPerKelvin)
    {
        if (unitsPerKelvin is not (1 or 10 or 100 or 1000))
            throw new FirmwareInputException(FormattableString.Invariant(
                $"A fixed-point temperature unit of 1/{unitsPerKelvin} K is not supported; use 1, 10, 100 or 1000 units per kelvin (1 K, 0.1 K, 0.01 K, 0.001 K)."));
        UnitsPerKelvin = unitsPerKelvin;
    }

    public int UnitsPerKelvin { get; }

    /// <summary>One unit in kelvin, e.g. 0.01.</summary>
    public double UnitKelvin => 1.0 / UnitsPerKelvin;

    /// <summary>Decimal places that print a value of this unit exactly in °C.</summary>
    public int Decimals => UnitsPerKelvin switch { 1 => 0, 10 => 1, 100 => 2, _ => 3 };

    /// <summary>The nearest representable value; throws when it does not fit in 32 bits.</summary>
    public int ToFixed(double celsius)
    {
        var scaled = Math.Round(celsius * UnitsPerKelvin, MidpointRounding.AwayFromZero);
        if (!(scaled >= int.MinValue && scaled <= int.MaxValue))
            throw new FirmwareInputException(FormattableString.Invariant($"{celsius} °C does not fit a 32-bit value in units of {Name}."));
        return (int)scaled;
    }

    public double ToCelsius(int value) => (double)value / UnitsPerKelvin;

    /// <summary>The value as °C with exactly the digits the unit carries, e.g. "-12.35".</summary>
    public string FormatCelsius(int value) =>
        ((decimal)value / UnitsPerKelvin).ToString("F" + Decimals.ToString(CultureInfo.InvariantCulture), CultureInfo.InvariantCulture);

    public string Name => UnitsPerKelvin == 1 ? "1 K" : "0." + new string('0', Decimals - 1) + "1 K";

    public override string ToString() => Name;
}
