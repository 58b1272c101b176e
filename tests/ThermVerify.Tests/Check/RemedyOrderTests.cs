using ThermVerify.Check;
using ThermVerify.Check.Remedies;
using ThermVerify.Tests.Ngspice;

namespace ThermVerify.Tests.Check;

/// <summary>
/// Remedies come in the order of the causes at the finding's worst point: the over-budget finding of the unbuffered
/// cold-storage logger is settling (the acquisition is too short for 50 kΩ into 8 pF), so its first remedy is the
/// acquisition time, not the pin leakage or the sensor's self-heating it also has; with a 100 nF reservoir the same logger is
/// dominated by the reservoir's recovery (R_eq = 1/(f_s·C_sh), Johns &amp; Martin), so its first remedy is the sample rate.
/// </summary>
public class RemedyOrderTests
{
    [Theory]
    [InlineData("cold-storage-logger.toml", "settling", "adc.acquisition_time")]
    [InlineData("cold-storage-logger-reservoir.toml", "reservoir-recovery", "adc.sample_rate")]
    public void The_first_remedy_of_the_total_addresses_the_cause_that_dominates_at_its_worst_point(string example, string cause, string firstKey)
    {
        var loaded = ExampleDesigns.Load(example);
        var range = loaded.Check.Range;
        var design = loaded with { Check = loaded.Check with { StepKelvin = (range.MaxCelsius - range.MinCelsius) / 6 } };
        var result = FrontEndCheck.Run(design, new CheckOptions { MaximumSamplingPoints = 3 });

        var total = result.Findings.Single(f => f.Id == FindingRules.OverBudgetId);
        var worst = result.Points.Single(p => p.Celsius == total.WorstCelsius);
        Assert.Equal(cause, FindingRules.ByContribution(worst.Contributions)[0].FindingId);
        Assert.Equal(firstKey, total.Remedies[0].Key);
        Assert.Equal(firstKey, Knobs.For(cause, design, worst)[0].Key);
    }
}
