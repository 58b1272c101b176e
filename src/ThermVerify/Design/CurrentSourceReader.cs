using ThermVerify.Quantities;

namespace ThermVerify.Design;

/// <summary>Reads [current_source].</summary>
internal static class CurrentSourceReader
{
    private static readonly string[] Keys =
    [
        "current", "current_tolerance", "current_tempco", "compliance", "output_resistance", "reference_resistor",
        "reference_resistor_tolerance", "reference_resistor_tempco", "reference_input_resistance",
    ];

    public static CurrentSourceSpec Read(TomlSection s)
    {
        s.AllowOnly(Keys);
        var compliance = s.Range("compliance", UnitKind.Volt);
        if (compliance is { } c && !(c.Max > c.Min))
            throw s.ErrorAtValue("compliance", "the compliance range is empty", "Write the output voltages the source can hold its current over, e.g. \"0 V .. 2.5 V\".");
        var reference = s.Quantity("reference_resistor", Bound.Positive, UnitKind.Ohm)?.Value;
        foreach (var key in new[] { "reference_resistor_tolerance", "reference_resistor_tempco", "reference_input_resistance" })
            if (reference is null && s.Has(key))
                throw s.ErrorAtKey(key, $"{key} without reference_resistor", "Add reference_resistor = \"...\" (the ratiometric reference resistor), or remove the key.");
        return new CurrentSourceSpec
        {
            CurrentAmperes = s.RequiredValue("current", Bound.Positive, "Write current = \"1 mA\" (the excitation current through the sensor).", UnitKind.Ampere),
            CurrentTolerance = SensorReader.Tolerance(s, "current_tolerance"),
            CurrentTempcoPerKelvin = s.ValueOr("current_tempco", 0, Bound.Any, UnitKind.PpmPerKelvin),
            CurrentTempcoSigned = SignWritten.Of(s, "current_tempco"),
            Compliance = compliance is { } r ? new VoltageRange(r.Min, r.Max) : null,
            OutputResistanceOhms = s.Quantity("output_resistance", Bound.Positive, UnitKind.Ohm)?.Value,
            ReferenceResistorOhms = reference,
            ReferenceResistorTolerance = SensorReader.Tolerance(s, "reference_resistor_tolerance"),
            ReferenceResistorTempcoPerKelvin = s.ValueOr("reference_resistor_tempco", 0, Bound.Any, UnitKind.PpmPerKelvin),
            ReferenceResistorTempcoSigned = SignWritten.Of(s, "reference_resistor_tempco"),
            ReferenceInputOhms = s.Quantity("reference_input_resistance", Bound.Positive, UnitKind.Ohm)?.Value,
        };
    }
}
