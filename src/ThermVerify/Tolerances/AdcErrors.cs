namespace ThermVerify.Tolerances;

/// <summary>
/// A converter's static errors in the terms of IEEE Std 1241: the code transition levels are the ideal ones
/// scaled by the gain error, shifted by the offset error and bent by the integral nonlinearity. The INL of a unit
/// is taken as a bow that is zero at both ends of the scale and peaks at mid-scale, 4·x·(1 − x) times its value
/// (the end-point fit makes INL vanish at the ends; the bow shape is a modelling choice, common practice, no source).
/// </summary>
internal readonly record struct AdcErrors(double OffsetLsb, double GainError, double InlLsb)
{
    public static AdcErrors None => default;

    /// <summary>The unrounded code the converter produces for an ideal code (input over one ideal LSB).</summary>
    public double Code(double idealCode, int bits)
    {
        var x = idealCode / (1 << bits);
        return idealCode * (1 + GainError) + OffsetLsb + InlLsb * 4 * x * (1 - x);
    }
}
