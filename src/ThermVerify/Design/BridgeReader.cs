using ThermVerify.Quantities;

namespace ThermVerify.Design;

/// <summary>
/// Reads [bridge]: the sensor's half (sensor side, fixed resistor, excitation, as in [divider]) and the opposite half.
/// A switched excitation is not modelled for a bridge, so its keys are not among the bridge's.
/// </summary>
internal static class BridgeReader
{
    private static readonly string[] Keys =
    [
        "sensor_side", "fixed_resistor", "fixed_tolerance", "fixed_tempco", "excitation", "excitation_tolerance",
        "opposite_high", "opposite_high_tolerance", "opposite_high_tempco", "opposite_low", "opposite_low_tolerance", "opposite_low_tempco",
    ];

    public static (DividerSpec Half, BridgeSpec Opposite) Read(TomlSection s)
    {
        s.AllowOnly(Keys);
        var half = new DividerSpec
        {
            SensorSide = s.Choice("sensor_side", CircuitReaders.Sides)
                ?? throw s.Missing("sensor_side", "Write sensor_side = \"low\" (sensor from the positive output to ground) or \"high\" (sensor from the excitation to the positive output)."),
            FixedResistorOhms = s.RequiredValue("fixed_resistor", Bound.Positive, "Write fixed_resistor = \"100 ohm\" (the resistor in the sensor's half).", UnitKind.Ohm),
            FixedTolerance = SensorReader.Tolerance(s, "fixed_tolerance"),
            FixedTempcoPerKelvin = s.ValueOr("fixed_tempco", DesignDefaults.Tolerance, Bound.Any, UnitKind.PpmPerKelvin),
            FixedTempcoSigned = SignWritten.Of(s, "fixed_tempco"),
            ExcitationVolts = s.RequiredValue("excitation", Bound.Positive, "Write excitation = \"2.5 V\" (the voltage across both halves).", UnitKind.Volt),
            ExcitationTolerance = SensorReader.Tolerance(s, "excitation_tolerance"),
        };
        var opposite = new BridgeSpec
        {
            HighOhms = s.RequiredValue("opposite_high", Bound.Positive, "Write opposite_high = \"100 ohm\" (from the excitation to the negative output).", UnitKind.Ohm),
            HighTolerance = SensorReader.Tolerance(s, "opposite_high_tolerance"),
            HighTempcoPerKelvin = s.ValueOr("opposite_high_tempco", 0, Bound.Any, UnitKind.PpmPerKelvin),
            HighTempcoSigned = SignWritten.Of(s, "opposite_high_tempco"),
            LowOhms = s.RequiredValue("opposite_low", Bound.Positive, "Write opposite_low = \"100 ohm\" (from the negative output to ground).", UnitKind.Ohm),
            LowTolerance = SensorReader.Tolerance(s, "opposite_low_tolerance"),
            LowTempcoPerKelvin = s.ValueOr("opposite_low_tempco", 0, Bound.Any, UnitKind.PpmPerKelvin),
            LowTempcoSigned = SignWritten.Of(s, "opposite_low_tempco"),
        };
        return (half, opposite);
    }
}
