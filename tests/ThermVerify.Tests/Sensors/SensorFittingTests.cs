using ThermVerify.Sensors;

namespace ThermVerify.Tests.Sensors;

public class SensorFittingTests
{
    [Fact]
    public void Three_point_fit_reproduces_its_points()
    {
        // Encyclopedia article "Steinhart–Hart equation", closed-form coefficients from three points.
        var sh = TestSensors.SteinhartHart();
        var fit = SensorFitting.SteinhartHartFromThreePoints(
            new(0, sh.ResistanceOhms(0)), new(25, sh.ResistanceOhms(25)), new(100, sh.ResistanceOhms(100)));
        Assert.True(fit.MaxAbsResidualKelvin <= 1e-9, $"max residual {fit.MaxAbsResidualKelvin:G3} K");
        Tolerance.AssertClose(1.1e-3, fit.Model.A, rel: 1e-8);
        Tolerance.AssertClose(2.4e-4, fit.Model.B, rel: 1e-8);
        Tolerance.AssertClose(1.0e-7, fit.Model.C, rel: 1e-6);
    }

    [Fact]
    public void Beta_points_fit_back_to_C_zero_B_one_over_beta()
    {
        // Steinhart & Hart (1968) / encyclopedia article: a Beta model is the SH form with C = 0, B = 1/β,
        // A = 1/T0 − ln(R0)/β.
        var beta = TestSensors.Beta10k();
        var fit = SensorFitting.SteinhartHartFromThreePoints(
            new(-20, beta.ResistanceOhms(-20)), new(25, beta.ResistanceOhms(25)), new(120, beta.ResistanceOhms(120)));
        Tolerance.AssertClose(1 / 3435.0, fit.Model.B, rel: 1e-9);
        Tolerance.AssertClose(1 / 298.15 - Math.Log(10_000) / 3435, fit.Model.A, rel: 1e-9);
        Assert.True(Math.Abs(fit.Model.C) < 1e-13, $"C = {fit.Model.C:G3}, against a typical C of 1e-7");
    }

    [Fact]
    public void Least_squares_on_exact_three_term_data_recovers_the_coefficients()
    {
        // Linear least squares on exact data must return the generating coefficients (cross-checked by the direct form above).
        var fit = SensorFitting.SteinhartHartLeastSquares(TestSensors.Rows(TestSensors.SteinhartHart(), 15));
        Tolerance.AssertClose(1.1e-3, fit.Model.A, rel: 1e-8);
        Tolerance.AssertClose(2.4e-4, fit.Model.B, rel: 1e-8);
        Tolerance.AssertClose(1.0e-7, fit.Model.C, rel: 1e-6);
        Assert.Equal(0, fit.Model.D);
        Assert.True(fit.MaxAbsResidualKelvin < 1e-8, $"max residual {fit.MaxAbsResidualKelvin:G3} K");
    }

    [Fact]
    public void Least_squares_with_squared_term_recovers_D()
    {
        var fit = SensorFitting.SteinhartHartLeastSquares(TestSensors.Rows(TestSensors.SteinhartHartFourTerm(), 15), withSquaredTerm: true);
        Tolerance.AssertClose(1.5e-6, fit.Model.D, rel: 1e-5);
        Tolerance.AssertClose(2.3e-4, fit.Model.B, rel: 1e-6);
        Assert.True(fit.MaxAbsResidualKelvin < 1e-8, $"max residual {fit.MaxAbsResidualKelvin:G3} K");
    }

    [Fact]
    public void Least_squares_matches_MathNet_linear_combination_fit()
    {
        // MathNet.Numerics Fit.LinearCombination as an independent reference on data rounded to whole ohms, which at
        // 125 °C (about 300 Ω) is up to 0.2 % and so leaves residuals of a few hundredths of a kelvin.
        var rows = TestSensors.Rows(TestSensors.SteinhartHart(), 10).Select(p => new TablePoint(p.Celsius, Math.Round(p.Ohms))).ToArray();
        var fit = SensorFitting.SteinhartHartLeastSquares(rows);
        var reference = MathNet.Numerics.Fit.LinearCombination(
            [.. rows.Select(p => Math.Log(p.Ohms))], [.. rows.Select(p => 1 / (p.Celsius + 273.15))],
            x => 1, x => x, x => x * x * x);
        Tolerance.AssertClose(reference[0], fit.Model.A, rel: 1e-7);
        Tolerance.AssertClose(reference[1], fit.Model.B, rel: 1e-7);
        Tolerance.AssertClose(reference[2], fit.Model.C, rel: 1e-5);
        Assert.Equal(rows.Length, fit.ResidualsKelvin.Count);
        Assert.True(fit.MaxAbsResidualKelvin > 0 && fit.MaxAbsResidualKelvin < 0.05, $"max residual {fit.MaxAbsResidualKelvin:G3} K");
    }

    [Fact]
    public void Bad_point_sets_are_refused_with_the_reason()
    {
        var ok = new TablePoint[] { new(0, 30_000), new(25, 10_000), new(50, 3_600), new(75, 1_500) };
        Assert.Contains("at least 4", Assert.Throws<SensorFitException>(() => SensorFitting.SteinhartHartLeastSquares(ok[..3])).Message);
        Assert.Contains("same temperature 25",
            Assert.Throws<SensorFitException>(() => SensorFitting.SteinhartHartFromThreePoints(ok[0], ok[1], new(25, 9_000))).Message);
        Assert.Contains("Point 2",
            Assert.Throws<SensorFitException>(() => SensorFitting.SteinhartHartFromThreePoints(ok[0], new(25, -1), ok[2])).Message);
        Assert.Contains("Point 3",
            Assert.Throws<SensorFitException>(() => SensorFitting.SteinhartHartLeastSquares([ok[0], ok[1], new(50, 0), ok[3]])).Message);
        Assert.Contains("widen the range",
            Assert.Throws<SensorFitException>(() => SensorFitting.SteinhartHartLeastSquares(ok, validRange: new(10, 60))).Message);
        Assert.IsAssignableFrom<ArgumentException>(new SensorFitException("x"));
    }
}

/// <summary>`fit` reports what a thermistor is sold by, R25 and β25/85, whenever the points allow it.</summary>
public class RatedValueFitTests
{
    private static readonly BetaThermistor Rated3435 = new(10_000, 3435, 25);

    private static TablePoint At(ISensorModel model, double celsius) => new(celsius, model.ResistanceOhms(celsius));

    [Fact]
    public void Points_at_25_and_85_degC_give_beta_25_85_directly()
    {
        // B25/85 = ln(R25/R85)/(1/298.15 − 1/358.15) (REFERENCES: Beta model); a Beta-model sensor gives its own β back.
        var summary = SensorFitSummary.Fit([At(Rated3435, 0), At(Rated3435, 25), At(Rated3435, 50), At(Rated3435, 85)]);
        Assert.Equal("the 25 °C and 85 °C points", summary.BetaPoints);
        Tolerance.AssertClose(3435, summary.Beta.Model.Beta, rel: 1e-12);
        Tolerance.AssertClose(10_000, summary.Beta.Model.R0Ohms, rel: 1e-12);
        Assert.NotNull(summary.Rated);
        Tolerance.AssertClose(3435, summary.Rated!.Beta2585Kelvin, rel: 1e-12);
        Tolerance.AssertClose(10_000, summary.Rated.R25Ohms, rel: 1e-12);
    }

    [Fact]
    public void Without_an_85_degC_point_beta_runs_from_25_degC_to_the_farthest_point_and_no_rated_values_are_invented()
    {
        var summary = SensorFitSummary.Fit([At(Rated3435, -20), At(Rated3435, 25), At(Rated3435, 50)]);
        Assert.Equal("the 25 °C point and the point farthest from it", summary.BetaPoints);
        Assert.Equal(25, summary.Beta.Model.T0Celsius);
        Assert.Null(summary.Rated); // 85 °C lies outside the points: not extrapolated
    }

    [Fact]
    public void Points_spanning_25_to_85_degC_give_rated_values_from_the_steinhart_hart_fit()
    {
        // A Steinhart–Hart sensor (coefficients of the test sensor) measured at 0, 40 and 100 °C: the three-point fit is
        // the sensor itself, so R25 and β25/85 are the sensor's own, computed here from its resistance at 25 and 85 °C.
        var sensor = TestSensors.SteinhartHart();
        var summary = SensorFitSummary.Fit([At(sensor, 0), At(sensor, 40), At(sensor, 100)]);
        var r25 = sensor.ResistanceOhms(25);
        var r85 = sensor.ResistanceOhms(85);
        var beta = Math.Log(r25 / r85) / (1 / 298.15 - 1 / 358.15);
        Assert.Equal("the outermost points", summary.BetaPoints);
        Assert.NotNull(summary.Rated);
        Tolerance.AssertClose(r25, summary.Rated!.R25Ohms, rel: 1e-9);
        Tolerance.AssertClose(beta, summary.Rated.Beta2585Kelvin, rel: 1e-9);
    }

    [Fact]
    public void A_point_outside_the_beta_pair_still_gets_its_residual()
    {
        // β from 25/85 °C; the 0 °C point lies outside that pair's span yet its residual is what shows the model's error.
        var sensor = TestSensors.SteinhartHart();
        var summary = SensorFitSummary.Fit([At(sensor, 0), At(sensor, 25), At(sensor, 85)]);
        Assert.All(summary.Beta.ResidualsKelvin, r => Assert.True(double.IsFinite(r)));
        Assert.Equal(0, summary.Beta.ResidualsKelvin[1], 9);
        Assert.Equal(0, summary.Beta.ResidualsKelvin[2], 9);
        Assert.NotEqual(0, summary.Beta.ResidualsKelvin[0], 3);
    }
}
