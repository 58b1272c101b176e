using ThermVerify.Design;
using ThermVerify.Tests.Check;

namespace ThermVerify.Tests.Tolerances;

/// <summary>Designs for the tolerance tests, built on the plain verification front end (10 kΩ NTC, 10 kΩ low side, ratiometric).</summary>
internal static class ToleranceTestDesigns
{
    /// <summary>Only the sensor's R25 and the fixed resistor are toleranced; a 16-bit converter keeps quantisation small.</summary>
    public static FrontEndDesign TwoResistors(string sensorTolerance = "\"1 %\"", string fixedTolerance = "\"0.1 %\"", int bits = 16) =>
        TestDesign.Make(("sensor.resistance_tolerance", sensorTolerance), ("divider.fixed_tolerance", fixedTolerance),
            ("adc.bits", bits.ToString(System.Globalization.CultureInfo.InvariantCulture)),
            ("check.range", "\"0 degC .. 50 degC\""), ("check.budget", "\"1 K\""));
}
