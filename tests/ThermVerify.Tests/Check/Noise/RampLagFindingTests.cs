using ThermVerify.Check;
using ThermVerify.Check.Noise;

namespace ThermVerify.Tests.Check.Noise;

public class RampLagFindingTests
{
    [Fact]
    public void A_reading_that_lags_the_declared_ramp_fails_and_the_proven_remedy_averages_fewer_conversions()
    {
        // A mean of 20000 conversions at 10 kHz is (N − 1)·T_s/2 = 1.0 s old (no filter to add to it): at 1 K/s the
        // reading is 1 K behind, more than the 0.5 K budget on its own. Fewer conversions make it younger.
        var design = TestDesign.Make(("adc.noise", "\"0.2 LSB\""), ("noise.readings_averaged", "20000"), ("noise.ramp_rate", "\"1 K/s\""),
            ("check.range", "\"0 degC .. 50 degC\""), ("check.step", "\"25 K\""));
        Tolerance.AssertClose(19999 / 2.0 / 10e3, ReadingNoiseAnalysis.LagSeconds(design, 0), 1e-12);
        var result = FrontEndCheck.Run(design, new CheckOptions { MaximumSamplingPoints = 2 });
        var lag = Assert.Single(result.Findings, f => f.Id == NoiseFindingRules.RampLagId);
        Assert.Equal(Severity.Fail, lag.Severity);
        Assert.False(result.Passed);
        var fewer = Assert.Single(lag.Remedies, r => r.Key == "noise.readings_averaged");
        Assert.True(fewer.Value < 20000, $"asks for {fewer.Value}");
        Assert.Contains("ramp-lag gone", fewer.Proof);
        var applied = FrontEndCheck.Run(design with { Noise = design.Noise with { ReadingsAveraged = (int)fewer.Value!.Value } },
            new CheckOptions { MaximumSamplingPoints = 2, ComputeRemedies = false });
        Assert.DoesNotContain(applied.Findings, f => f.Id == NoiseFindingRules.RampLagId && f.Severity == Severity.Fail);
    }
}
