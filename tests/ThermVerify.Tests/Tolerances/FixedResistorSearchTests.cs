using ThermVerify.Components;
using ThermVerify.Tests.Check;
using ThermVerify.Tolerances;

namespace ThermVerify.Tests.Tolerances;

public class FixedResistorSearchTests
{
    /// <summary>
    /// The divider's slope |dV/dT| = V·R_f/(R_s + R_f)²·|dR_s/dT| is largest at R_f = R_s (common practice, no source;
    /// d/dR_f of R_f/(R_s + R_f)² vanishes there). It is symmetric in ln(R_f/R_s), so among series values the best is
    /// the one nearest R_s by ratio. At 25 °C the 10 kΩ NTC is 10 kΩ, an E24 value.
    /// </summary>
    [Fact]
    public void SlopeAtTheMiddleIsBestWithTheSensorResistanceThere()
    {
        var design = TestDesign.Make(("check.range", "\"0 degC .. 50 degC\""));
        var ranked = FixedResistorSearch.Run(design, new FixedResistorSearchOptions { Series = ESeries.E24, Objective = FixedResistorObjective.SlopeAt });
        Assert.Equal(10e3, ranked[0].Ohms, 6);
    }

    /// <summary>
    /// The same where R_s at the middle (20 °C: 10 kΩ·e^(3435·(1/293.15 − 1/298.15)) ≈ 12.17 kΩ) is not a series
    /// value: the winner is the series value nearest it by ratio, and no candidate has a steeper slope than the
    /// continuous optimum R_f = R_s.
    /// </summary>
    [Fact]
    public void SlopeOptimumIsTheSeriesValueNearestTheSensorResistance()
    {
        var design = TestDesign.Make(("check.range", "\"0 degC .. 40 degC\""));
        var rs = 10e3 * Math.Exp(3435 * (1 / 293.15 - 1 / 298.15));
        var ranked = FixedResistorSearch.Run(design, new FixedResistorSearchOptions { Series = ESeries.E96, Objective = FixedResistorObjective.SlopeAt });
        Assert.Equal(ESeries.E96.Nearest(rs), ranked[0].Ohms, 6);
        var optimum = FixedResistorSearch.Run(design, new FixedResistorSearchOptions
        {
            Series = ESeries.E96, Objective = FixedResistorObjective.SlopeAt, MinimumOhms = ranked[0].Ohms, MaximumOhms = ranked[0].Ohms,
        });
        var slopeAtRs = 3.3 * rs / Math.Pow(2 * rs, 2) * Math.Abs(design.Sensor.Build().SlopeOhmsPerKelvin(20));
        Assert.True(optimum[0].SlopeVoltsPerKelvin <= slopeAtRs * (1 + 1e-12));
        Tolerance.AssertClose(slopeAtRs, optimum[0].SlopeVoltsPerKelvin, 1e-3);
    }

    /// <summary>Candidates are the series values between the bounds (IEC 60063 E12: 1.0 1.2 1.5 1.8 2.2 ...).</summary>
    [Fact]
    public void CandidatesAreTheSeriesValuesInRange()
    {
        Assert.Equal([1.2e3, 1.5e3, 1.8e3, 2.2e3], FixedResistorSearch.Candidates(ESeries.E12, 1.1e3, 2.2e3).Select(v => Math.Round(v, 6)));
    }

    /// <summary>The error objective runs the check for each candidate and ranks by the worst reported error, smallest first.</summary>
    [Fact]
    public void ErrorObjectiveRanksByWorstError()
    {
        var design = TestDesign.Make(("check.range", "\"0 degC .. 50 degC\""), ("sensor.dissipation_constant", "\"2 mW/K\""));
        var ranked = FixedResistorSearch.Run(design, new FixedResistorSearchOptions { Series = ESeries.E6, Threads = 2 });
        Assert.True(ranked.Count >= 3);
        for (var i = 1; i < ranked.Count; i++)
            Assert.True(Math.Abs(ranked[i - 1].WorstErrorKelvin) <= Math.Abs(ranked[i].WorstErrorKelvin));
        Assert.All(ranked, c => Assert.True(c.MaximumSelfHeatingKelvin > 0));
    }

    /// <summary>
    /// The design's own resistor is ranked even when it is no series value (12.5 kΩ is in no E-series), flagged,
    /// with its margin: budget − |worst error| under a budget that is the same at every temperature.
    /// </summary>
    [Fact]
    public void ThePresentResistorIsRankedWithItsMargin()
    {
        var design = TestDesign.Make(("check.range", "\"0 degC .. 50 degC\""), ("divider.fixed_resistor", "\"12.5 kOhm\""));
        var ranked = FixedResistorSearch.Run(design, new FixedResistorSearchOptions { Series = ESeries.E6, Threads = 2 });
        var present = Assert.Single(ranked, c => c.IsPresent);
        Assert.Equal(12.5e3, present.Ohms, 6);
        Assert.Equal(FixedResistorSearch.Candidates(ESeries.E6, ranked.Where(c => !c.IsPresent).Min(c => c.Ohms), ranked.Max(c => c.Ohms)).Count + 1,
            ranked.Count);
        Assert.All(ranked, c => Assert.Equal(design.Check.BudgetKelvin - Math.Abs(c.WorstErrorKelvin), c.MarginKelvin, 12));

        var text = ThermVerify.Reporting.Text.FixedResistorText.Render(design, ESeries.E6, FixedResistorObjective.WorstError, ranked, top: 1, TestRun.Provenance);
        Assert.Contains("12.5 kΩ (now)", text);
        Assert.Contains("and the present value", text);
    }
}
