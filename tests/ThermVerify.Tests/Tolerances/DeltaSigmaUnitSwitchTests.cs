using ThermVerify.Check;
using ThermVerify.Design;
using ThermVerify.FrontEnd;
using ThermVerify.FrontEnd.DeltaSigma;
using ThermVerify.Tests.Ngspice;
using ThermVerify.Tolerances;

namespace ThermVerify.Tests.Tolerances;

/// <summary>
/// montecarlo on a delta-sigma design with each unit's own channel switch: the first reading used, simulated with the
/// unit's parts through the digital filter (DeltaSigmaUnit), judged against the budget as the check judges the design's.
/// </summary>
public class DeltaSigmaUnitSwitchTests
{
    private static FrontEndDesign Kiln() => ExampleDesigns.Load("kiln-bank-pt100-deltasigma.toml");

    [Fact]
    public void The_nominal_units_switch_is_the_checks_and_every_kiln_unit_using_its_first_reading_fails_on_it()
    {
        var design = Kiln();
        var result = MonteCarlo.Run(design, new MonteCarloOptions { Units = 12, Seed = 4, Threads = 2 });
        var s = result.ChannelSwitch!;
        // The check follows the switch at the range's ends and middle and reports the worst against the budget; the
        // nominal unit's (every bound spread about zero) is the same circuit at the same temperature.
        var check = FrontEndCheck.Run(design, new CheckOptions { ComputeRemedies = false });
        var cs = check.DeltaSigma!.ChannelSwitch;
        Assert.Equal(cs.Celsius, s.Celsius);
        var slope = new ClosedFormModel(design).At(cs.Celsius).VoltsPerKelvin;
        Tolerance.AssertClose(Math.Abs(cs.FirstUsedErrorVolts / slope), s.NominalKelvin, 1e-6, 1e-9, "nominal unit against the check");
        // The shared filter still holds the other zone: the first reading is off by far more than the 0.5 K budget in
        // every unit, so none is within it (the check fails the design on the same finding).
        Assert.Equal(12, s.UnitsOver);
        Assert.Equal(0, result.UnitsWithinBudget);
        Assert.True(s.WorstKelvin >= s.NominalKelvin * 0.9 && s.NominalKelvin > 10 * s.BudgetKelvin);
        // Without the per-unit settling the units are static readings again, and the result says nothing of the switch.
        var statics = MonteCarlo.Run(design, new MonteCarloOptions { Units = 12, Seed = 4, Threads = 2, SimulateSettling = false });
        Assert.Null(statics.ChannelSwitch);
        Assert.True(statics.UnitsWithinBudget > 0, "statically most kiln units are within the budget");
    }

    [Fact]
    public void Discarding_the_readings_the_check_names_brings_the_units_back_within_the_budget()
    {
        var design = Kiln();
        var check = FrontEndCheck.Run(design, new CheckOptions { ComputeRemedies = false });
        var discard = check.DeltaSigma!.ChannelSwitch.ReadingsToDiscard!.Value;
        var fixedDesign = design with { Adc = design.Adc with { DeltaSigma = design.Adc.DeltaSigma! with { ReadingsDiscarded = discard } } };
        var result = MonteCarlo.Run(fixedDesign, new MonteCarloOptions { Units = 12, Seed = 4, Threads = 2 });
        Assert.Equal(0, result.ChannelSwitch!.UnitsOver);
        // The same units (same seed) as their static readings: the switch, now within the budget, fails none of them.
        var statics = MonteCarlo.Run(fixedDesign, new MonteCarloOptions { Units = 12, Seed = 4, Threads = 2, SimulateSettling = false });
        Assert.Equal(statics.UnitWithinBudget, result.UnitWithinBudget);
        Assert.True(result.UnitsWithinBudget > 0);
        // The unit's own parts reach the switch: a unit's error differs from the nominal one (its filter and source are its own).
        var evaluator = new UnitEvaluator(fixedDesign, threads: 1);
        var deviations = new double[evaluator.Set.Count];
        var nominal = evaluator.Evaluate(deviations).ChannelSwitchKelvin!.Value;
        var i = evaluator.Set.Parameters.ToList().FindIndex(p => p.Key == "current_source.current_tolerance");
        deviations[i] = evaluator.Set.Parameters[i].HalfWidth;
        var moved = evaluator.Evaluate(deviations).ChannelSwitchKelvin!.Value;
        Assert.NotEqual(nominal, moved);
    }
}
