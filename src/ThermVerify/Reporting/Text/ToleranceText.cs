using System.Globalization;
using ThermVerify.Quantities;
using ThermVerify.Tolerances;

namespace ThermVerify.Reporting.Text;

/// <summary>Tolerances in the words and units a designer writes them in: fractions in %, tempcos in ppm/K, volts and amperes with their SI prefix.</summary>
internal static class ToleranceText
{
    public static string HalfWidth(ToleranceParameter p) => p.Unit switch
    {
        "" => FormattableString.Invariant($"{100 * p.HalfWidth:G3} %"),
        "1/K" => FormattableString.Invariant($"{1e6 * p.HalfWidth:G3} ppm/K"),
        _ => ReportFormat.KindOf(p.Unit) is { } kind
            ? EngineeringFormat.Format(p.HalfWidth, kind, 3)
            : FormattableString.Invariant($"{p.HalfWidth:G3} {p.Unit}"),
    };

    /// <summary>A table of the tolerances: key, ±half-width, distribution and standard deviation.</summary>
    public static ReportTable Table(IReadOnlyList<ToleranceParameter> parameters) => new(
        ["tolerance", "±", "distribution", "σ"],
        [.. parameters.Select(p => (IReadOnlyList<string>)[p.Key, HalfWidth(p), p.Distribution.ToString(),
            HalfWidth(p with { HalfWidth = p.StandardDeviation })])]);

    public static string Kelvin(double kelvin) =>
        double.IsFinite(kelvin) ? kelvin.ToString("+0.000;-0.000;0.000", CultureInfo.InvariantCulture) : "unreadable";
}
