using ThermVerify.Quantities;
using ThermVerify.Sensors;

namespace ThermVerify.Design;

/// <summary>Reads [sensor]; the keys allowed depend on <c>model</c>.</summary>
internal static class SensorReader
{
    private static readonly Dictionary<string, string[]> KeysByModel = new()
    {
        ["beta"] = ["r25", "r0", "reference_temperature", "beta", "beta_between", "resistance_tolerance", "beta_tolerance", "valid_range"],
        ["steinhart-hart"] = ["a", "b", "c", "d", "resistance_tolerance", "valid_range"],
        ["table"] = ["file", "resistance_tolerance"],
        ["rtd"] = ["r0", "class", "a", "b", "c"],
    };

    private static readonly string[] Common = ["model", "dissipation_constant"];

    private static readonly Dictionary<string, RtdClass> Classes = new()
    {
        ["AA"] = RtdClass.AA, ["A"] = RtdClass.A, ["B"] = RtdClass.B, ["C"] = RtdClass.C,
    };

    public static SensorSpec Read(TomlSection s)
    {
        var model = s.ChoiceText("model", KeysByModel.Keys) ?? throw s.Missing("model", "Write model = \"beta\", \"steinhart-hart\", \"table\" or \"rtd\".");
        s.AllowOnly([.. Common, .. KeysByModel[model]], key => ElsewhereExplanation(key, model));
        var dissipation = s.Quantity("dissipation_constant", Bound.Positive, UnitKind.WattPerKelvin)?.Value;
        SensorSpec spec = model switch
        {
            "beta" => ReadBeta(s),
            "steinhart-hart" => ReadSteinhartHart(s),
            "table" => ReadTable(s),
            _ => ReadRtd(s),
        };
        return spec with { DissipationConstantWattsPerKelvin = dissipation };
    }

    private static string? ElsewhereExplanation(string key, string model)
    {
        var owners = KeysByModel.Where(kv => kv.Key != model && kv.Value.Contains(key)).Select(kv => $"\"{kv.Key}\"").ToList();
        return owners.Count == 0 ? null
            : $"\"{key}\" belongs to model {string.Join(" or ", owners)}, not \"{model}\". Valid keys for \"{model}\": {string.Join(", ", [.. Common, .. KeysByModel[model]])}.";
    }

    private static BetaSensorSpec ReadBeta(TomlSection s)
    {
        double r0, reference;
        if (s.Has("r25"))
        {
            if (s.Has("r0"))
                throw s.ErrorAtKey("r0", "both r25 and r0 given", "Give r25 alone, or r0 with reference_temperature.");
            if (s.Has("reference_temperature"))
                throw s.ErrorAtKey("reference_temperature", "reference_temperature goes with r0, not r25", "r25 is by definition at 25 degC; use r0 for another temperature.");
            r0 = s.RequiredValue("r25", Bound.Positive, "", UnitKind.Ohm);
            reference = 25;
        }
        else
        {
            r0 = s.Quantity("r0", Bound.Positive, UnitKind.Ohm)?.Value
                ?? throw s.Missing("r25", "Write r25 = \"10 kohm\" (resistance at 25 degC), or r0 with reference_temperature.");
            reference = s.Quantity("reference_temperature", Bound.Any, UnitKind.Celsius)?.Value
                ?? throw s.Missing("reference_temperature", "With r0, say where it holds: reference_temperature = \"0 degC\".");
        }
        var beta = ReadBeta(s, "beta");
        var between = s.Range("beta_between", UnitKind.Celsius);
        return new BetaSensorSpec
        {
            R0Ohms = r0,
            ReferenceCelsius = reference,
            BetaKelvin = beta,
            BetaFromCelsius = between?.Min ?? DesignDefaults.BetaFromCelsius,
            BetaToCelsius = between?.Max ?? DesignDefaults.BetaToCelsius,
            ResistanceTolerance = Tolerance(s, "resistance_tolerance"),
            BetaTolerance = Tolerance(s, "beta_tolerance"),
            ValidRange = ValidRange(s),
        };
    }

    /// <summary>β in K: a plain number (3950) or with its unit ("3950 K").</summary>
    private static double ReadBeta(TomlSection s, string key)
    {
        var q = s.Quantity(key, Bound.Positive, UnitKind.Kelvin, UnitKind.Dimensionless)
            ?? throw s.Missing(key, "Write beta = 3950 (in K, e.g. the B25/85 value).");
        if (q.Value < 100 || q.Value > 100_000)
            throw s.ErrorAtValue(key, $"β = {q.Value:G6} K is outside 100 K .. 100000 K", "NTC β values are typically 2000 K to 6000 K; check the number.");
        return q.Value;
    }

    private static SteinhartHartSensorSpec ReadSteinhartHart(TomlSection s)
    {
        double Coefficient(string key) => s.Number(key)
            ?? throw s.Missing(key, $"Write {key} = <number> (Steinhart–Hart coefficient, 1/T = a + b ln R + c (ln R)^3 [+ d (ln R)^2]).");
        var spec = new SteinhartHartSensorSpec
        {
            A = Coefficient("a"),
            B = Coefficient("b"),
            C = Coefficient("c"),
            D = s.Number("d") ?? 0,
            ResistanceTolerance = Tolerance(s, "resistance_tolerance"),
            ValidRange = ValidRange(s),
        };
        if (!(spec.B > 0))
            throw s.ErrorAtValue("b", "b must be positive for an NTC thermistor", "Check the sign and the order of a, b, c.");
        return spec;
    }

    private static TableSensorSpec ReadTable(TomlSection s)
    {
        var file = s.RequiredString("file", "Write file = \"rt.csv\" (temperature in degC, resistance in ohm, relative to the design file).");
        var (fullPath, text) = s.ReadFile("file", file);
        return new TableSensorSpec
        {
            File = file,
            FullPath = fullPath,
            Text = text,
            ResistanceTolerance = Tolerance(s, "resistance_tolerance"),
        };
    }

    private static RtdSensorSpec ReadRtd(TomlSection s) => new()
    {
        R0Ohms = s.RequiredValue("r0", Bound.Positive, "Write r0 = \"100 ohm\" (Pt100) or \"1 kohm\" (Pt1000).", UnitKind.Ohm),
        ToleranceClass = s.Choice("class", Classes),
        A = s.Number("a") ?? PlatinumRtd.IecA,
        B = s.Number("b") ?? PlatinumRtd.IecB,
        C = s.Number("c") ?? PlatinumRtd.IecC,
    };

    /// <summary>A tolerance or error fraction, written in % or ppm, below 100 %.</summary>
    internal static double Tolerance(TomlSection s, string key)
    {
        var value = s.ValueOr(key, DesignDefaults.Tolerance, Bound.NonNegative, UnitKind.Percent, UnitKind.Ppm);
        if (value >= 1)
            throw s.ErrorAtValue(key, "a tolerance of 100 % or more", "Write the tolerance as a percentage, e.g. \"1 %\", or in ppm.");
        return value;
    }

    private static TemperatureRange? ValidRange(TomlSection s) =>
        s.Range("valid_range", UnitKind.Celsius) is { } r ? new TemperatureRange(r.Min, r.Max) : null;
}
