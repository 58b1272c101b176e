using ThermVerify.Reporting.Plots;
using ThermVerify.Tests.Check;
using ThermVerify.Tolerances;

namespace ThermVerify.Tests.Reporting;

/// <summary>
/// The Monte Carlo histogram colours units by the rule the yield counts with (within the budget at every temperature,
/// regions included), not by where their worst error falls against the main budget: a unit that breaks a tight region
/// with an error below the main budget is drawn as failing.
/// </summary>
public class HistogramColourTests
{
    [Fact]
    public void Units_are_split_by_the_yield_rule_regions_included()
    {
        // 2 % on R25 moves the reading by about ±0.5 K at 25 °C: every unit is inside the 1 K budget, but many break the
        // 0.2 K region around 25 °C.
        var design = TestDesign.Make(("sensor.resistance_tolerance", "\"2 %\""), ("adc.bits", "16"), ("check.range", "\"0 degC .. 50 degC\""),
            ("check.step", "\"5 K\""), ("check.budget", "\"1 K\""));
        design = design with { Check = design.Check with { Regions = [new ThermVerify.Design.CheckRegion(new(20, 30), 0.2)] } };
        var result = MonteCarlo.Run(design, new MonteCarloOptions { Units = 300, Seed = 3, Threads = 2, SimulateSettling = false });
        var (_, within, over) = WorstErrorHistogramPlot.Counts(result, design.Check.BudgetKelvin);

        Assert.Equal(result.UnitsWithinBudget, within.Sum());
        Assert.Equal(result.Units - result.UnitsWithinBudget, over.Sum());
        var failingBelowTheMainBudget = Enumerable.Range(0, result.Units)
            .Count(u => !result.UnitWithinBudget[u] && Math.Abs(result.WorstErrorKelvin[u]) < design.Check.BudgetKelvin);
        Assert.True(failingBelowTheMainBudget > 0, "the region makes some units fail below the main budget");
    }
}
