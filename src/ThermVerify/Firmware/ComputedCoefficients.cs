using ThermVerify.Sensors;
using static ThermVerify.Quantities.PhysicalConstants;

namespace ThermVerify.Firmware;

/// <summary>
/// Coefficients for firmware that computes the temperature instead of looking it up, each with its worst error
/// against the sensor model over the table range (sampled every 0.1 K or finer, ends included).
/// </summary>
public sealed record ComputedCoefficients(
    SteinhartHartThermistor ThreePoint, double ThreePointMaxErrorKelvin,
    SteinhartHartThermistor LeastSquares, double LeastSquaresMaxErrorKelvin,
    BetaThermistor Beta, double BetaMaxErrorKelvin)
{
    /// <summary>Number of evenly spaced points the least-squares fit uses.</summary>
    public const int LeastSquaresPoints = 41;

    /// <summary>
    /// Fits through the sensor model: Steinhart–Hart through the range's ends and middle, Steinhart–Hart by least
    /// squares over <see cref="LeastSquaresPoints"/> points, and β between 25 °C (or the nearest range end) and the
    /// farther range end. Only NTC sensors (resistance falling with temperature) have these forms.
    /// </summary>
    public static ComputedCoefficients Fit(FirmwareModel model)
    {
        model.Validated();
        var (lo, hi) = (model.Range.MinCelsius, model.Range.MaxCelsius);
        var sensor = model.Sensor;
        if (!(sensor.ResistanceOhms(hi) < sensor.ResistanceOhms(lo)))
            throw new FirmwareInputException($"Steinhart–Hart and β describe NTC thermistors; {sensor.Description} rises with temperature. Use the lookup table for it.");
        TablePoint At(double t) => new(t, sensor.ResistanceOhms(t));
        // A fitted curve passes a hair off its end points, so a fit whose valid range ended exactly there would
        // refuse its own points; a few kelvin of room avoids that without letting firmware extrapolate far.
        var fitRange = new TemperatureRange(Math.Max(lo - 5, -273), hi + 5);

        var three = SensorFitting.SteinhartHartFromThreePoints(At(lo), At((lo + hi) / 2), At(hi), fitRange).Model;
        var grid = Enumerable.Range(0, LeastSquaresPoints).Select(i => lo + (hi - lo) * i / (LeastSquaresPoints - 1)).Select(At).ToArray();
        var squares = SensorFitting.SteinhartHartLeastSquares(grid, validRange: fitRange).Model;
        var t0 = Math.Clamp(25, lo, hi);
        var t1 = hi - t0 >= t0 - lo ? hi : lo;
        var beta = SensorFitting.BetaFromTwoPoints(At(t0), At(t1), fitRange).Model;

        return new ComputedCoefficients(
            three, MaxError(model, r => SteinhartHartCelsius(three, r)),
            squares, MaxError(model, r => SteinhartHartCelsius(squares, r)),
            beta, MaxError(model, r => BetaCelsius(beta, r)));
    }

    /// <summary>The Steinhart–Hart form evaluated directly, as firmware would, with no range check.</summary>
    public static double SteinhartHartCelsius(SteinhartHartThermistor sh, double ohms)
    {
        var x = Math.Log(ohms);
        return ToCelsius(1 / (sh.A + x * (sh.B + x * (sh.D + x * sh.C))));
    }

    /// <summary>The β form evaluated directly: 1/T = 1/T0 + ln(R/R0)/β.</summary>
    public static double BetaCelsius(BetaThermistor b, double ohms) =>
        ToCelsius(1 / (1 / ToKelvin(b.T0Celsius) + Math.Log(ohms / b.R0Ohms) / b.Beta));

    private static double MaxError(FirmwareModel model, Func<double, double> celsiusOfOhms)
    {
        var (lo, hi) = (model.Range.MinCelsius, model.Range.MaxCelsius);
        var steps = Math.Max(200, (int)Math.Ceiling((hi - lo) * 10));
        var worst = 0.0;
        for (var i = 0; i <= steps; i++)
        {
            var t = lo + (hi - lo) * i / steps;
            worst = Math.Max(worst, Math.Abs(celsiusOfOhms(model.Sensor.ResistanceOhms(t)) - t));
        }
        return worst;
    }
}
