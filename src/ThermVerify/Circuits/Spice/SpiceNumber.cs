using System.Globalization;

namespace ThermVerify.Circuits.Spice;

/// <summary>
/// Numbers for a SPICE deck: shortest round-trip digits in plain exponent form ("4.7e-09"), never a scale suffix,
/// because SPICE reads "1M" as milli and only "1meg" as 10⁶, a classic trap for anyone editing the deck by hand.
/// </summary>
internal static class SpiceNumber
{
    public static string Format(double value)
    {
        if (!double.IsFinite(value))
            throw new ArgumentOutOfRangeException(nameof(value), value, "A SPICE deck cannot carry a non-finite number.");
        return value.ToString("R", CultureInfo.InvariantCulture).Replace("E", "e", StringComparison.Ordinal);
    }
}
