using System.Globalization;
using System.Text.RegularExpressions;

namespace ThermVerify.Design.Subcircuits;

/// <summary>
/// SPICE's numbers: a decimal number with an optional exponent, an optional scale factor (T G MEG K M MIL U N P F A,
/// case-insensitive, so M is milli as SPICE reads it) and letters SPICE ignores ("10pF", "1kOhm"). Re-emitted as a
/// plain round-trip decimal, so what the engine reads is exactly the value thermverify read.
/// </summary>
internal static partial class SpiceNumberText
{
    public static bool TryParse(string text, out double value)
    {
        value = 0;
        var m = Number().Match(text);
        if (!m.Success) return false;
        if (!double.TryParse(m.Groups["number"].Value, NumberStyles.Float, CultureInfo.InvariantCulture, out var number)) return false;
        var scale = Scale(m.Groups["suffix"].Value);
        value = number * scale;
        return double.IsFinite(value);
    }

    public static string Format(double value) => value.ToString("R", CultureInfo.InvariantCulture);

    private static double Scale(string suffix)
    {
        var s = suffix.ToLowerInvariant();
        if (s.StartsWith("meg", StringComparison.Ordinal)) return 1e6;
        if (s.StartsWith("mil", StringComparison.Ordinal)) return 25.4e-6;
        if (s.Length == 0) return 1;
        return s[0] switch
        {
            't' => 1e12,
            'g' => 1e9,
            'k' => 1e3,
            'm' => 1e-3,
            'u' => 1e-6,
            'n' => 1e-9,
            'p' => 1e-12,
            'f' => 1e-15,
            'a' => 1e-18,
            _ => 1, // letters SPICE ignores, e.g. "V" or "Ohm"
        };
    }

    [GeneratedRegex(@"^(?<number>[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d{1,3})?)(?<suffix>[A-Za-z]*)$")]
    private static partial Regex Number();
}
