namespace ThermVerify.Quantities;

/// <summary>
/// A junction's leakage that doubles every N kelvin, as datasheets state it: I(T) = I(T0)·2^((T − T0)/N) (common
/// practice for silicon junctions, no source). Pin leakage, clamp diodes and the diode element's leakage law share it.
/// </summary>
internal static class DoublingLaw
{
    public static double At(double value, double givenAtCelsius, double doublingKelvin, double celsius) =>
        value * Math.Pow(2, (celsius - givenAtCelsius) / doublingKelvin);
}
