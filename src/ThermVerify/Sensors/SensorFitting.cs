using System.Globalization;
using MathNet.Numerics.LinearAlgebra;
using static ThermVerify.Quantities.PhysicalConstants;

namespace ThermVerify.Sensors;

/// <summary>Fits NTC models to measured (temperature, resistance) points.</summary>
/// <remarks>
/// When no valid range is given, a fitted model gets the model's default range widened to cover the points;
/// a given range must contain every point, since a fit outside its own data is extrapolation.
/// </remarks>
internal static class SensorFitting
{
    /// <summary>"Beta from 2 points": β = ln(R1/R2)/(1/T1 − 1/T2), R0 and T0 from <paramref name="p1"/>.</summary>
    public static SensorFit<BetaThermistor> BetaFromTwoPoints(TablePoint p1, TablePoint p2, TemperatureRange? validRange = null)
    {
        TablePoint[] points = [p1, p2];
        CheckPoints(points, 2, "a Beta fit");
        var beta = BetaThermistor.BetaBetween(p1, p2);
        if (!(beta > 0))
            throw new SensorFitException(Invariant(
                $"The two points ({p1.Celsius} °C, {p1.Ohms} Ω) and ({p2.Celsius} °C, {p2.Ohms} Ω) give β = {beta:G6} K; an NTC needs the resistance to fall as temperature rises: check that the points are not swapped."), nameof(p2));
        var model = new BetaThermistor(p1.Ohms, beta, p1.Celsius, RangeFor(points, BetaThermistor.DefaultValidRange, validRange),
            Math.Min(p1.Celsius, p2.Celsius), Math.Max(p1.Celsius, p2.Celsius));
        return WithResiduals(model, points);
    }

    /// <summary>Steinhart–Hart (3-term) through exactly three points, closed form.</summary>
    /// <remarks>Encyclopedia article "Steinhart–Hart equation", section on the coefficients from three points.</remarks>
    public static SensorFit<SteinhartHartThermistor> SteinhartHartFromThreePoints(
        TablePoint p1, TablePoint p2, TablePoint p3, TemperatureRange? validRange = null)
    {
        TablePoint[] points = [p1, p2, p3];
        CheckPoints(points, 3, "a three-point Steinhart–Hart fit");
        var (l1, l2, l3) = (Math.Log(p1.Ohms), Math.Log(p2.Ohms), Math.Log(p3.Ohms));
        var (y1, y2, y3) = (InverseKelvin(p1), InverseKelvin(p2), InverseKelvin(p3));
        var g2 = (y2 - y1) / (l2 - l1);
        var g3 = (y3 - y1) / (l3 - l1);
        var c = (g3 - g2) / (l3 - l2) / (l1 + l2 + l3);
        var b = g2 - c * (l1 * l1 + l1 * l2 + l2 * l2);
        var a = y1 - (b + l1 * l1 * c) * l1;
        return WithResiduals(Build(points, a, b, c, 0, validRange), points);
    }

    /// <summary>
    /// Least-squares Steinhart–Hart in 1/T through four or more points (QR on column-scaled regressors);
    /// <paramref name="withSquaredTerm"/> adds D (ln R)², which needs at least five points to leave a residual.
    /// </summary>
    public static SensorFit<SteinhartHartThermistor> SteinhartHartLeastSquares(
        IReadOnlyList<TablePoint> points, bool withSquaredTerm = false, TemperatureRange? validRange = null)
    {
        ArgumentNullException.ThrowIfNull(points);
        CheckPoints(points, 4, "a least-squares Steinhart–Hart fit");
        var columns = withSquaredTerm ? 4 : 3;
        var design = Matrix<double>.Build.Dense(points.Count, columns, (i, j) =>
        {
            var x = Math.Log(points[i].Ohms);
            return j switch { 0 => 1, 1 => x, 2 => x * x * x, _ => x * x };
        });
        // Scaling the columns to unit size keeps 1, ln R and (ln R)³ (about 1, 10 and 1000) comparable for QR.
        var scale = Vector<double>.Build.Dense(columns, j => design.Column(j).AbsoluteMaximum());
        var scaled = Matrix<double>.Build.Dense(points.Count, columns, (i, j) => design[i, j] / scale[j]);
        var target = Vector<double>.Build.Dense(points.Count, i => InverseKelvin(points[i]));
        var solution = scaled.QR().Solve(target).PointwiseDivide(scale);
        var d = withSquaredTerm ? solution[3] : 0;
        return WithResiduals(Build(points, solution[0], solution[1], solution[2], d, validRange), points);
    }

    private static SteinhartHartThermistor Build(IReadOnlyList<TablePoint> points, double a, double b, double c, double d, TemperatureRange? validRange)
    {
        var range = RangeFor(points, SteinhartHartThermistor.DefaultValidRange, validRange);
        try
        {
            return new SteinhartHartThermistor(a, b, c, d, range);
        }
        catch (ArgumentException e)
        {
            throw new SensorFitException("The points give a Steinhart–Hart curve that is not usable: " + e.Message +
                " Check the points for a typo, or fit over a narrower valid range.");
        }
    }

    private static SensorFit<TModel> WithResiduals<TModel>(TModel model, IReadOnlyList<TablePoint> points) where TModel : ISensorModel =>
        new(model, [.. points.Select(p => model.TemperatureCelsius(p.Ohms) - p.Celsius)]);

    private static double InverseKelvin(TablePoint p) => 1 / ToKelvin(p.Celsius);

    private static TemperatureRange RangeFor(IReadOnlyList<TablePoint> points, TemperatureRange defaultRange, TemperatureRange? given)
    {
        var lo = points.Min(p => p.Celsius);
        var hi = points.Max(p => p.Celsius);
        if (given is null)
            return new TemperatureRange(Math.Min(lo, defaultRange.MinCelsius), Math.Max(hi, defaultRange.MaxCelsius));
        if (!given.Value.Contains(lo) || !given.Value.Contains(hi))
            throw new SensorFitException(Invariant(
                $"The fit points span {lo} °C to {hi} °C but the requested valid range is {given.Value}; widen the range to include every point."));
        return given.Value;
    }

    private static void CheckPoints(IReadOnlyList<TablePoint> points, int minimum, string purpose)
    {
        if (points.Count < minimum)
            throw new SensorFitException(Invariant($"{purpose} needs at least {minimum} points; got {points.Count}."), nameof(points));
        for (var i = 0; i < points.Count; i++)
        {
            var p = points[i];
            if (!double.IsFinite(p.Celsius) || p.Celsius <= -ZeroCelsiusInKelvin)
                throw new SensorFitException(Invariant($"Point {i + 1}: temperature {p.Celsius} °C is not a finite temperature above −273.15 °C."), nameof(points));
            if (!double.IsFinite(p.Ohms) || p.Ohms <= 0)
                throw new SensorFitException(Invariant($"Point {i + 1}: resistance {p.Ohms} Ω at {p.Celsius} °C must be positive and finite."), nameof(points));
            for (var j = 0; j < i; j++)
            {
                if (points[j].Celsius == p.Celsius)
                    throw new SensorFitException(Invariant(
                        $"Points {j + 1} and {i + 1} have the same temperature {p.Celsius} °C; {purpose} needs distinct temperatures: remove or merge one."), nameof(points));
                if (points[j].Ohms == p.Ohms)
                    throw new SensorFitException(Invariant(
                        $"Points {j + 1} and {i + 1} have the same resistance {p.Ohms} Ω at different temperatures; an NTC cannot do that: check for a typo."), nameof(points));
            }
        }
    }

    private static string Invariant(FormattableString s) => s.ToString(CultureInfo.InvariantCulture);
}
