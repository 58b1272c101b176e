namespace ThermVerify.Quantities;

/// <summary>
/// Letters of the RKM code (IEC 60062): the letter stands in for the decimal point and gives the multiplier,
/// e.g. 4k7 = 4.7 k, 2R2 = 2.2, R47 = 0.47, 4n7 = 4.7 n, 1u5 = 1.5 µ, 1M0 = 1.0 M.
/// R means ohms with multiplier 1. Both K and k are kilo inside a code (IEC 60062 writes K).
/// </summary>
internal static class RkmCode
{
    /// <summary>
    /// IEC 60062 codes mark resistors (R, K/k, M, G, T and the SI letters) and capacitors (p, n, µ/u, m); a code is
    /// accepted only for those two kinds, so "0K5" as a temperature difference is refused, never read as 500 K.
    /// K is a resistor letter only (a capacitor code never uses it).
    /// </summary>
    public static bool Marks(UnitKind kind, char letter) => kind switch
    {
        UnitKind.Ohm => true,
        UnitKind.Farad => letter is not ('K' or 'R'),
        _ => false,
    };

    public static bool IsLetter(char c) => c == 'R' || c == 'K' || SiPrefixes.TryGetExponent(c, out _);

    public static int Exponent(char letter) => letter switch
    {
        'R' => 0,
        'K' => 3,
        _ => SiPrefixes.TryGetExponent(letter, out var e) ? e : throw new ArgumentOutOfRangeException(nameof(letter)),
    };
}
