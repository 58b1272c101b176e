using static ThermVerify.Quantities.PhysicalConstants;

namespace ThermVerify.Sensors;

/// <summary>
/// The figures an NTC is sold by: R25 and β25/85 = ln(R25/R85)/(1/298.15 K − 1/358.15 K) (IEC 60539-1 defines the
/// B value between two stated temperatures; 25 °C and 85 °C is the common pair, common practice). <see cref="Source"/>
/// says where they come from: the points themselves, or a fit read inside the points' span.
/// </summary>
internal sealed record RatedValues(double R25Ohms, double Beta2585Kelvin, string Source)
{
    public const double RatedCelsius = 25;
    public const double SecondCelsius = 85;

    /// <summary>β between two temperatures from the resistances there.</summary>
    public static double BetaBetween(double celsius1, double ohms1, double celsius2, double ohms2) =>
        Math.Log(ohms1 / ohms2) / (1 / (celsius1 + ZeroCelsiusInKelvin) - 1 / (celsius2 + ZeroCelsiusInKelvin));

    /// <summary>
    /// From the points at 25 °C and 85 °C when both were measured; else from the model read at both temperatures when
    /// both lie within the points' span (never extrapolated); else null.
    /// </summary>
    public static RatedValues? From(IReadOnlyList<TablePoint> sorted, ISensorModel model, string modelName)
    {
        var r25 = PointAt(sorted, RatedCelsius);
        var r85 = PointAt(sorted, SecondCelsius);
        if (r25 is { } a && r85 is { } b)
            return new RatedValues(a.Ohms, BetaBetween(RatedCelsius, a.Ohms, SecondCelsius, b.Ohms), "the 25 °C and 85 °C points");
        if (sorted[0].Celsius > RatedCelsius || sorted[^1].Celsius < SecondCelsius) return null;
        var at25 = model.ResistanceOhms(RatedCelsius);
        var at85 = model.ResistanceOhms(SecondCelsius);
        return new RatedValues(at25, BetaBetween(RatedCelsius, at25, SecondCelsius, at85), $"the {modelName} fit, read inside the points' span");
    }

    /// <summary>A point measured at this temperature (to 1 mK).</summary>
    public static TablePoint? PointAt(IReadOnlyList<TablePoint> points, double celsius) =>
        points.Where(p => Math.Abs(p.Celsius - celsius) <= 1e-3).Select(p => (TablePoint?)p).FirstOrDefault();
}
