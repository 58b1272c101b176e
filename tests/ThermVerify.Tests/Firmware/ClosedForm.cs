namespace ThermVerify.Tests.Firmware;

/// <summary>
/// Hand formulas the firmware tests check against, written out here rather than taken from the library:
/// Ohm's law for the divider and the Beta model solved for T (1/T = 1/T0 + ln(R/R0)/β).
/// </summary>
internal static class ClosedForm
{
    public static double LowSideOhms(double volts, double excitation, double fixedOhms) => fixedOhms * volts / (excitation - volts);

    public static double LowSideVolts(double sensorOhms, double excitation, double fixedOhms) => excitation * sensorOhms / (sensorOhms + fixedOhms);

    public static double BetaCelsius(double ohms, double r0 = 10_000, double beta = 3435, double t0Celsius = 25) =>
        1 / (1 / (t0Celsius + 273.15) + Math.Log(ohms / r0) / beta) - 273.15;

    public static double BetaOhms(double celsius, double r0 = 10_000, double beta = 3435, double t0Celsius = 25) =>
        r0 * Math.Exp(beta * (1 / (celsius + 273.15) - 1 / (t0Celsius + 273.15)));

    public static double HighSideOhms(double volts, double excitation, double fixedOhms) => fixedOhms * (excitation - volts) / volts;

    /// <summary>The same front end with the sensor on the high side.</summary>
    public static double NtcHighSideCelsius(double code, int bits = 12) =>
        BetaCelsius(HighSideOhms(code * 3.3 / (1 << bits), 3.3, 10_000));

    /// <summary>True temperature at a (fractional) code of the 12-bit, 3.3 V low-side NTC front end: V = code·Vref/4096.</summary>
    public static double NtcLowSideCelsius(double code, int bits = 12) =>
        BetaCelsius(LowSideOhms(code * 3.3 / (1 << bits), 3.3, 10_000));
}
