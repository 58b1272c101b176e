namespace ThermVerify.Quantities;

/// <summary>
/// SI prefixes accepted in design files (SI Brochure, 9th ed., table 7), as powers of ten.
/// Case matters: M is mega and m is milli. SPICE's "meg" is not accepted: our files are not SPICE decks.
/// </summary>
internal static class SiPrefixes
{
    private static readonly Dictionary<char, int> Exponents = new()
    {
        ['f'] = -15,
        ['p'] = -12,
        ['n'] = -9,
        ['u'] = -6,      // ASCII stand-in for micro, common practice
        ['\u00B5'] = -6, // µ micro sign
        ['\u03BC'] = -6, // μ Greek small mu
        ['m'] = -3,
        ['k'] = 3,
        ['M'] = 6,
        ['G'] = 9,
        ['T'] = 12,
    };

    public static bool TryGetExponent(char symbol, out int exponent) => Exponents.TryGetValue(symbol, out exponent);

    /// <summary>The symbol printed for a power of ten that is a multiple of 3 in −15..12.</summary>
    public static string Symbol(int exponent) => exponent switch
    {
        -15 => "f",
        -12 => "p",
        -9 => "n",
        -6 => "\u00B5",
        -3 => "m",
        0 => "",
        3 => "k",
        6 => "M",
        9 => "G",
        12 => "T",
        _ => throw new ArgumentOutOfRangeException(nameof(exponent), exponent, "no SI prefix for this power of ten"),
    };

    public const int SmallestExponent = -15;
    public const int LargestExponent = 12;
}
