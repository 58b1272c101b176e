using ThermVerify.Sensors;

namespace ThermVerify.Tests.Sensors;

public class BetaThermistorTests
{
    [Fact]
    public void R0_is_returned_at_T0() =>
        // Definition of the B-parameter model: R(T0) = R0.
        Tolerance.AssertClose(10_000, TestSensors.Beta10k().ResistanceOhms(25), rel: 1e-15);

    [Fact]
    public void B25_85_recomputed_from_R25_and_R85_gives_beta_back()
    {
        // B-parameter definition (REFERENCES: B25/85 = ln(R25/R85)/(1/298.15 − 1/358.15)).
        var ntc = TestSensors.Beta10k();
        var b = Math.Log(ntc.ResistanceOhms(25) / ntc.ResistanceOhms(85)) / (1 / 298.15 - 1 / 358.15);
        Tolerance.AssertClose(3435, b, rel: 1e-12);
    }

    [Fact]
    public void Resistance_follows_the_exponential_form()
    {
        // R = R0·exp(β(1/T − 1/T0)), the same equation solved for R.
        var expected = 10_000 * Math.Exp(3435 * (1 / 273.15 - 1 / 298.15));
        Tolerance.AssertClose(expected, TestSensors.Beta10k().ResistanceOhms(0), rel: 1e-14);
    }

    [Fact]
    public void Two_point_fit_passes_through_both_points_and_recovers_beta()
    {
        var source = new BetaThermistor(4700, 3977, 25);
        var p1 = new TablePoint(25, source.ResistanceOhms(25));
        var p2 = new TablePoint(85, source.ResistanceOhms(85));
        var fit = SensorFitting.BetaFromTwoPoints(p1, p2);
        Tolerance.AssertClose(3977, fit.Model.Beta, rel: 1e-12);
        Assert.True(fit.MaxAbsResidualKelvin < 1e-9, $"max residual {fit.MaxAbsResidualKelvin} K");
        Assert.Equal(2, fit.ResidualsKelvin.Count);
        Assert.Contains("β25/85", fit.Model.Description);
        Tolerance.AssertClose(3977, BetaThermistor.FromTwoPoints(p1, p2).Beta, rel: 1e-12);
    }

    [Fact]
    public void Two_points_with_rising_resistance_are_refused()
    {
        var e = Assert.Throws<SensorFitException>(() => SensorFitting.BetaFromTwoPoints(new(25, 10_000), new(85, 12_000)));
        Assert.Contains("swapped", e.Message);
    }

    [Fact]
    public void Out_of_range_names_value_model_and_both_ranges()
    {
        var ntc = TestSensors.Beta10k();
        var t = Assert.Throws<SensorRangeException>(() => ntc.ResistanceOhms(160));
        Assert.Contains("160 °C", t.Message);
        Assert.Contains("Beta", t.Message);
        Assert.Contains("-55 °C to 155 °C", t.Message);
        var r = Assert.Throws<SensorRangeException>(() => ntc.TemperatureCelsius(10));
        Assert.Contains("10 Ω", r.Message);
        Assert.Contains(ntc.ResistanceOhms(155).ToString("G6", System.Globalization.CultureInfo.InvariantCulture), r.Message);
    }

    [Fact]
    public void Nonsense_parameters_are_refused()
    {
        Assert.Throws<ArgumentOutOfRangeException>(() => new BetaThermistor(-1, 3435));
        Assert.Throws<ArgumentOutOfRangeException>(() => new BetaThermistor(10_000, 0));
        Assert.Throws<ArgumentException>(() => new BetaThermistor(10_000, 3435, validRange: new(100, 0)));
    }
}
