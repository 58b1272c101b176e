using ThermVerify.Api;
using ThermVerify.Check;
using ThermVerify.Components;
using ThermVerify.Design;
using ThermVerify.Tolerances;

namespace ThermVerify.Tests.Tolerances;

/// <summary>choose-fixed on a delta-sigma design: each candidate reference resistor checked by the delta-sigma check.</summary>
public class DeltaSigmaChoiceTests
{
    private static FrontEndDesign Kiln() => DesignLoader.Load(Path.Combine(Repository.Netlists, "kiln-bank-pt100-deltasigma.toml"));

    private static readonly FixedResistorSearchOptions TwoValues = new() { Series = ESeries.E12, MinimumOhms = 3000, MaximumOhms = 4000, Threads = 1 };

    [Fact]
    public void The_kilns_candidates_are_over_the_budget_while_its_first_reading_after_a_switch_is_used()
    {
        // Every reference resistor leaves the shared filter's channel-switch transient as it is (it is the RC behind the
        // multiplexer), and the first reading is used: the delta-sigma check's channel-switch finding fails each one.
        var ranked = Verifier.ChooseFixed(Kiln(), TwoValues);
        Assert.Equal([3300.0, 3900.0], ranked.Select(c => c.Ohms).Order());
        Assert.All(ranked, c => Assert.False(c.WithinBudget));
        Assert.All(ranked, c => Assert.True(c.MarginKelvin > 0, "the points themselves are within the budget"));
    }

    [Fact]
    public void With_readings_discarded_the_candidates_are_within_and_carry_the_delta_sigma_checks_errors()
    {
        var kiln = Kiln();
        var discarding = kiln with { Adc = kiln.Adc with { DeltaSigma = kiln.Adc.DeltaSigma! with { ReadingsDiscarded = 3 } } };
        var ranked = Verifier.ChooseFixed(discarding, TwoValues);
        Assert.All(ranked, c => Assert.True(c.WithinBudget, $"{c.Ohms} Ω"));
        // The present 3.9 kΩ: its worst error is the delta-sigma check's worst point (self-heating included there).
        var present = ranked.Single(c => c.IsPresent);
        var check = FrontEndCheck.Run(discarding, new CheckOptions { ComputeRemedies = false, MaximumSamplingPoints = 9, Threads = 1 });
        var worst = check.Points.MaxBy(p => Math.Abs(p.ErrorKelvin))!;
        Assert.Equal(worst.ErrorKelvin, present.WorstErrorKelvin, 12);
        Assert.NotNull(check.DeltaSigma);
    }
}
