namespace ThermVerify.Sensors;

/// <summary>Every fit that a set of calibration points supports, each with its residuals in K.</summary>
internal sealed record SensorFitSummary(
    IReadOnlyList<TablePoint> Points,
    SensorFit<BetaThermistor> Beta,
    SensorFit<SteinhartHartThermistor>? SteinhartHart,
    SensorFit<SteinhartHartThermistor>? SteinhartHartWithSquaredTerm,
    string BetaPoints,
    RatedValues? Rated)
{
    /// <summary>
    /// Beta through two of the points, chosen as a datasheet states β: the 25 °C and 85 °C points when both were
    /// measured (β25/85, R0 = R25), else the 25 °C point and the point farthest from it, else the two outermost points;
    /// its residuals over all points show how far the Beta model is off. Steinhart–Hart closed form from 3 points or
    /// least squares from 4 or more; the 4-term form from 5 or more. R25 and β25/85 whenever the points allow
    /// (<see cref="RatedValues"/>).
    /// </summary>
    public static SensorFitSummary Fit(IReadOnlyList<TablePoint> points)
    {
        if (points.Count < 2) throw new SensorFitException($"fitting needs at least 2 points; {points.Count} given");
        var sorted = points.OrderBy(p => p.Celsius).ToList();
        // A fit is only known to hold where it was made: its valid range is the span of the points.
        var span = new TemperatureRange(sorted[0].Celsius, sorted[^1].Celsius);
        var (first, second, which) = BetaPair(sorted);
        var beta = SensorFitting.BetaFromTwoPoints(first, second, span);
        var betaOverAll = new SensorFit<BetaThermistor>(beta.Model, sorted.Select(p => BetaResidualKelvin(beta.Model, p)).ToList());
        var steinhartHart = sorted.Count switch
        {
            3 => SensorFitting.SteinhartHartFromThreePoints(sorted[0], sorted[1], sorted[2], span),
            > 3 => SensorFitting.SteinhartHartLeastSquares(sorted, validRange: span),
            _ => null,
        };
        var withSquared = sorted.Count >= 5 ? SensorFitting.SteinhartHartLeastSquares(sorted, withSquaredTerm: true, validRange: span) : null;
        var rated = steinhartHart is { } sh ? RatedValues.From(sorted, sh.Model, "Steinhart–Hart") : RatedValues.From(sorted, beta.Model, "Beta");
        return new SensorFitSummary(sorted, betaOverAll, steinhartHart, withSquared, which, rated);
    }

    private static (TablePoint First, TablePoint Second, string Which) BetaPair(IReadOnlyList<TablePoint> sorted)
    {
        if (RatedValues.PointAt(sorted, RatedValues.RatedCelsius) is not { } at25)
            return (sorted[0], sorted[^1], "the outermost points");
        if (RatedValues.PointAt(sorted, RatedValues.SecondCelsius) is { } at85)
            return (at25, at85, "the 25 °C and 85 °C points");
        var farthest = sorted.MaxBy(p => Math.Abs(p.Celsius - at25.Celsius));
        return (at25, farthest, "the 25 °C point and the point farthest from it");
    }

    /// <summary>
    /// The Beta equation's temperature at the point's resistance minus the point's own, from the equation itself: a
    /// point outside the span of the two that define β lies outside the model's valid range, yet its residual is
    /// exactly what shows how far the Beta model is off there.
    /// </summary>
    private static double BetaResidualKelvin(BetaThermistor model, TablePoint point)
    {
        var t0 = model.T0Celsius + Quantities.PhysicalConstants.ZeroCelsiusInKelvin;
        var kelvin = 1 / (1 / t0 + Math.Log(point.Ohms / model.R0Ohms) / model.Beta);
        return kelvin - Quantities.PhysicalConstants.ZeroCelsiusInKelvin - point.Celsius;
    }
}
