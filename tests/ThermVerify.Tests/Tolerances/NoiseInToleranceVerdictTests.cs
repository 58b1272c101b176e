using ThermVerify.Check;
using ThermVerify.Tests.Check;
using ThermVerify.Tolerances;

namespace ThermVerify.Tests.Tolerances;

/// <summary>
/// The tolerance analyses judge a unit as check judges the design: its static error plus the noise of a reading at its
/// coverage (and the ramp lag) within the budget. A design whose parts have no tolerance is one unit, the design
/// itself, so its verdict must be check's.
/// </summary>
public class NoiseInToleranceVerdictTests
{
    [Theory]
    [InlineData("0 LSB", true)]
    [InlineData("4 LSB", false)]
    public void A_unit_without_tolerances_gets_the_verdict_check_gives_its_design(string converterNoise, bool passes)
    {
        // 4 LSB rms at ±3σ is 12 LSB: far beyond a 0.5 K budget on a 12-bit divider; without noise the design passes.
        var design = TestDesign.Make(("adc.noise", $"\"{converterNoise}\""), ("check.budget", "\"0.5 K\""));
        var check = FrontEndCheck.Run(design, new CheckOptions { ComputeRemedies = false });
        Assert.Equal(passes, check.Passed);

        var units = MonteCarlo.Run(design, new MonteCarloOptions { Units = 3, Threads = 1 });
        Assert.Equal(passes ? 3 : 0, units.UnitsWithinBudget);
        var worst = WorstCase.Run(design, new WorstCaseOptions { Threads = 1 });
        Assert.Equal(passes, worst.WithinBudget);
        // The room each takes is check's own noise at its coverage, point by point.
        for (var i = 0; i < check.Points.Count; i++)
            Tolerance.AssertClose(check.Points[i].NoiseKelvin + check.Points[i].RampLagKelvin, worst.Points[i].NoiseKelvin, 1e-9, 1e-12,
                $"at {check.Points[i].Celsius} °C");
    }
}
