using ThermVerify.Design;
using ThermVerify.Tests.Check;

namespace ThermVerify.Tests.FrontEnd;

/// <summary>
/// A Pt100 excited by 1 mA for current-excitation tests, built on <see cref="TestDesign"/> (its divider removed): a
/// 16-bit converter with a fixed 2.5 V reference, −100 °C to 200 °C in 50 K steps, and the Callendar–Van Dusen
/// equation of IEC 60751 written out by hand (A = 3.9083e-3, B = −5.775e-7, C = −4.183e-12).
/// </summary>
internal static class CurrentDesigns
{
    public static FrontEndDesign Pt100(params (string Path, string? Value)[] more) =>
        TestDesign.Make([
            ("sensor.model", "\"rtd\""), ("sensor.r25", null), ("sensor.beta", null), ("sensor.r0", "\"100 ohm\""),
            ("divider.sensor_side", null), ("divider.fixed_resistor", null), ("divider.fixed_tempco", null), ("divider.excitation", null),
            ("current_source.current", "\"1 mA\""), ("adc.reference", "\"2.5 V\""), ("adc.bits", "16"),
            ("check.range", "\"-100 degC .. 200 degC\""), ("check.step", "\"50 K\""), ("check.budget", "\"0.5 K\""), .. more]);

    /// <summary>The same with a ratiometric reference resistor of 2 kΩ (the converter's reference is I·R_ref = 2 V).</summary>
    public static FrontEndDesign Ratiometric(params (string Path, string? Value)[] more) =>
        Pt100([("current_source.reference_resistor", "\"2 kohm\""), ("adc.reference", "\"ratiometric\""), .. more]);

    /// <summary>IEC 60751: R = R0·(1 + A·t + B·t² + C·(t − 100)·t³), the C term below 0 °C only.</summary>
    public static double Ohms(double celsius, double r0 = 100)
    {
        const double a = 3.9083e-3, b = -5.775e-7, c = -4.183e-12;
        var t = celsius;
        return r0 * (1 + a * t + b * t * t + (t < 0 ? c * (t - 100) * t * t * t : 0));
    }

    /// <summary>dR/dt of the same equation.</summary>
    public static double OhmsPerKelvin(double celsius, double r0 = 100)
    {
        const double a = 3.9083e-3, b = -5.775e-7, c = -4.183e-12;
        var t = celsius;
        return r0 * (a + 2 * b * t + (t < 0 ? c * (4 * t * t * t - 300 * t * t) : 0));
    }
}
