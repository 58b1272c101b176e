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
