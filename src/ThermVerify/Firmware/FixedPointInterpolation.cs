namespace ThermVerify.Firmware;

/// <summary>
/// The integer arithmetic of the reference C routine, operation for operation (C99 and C# both truncate integer
/// division toward zero), so the library can predict the firmware's output exactly.
/// </summary>
internal static class FixedPointInterpolation
{
    /// <summary>
    /// v0 + round((v1 − v0)(code − c0) / (c1 − c0)), rounding half away from zero, for c0 &lt; c1 and c0 ≤ code ≤ c1.
    /// All operands are 32-bit; the table builder guarantees |v1 − v0|·(c1 − c0) + (c1 − c0)/2 fits.
    /// </summary>
    public static int Interpolate(int c0, int v0, int c1, int v1, int code)
    {
        int span = c1 - c0;
        int numerator = (v1 - v0) * (code - c0);
        int half = span / 2;
        return v0 + (numerator >= 0 ? (numerator + half) / span : -((-numerator + half) / span));
    }

    /// <summary>True when a segment's product cannot overflow a 32-bit signed integer.</summary>
    public static bool FitsInt32(int c0, int v0, int c1, int v1) =>
        (long)Math.Abs((long)v1 - v0) * (c1 - c0) + (c1 - c0) / 2 <= int.MaxValue;
}
