using System.Globalization;

namespace ThermVerify.Reporting.Text;

/// <summary>How the terminal summaries and CSV files print numbers: invariant culture, one format per kind of figure.</summary>
internal static class TextNumbers
{
    /// <summary>A temperature error or spread in K with three decimals; "unreadable" for a code no sensor produces.</summary>
    public static string Kelvin(double kelvin) => double.IsFinite(kelvin) ? kelvin.ToString("0.000", CultureInfo.InvariantCulture) : "unreadable";

    /// <summary>A number in a format, or <paramref name="missing"/> when it is not finite.</summary>
    public static string Format(double value, string format, string missing = "-") =>
        double.IsFinite(value) ? value.ToString(format, CultureInfo.InvariantCulture) : missing;

    /// <summary>Round-trip form for CSV: every digit a later tool needs.</summary>
    public static string RoundTrip(double value) => value.ToString("R", CultureInfo.InvariantCulture);

    public static string Integer(int value) => value.ToString(CultureInfo.InvariantCulture);

    public static string Invariant(FormattableString text) => FormattableString.Invariant(text);
}
