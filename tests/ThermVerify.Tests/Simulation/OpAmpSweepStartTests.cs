using ThermVerify.Design;
using ThermVerify.FrontEnd;
using ThermVerify.Simulation;

namespace ThermVerify.Tests.Simulation;

/// <summary>
/// The DC temperature sweep of a design with an op-amp buffer costs what continuation should: each point starts Newton
/// from the previous point's solution, and with the op-amp in its linear region (its soft clamp the identity far below any
/// tolerance, Stamp.LinearisationExact) that one solve is the solution: one solve a point instead of two (one step, one
/// that confirms convergence), and the first point no more than a plain Newton start. Issue 17 had measured about 2,100
/// solves for a 91-point sweep (Newton from zero oscillating for 100 iterations, then gmin and source stepping); the
/// op-amp's Newton limiting reaches the first point directly: 191–197 solves over these examples on 2026-12-02, before
/// the confirming solve was dropped. Continuation costing about two solves a point: common practice, no source.
/// </summary>
public class OpAmpSweepStartTests
{
    [Theory]
    [InlineData("cold-storage-logger-buffered.toml")]
    [InlineData("buffered-cable-probe.toml")]
    [InlineData("cold-storage-logger-bare-opamp.toml")]
    public void A_buffered_sweep_takes_one_solve_a_point_and_no_aid(string example)
    {
        var design = DesignLoader.Load(Path.Combine(Repository.Netlists, example));
        var temperatures = Enumerable.Range(0, 91).Select(i => -40 + i * 1.0).ToArray();
        var sweep = DcSweep.Temperature(FrontEndCircuit.Dc(design, null), temperatures);
        Assert.Empty(sweep.Notes);
        // One a point plus a start of at most 40 (plain Newton from zero, limited), and a confirming solve at points whose
        // output is within 40 knee widths of a swing limit (the loggers' coldest, near 3.2 V): 136 measured on both
        // loggers, against 191–197 with a confirming solve at every point. Far below the 2,100 of an aided start.
        Assert.InRange(sweep.Solves, temperatures.Length, temperatures.Length * 3 / 2 + 40);
    }
}
