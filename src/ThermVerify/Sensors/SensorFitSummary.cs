namespace ThermVerify.Sensors;

/// <summary>Every fit that a set of calibration points supports, each with its residuals in K.</summary>
internal sealed record SensorFitSummary(
    IReadOnlyList<TablePoint> Points,
    SensorFit<BetaThermistor> Beta,
    SensorFit<SteinhartHartThermistor>? SteinhartHart,
    SensorFit<SteinhartHartThermistor>? SteinhartHartWithSquaredTerm)
{
    /// <summary>
    /// Beta from the two outermost points (its residuals over all points show how far the Beta model is off);
    /// Steinhart–Hart closed form from 3 points or least squares from 4 or more; the 4-term form from 5 or more.
    /// </summary>
    public static SensorFitSummary Fit(IReadOnlyList<TablePoint> points)
    {
        if (points.Count < 2) throw new SensorFitException($"fitting needs at least 2 points; {points.Count} given");
        var sorted = points.OrderBy(p => p.Celsius).ToList();
        // A fit is only known to hold where it was made: its valid range is the span of the points.
        var span = new TemperatureRange(sorted[0].Celsius, sorted[^1].Celsius);
        var beta = SensorFitting.BetaFromTwoPoints(sorted[0], sorted[^1], span);
        var betaOverAll = new SensorFit<BetaThermistor>(beta.Model, sorted.Select(p => ResidualKelvin(beta.Model, p)).ToList());
        var steinhartHart = sorted.Count switch
        {
            3 => SensorFitting.SteinhartHartFromThreePoints(sorted[0], sorted[1], sorted[2], span),
            > 3 => SensorFitting.SteinhartHartLeastSquares(sorted, validRange: span),
            _ => null,
        };
        var withSquared = sorted.Count >= 5 ? SensorFitting.SteinhartHartLeastSquares(sorted, withSquaredTerm: true, validRange: span) : null;
        return new SensorFitSummary(sorted, betaOverAll, steinhartHart, withSquared);
    }

    private static double ResidualKelvin(ISensorModel model, TablePoint point) =>
        model.TemperatureCelsius(point.Ohms) - point.Celsius;
}
