using ThermVerify.Design;
using ThermVerify.FrontEnd;
using ThermVerify.Simulation;

namespace ThermVerify.Tests.Simulation;

/// <summary>
/// The DC temperature sweep of a design with an op-amp buffer costs what continuation should: each point starts Newton
/// from the previous point's solution, so a smooth sweep needs about two solves a point (one step, one that confirms
/// convergence), and the first point no more than a plain Newton start. Issue 17 had measured about 2,100 solves for a
/// 91-point sweep (Newton from zero oscillating for 100 iterations, then gmin and source stepping); the op-amp's
/// Newton limiting now reaches the first point directly: 191–197 solves over these examples (measured 2026-12-02).
/// Continuation costing about two solves a point: common practice, no source.
/// </summary>
public class OpAmpSweepStartTests
{
    [Theory]
    [InlineData("cold-storage-logger-buffered.toml")]
    [InlineData("buffered-cable-probe.toml")]
    [InlineData("cold-storage-logger-bare-opamp.toml")]
    public void A_buffered_sweep_takes_about_two_solves_a_point_and_no_aid(string example)
    {
        var design = DesignLoader.Load(Path.Combine(Repository.Netlists, example));
        var temperatures = Enumerable.Range(0, 91).Select(i => -40 + i * 1.0).ToArray();
        var sweep = DcSweep.Temperature(FrontEndCircuit.Dc(design, null), temperatures);
        Assert.Empty(sweep.Notes);
        // Two a point plus a start of at most 40 (plain Newton from zero, limited): far below the 2,100 of an aided start.
        Assert.InRange(sweep.Solves, temperatures.Length, 2 * temperatures.Length + 40);
    }
}
