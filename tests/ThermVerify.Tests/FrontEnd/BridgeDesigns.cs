using ThermVerify.Design;
using ThermVerify.Tests.Check;

namespace ThermVerify.Tests.FrontEnd;

/// <summary>
/// A Pt1000 in a Wheatstone bridge for bridge tests, built on <see cref="TestDesign"/> (its divider replaced by
/// [bridge]): every other arm 1 kΩ (the sensor's R0, so the bridge balances at 0 °C), 2.5 V excitation, a 16-bit
/// ratiometric converter, 25 °C to 150 °C in 25 K steps (above the balance, where the unipolar converter reads codes from 0 up); the sensor by IEC 60751 (<see cref="CurrentDesigns.Ohms"/>).
/// </summary>
internal static class BridgeDesigns
{
    public const double Excitation = 2.5;

    public static FrontEndDesign Pt1000(params (string Path, string? Value)[] more) =>
        TestDesign.Make([
            ("sensor.model", "\"rtd\""), ("sensor.r25", null), ("sensor.beta", null), ("sensor.r0", "\"1 kohm\""),
            ("divider.sensor_side", null), ("divider.fixed_resistor", null), ("divider.fixed_tempco", null), ("divider.excitation", null),
            ("bridge.sensor_side", "\"low\""), ("bridge.fixed_resistor", "\"1 kohm\""), ("bridge.excitation", "\"2.5 V\""),
            ("bridge.opposite_high", "\"1 kohm\""), ("bridge.opposite_low", "\"1 kohm\""),
            ("adc.bits", "16"), ("check.range", "\"25 degC .. 150 degC\""), ("check.step", "\"25 K\""), ("check.budget", "\"0.5 K\""), .. more]);
}
