namespace ThermVerify.Tests.Firmware;

/// <summary>
/// IEC 60751's platinum resistance worked by hand, independent of the library's sensor model: for t ≥ 0 °C the
/// Callendar–Van Dusen equation R = R0·(1 + A·t + B·t²), A = 3.9083e-3, B = −5.775e-7, and its inverse, the root of
/// that quadratic (from the standard's coefficients, from memory).
/// </summary>
internal static class Iec60751ByHand
{
    private const double A = 3.9083e-3, B = -5.775e-7;

    /// <summary>The temperature (°C, at or above 0 °C) of a platinum sensor of <paramref name="r0"/> at 0 °C reading <paramref name="ohms"/>.</summary>
    public static double Celsius(double ohms, double r0 = 100) => (-A + Math.Sqrt(A * A - 4 * B * (1 - ohms / r0))) / (2 * B);
}
