using ThermVerify.Tests.Ngspice;

namespace ThermVerify.Tests.Differential;

/// <summary>
/// Random circuits of the large run where the engine once failed and ngspice completed. Each holds a diode forward by
/// volts with a voltage-defined path (seed 223: E1 across D1 at 7.4 V, 5e117 A in ngspice; seed 237: V1 and V3 hold D3
/// at 5.4 V, about 1e58 A), whose conductance swallows every other term of its nodes' current law in rounding. Where
/// that leaves a pivot exactly zero the engine used to call the matrix singular (naming an uninvolved branch) or let
/// the transient's step collapse; it now replaces the pivot and the componentwise check declines the analysis, naming
/// the unknowns. The operating point of seed 237, whose node voltages the sources fix, still agrees with ngspice.
/// </summary>
public class SeedRegressionTests
{
    [NgspiceTheory]
    [InlineData(223)]
    [InlineData(237)]
    public void A_diode_held_forward_by_a_source_is_declined_with_a_reason_never_failed(int seed)
    {
        var rc = RandomCircuitGenerator.Generate(seed, CircuitClass.Nonlinear, 15)!;
        var result = DifferentialCase.Run(rc);
        foreach (var c in result.Comparisons.Where(c => c.NgspiceFailure is null))
            Assert.True(c.OursFailure is null || c.OursDeclined, $"{c.Analysis}: {c.OursFailure}");
        if (seed == 237)
            Assert.True(result.Comparisons.Single(c => c.Analysis == DifferentialAnalysis.OperatingPoint).Difference <= 1e-12);
    }

    /// <summary>
    /// Seed 473 (3 nodes: V1 and V2 in series hold D1 forward at 4.459 V, 1.7e28 A): the operating point agreed, but
    /// the transient's first step collapsed at t = 0, its solve returning noise once the capacitors' C/h made the
    /// diode's row a pivot. With the LU's second choice of pivots (the sparsest rows, when a pivot vanished to rounding)
    /// every analysis completes and agrees with ngspice (ForwardDiodeAcrossSourceTests has it in closed form).
    /// </summary>
    [NgspiceFact]
    public void A_diode_held_forward_by_stacked_sources_completes_every_analysis_and_agrees()
    {
        var rc = RandomCircuitGenerator.Generate(473, CircuitClass.Nonlinear, 15)!;
        var result = DifferentialCase.Run(rc);
        Assert.Equal(Enum.GetValues<DifferentialAnalysis>().Length, result.Comparisons.Count);
        foreach (var c in result.Comparisons)
        {
            Assert.True(c.BothCompleted, $"{c.Analysis}: ours {c.OursFailure}, ngspice {c.NgspiceFailure}");
            Assert.True(c.Difference <= DifferentialCase.Limits[c.Analysis], $"{c.Analysis}: {c.Difference}");
        }
    }

    /// <summary>
    /// Seed 515 (a follower, three switches and a diode) once kept the large run busy for hours: at t = 4.5 ms a
    /// rejected step of 2.3e-18 s was cut, rounded back to the same step on a time of that size (its resolution is
    /// 8.7e-19 s), rejected again, and so on forever, above the 1e-18 s minimum and out of reach of the time guard. The
    /// retry now ends as a collapsed step (here: the matrix is ill-conditioned, its nodes named), and observes Ctrl+C.
    /// </summary>
    [Fact]
    public void A_step_that_cannot_shrink_below_the_times_resolution_ends_the_transient_with_its_reason()
    {
        var rc = RandomCircuitGenerator.Generate(515, CircuitClass.Nonlinear, 15)!;
        rc = RandomTiming.Apply(rc, StabilityScreen.PolesOf(rc.Circuit), rc.Seed);
        var simulation = new ThermVerify.Simulation.TransientSimulation(rc.Circuit,
            new ThermVerify.Simulation.TransientOptions { StopTimeSeconds = rc.TransientStopSeconds, MaxStepSeconds = rc.TransientStopSeconds / 100 });
        var error = Assert.ThrowsAny<ThermVerify.Simulation.SimulationException>(() => simulation.AdvanceTo(rc.TransientStopSeconds));
        Assert.Contains("the step fell to the time's own resolution", error.Message);
        Assert.Contains("ill-conditioned", error.Message);
    }

    /// <summary>
    /// The large run also stalled after seed 761, in the stability screen: MathNet's managed SVD (behind
    /// ConditionNumber) did not return on that pencil. The screen now takes the 1-norm condition number from the LU's
    /// inverse; both circuits are screened (or refused with a reason) and the run goes on.
    /// </summary>
    [Theory]
    [InlineData(762)]
    [InlineData(763)]
    public void The_stability_screen_returns_on_the_circuits_after_seed_761(int seed)
    {
        var circuitClass = seed % 2 == 0 ? CircuitClass.Linear : CircuitClass.Nonlinear;
        var rc = RandomCircuitGenerator.Generate(seed, circuitClass, 15);
        Assert.NotNull(rc);
        try
        {
            var poles = StabilityScreen.PolesOf(rc.Circuit);
            Assert.All(poles.Values, p => Assert.True(double.IsFinite(p.Real) && double.IsFinite(p.Imaginary)));
        }
        catch (Exception e) when (e is InvalidOperationException or ThermVerify.Simulation.SimulationException)
        {
            Assert.False(string.IsNullOrWhiteSpace(e.Message));
        }
    }
}
