using ThermVerify.Circuits.Spice;
using ThermVerify.Ngspice;
using ThermVerify.Simulation;
using ThermVerify.Tests.Ngspice;

namespace ThermVerify.Tests.Differential;

/// <summary>
/// The DC convergence aids on circuits where plain Newton fails, taken from the seeded generator (the fast subset's
/// circuits of up to 12 nodes, the large run's of up to 15): the aid is named in the result, and the answer it reaches
/// is ngspice's.
/// </summary>
public class ConvergenceAidTests
{
    private static RandomCircuit Circuit(int seed, int maxNodes = 12) =>
        RandomCircuitGenerator.Generate(seed, seed % 2 == 0 ? CircuitClass.Linear : CircuitClass.Nonlinear, maxNodes)
        ?? throw new InvalidOperationException($"seed {seed} gives no circuit");

    /// <summary>The largest node difference over the largest node voltage of either engine.</summary>
    private static double ScaledDifference(RandomCircuit rc, Func<string, int, double> ours, NgspicePlot theirs, int points)
    {
        var (worst, scale) = (0.0, 0.0);
        foreach (var node in rc.Nodes)
            for (var p = 0; p < points; p++)
            {
                worst = Math.Max(worst, Math.Abs(ours(node, p) - theirs[node].Real[p]));
                scale = Math.Max(scale, Math.Max(Math.Abs(ours(node, p)), Math.Abs(theirs[node].Real[p])));
            }
        return worst / scale;
    }

    [NgspiceFact]
    public void Gmin_stepping_finds_the_operating_point_plain_newton_misses()
    {
        // Seed 195: an op-amp between its rails, two diodes and an NTC; Newton from zero does not converge.
        var rc = Circuit(195);
        var op = OperatingPoint.Solve(rc.Circuit);
        Assert.Equal(ConvergenceAid.GminStepping, op.Aid);
        // Reference: ngspice 39 on the same circuit (its own aids); 1e-8 of the circuit's scale, the differential
        // run's limit for DC.
        var plot = DifferentialNgspice.Run(SpiceDeckWriter.Write(NgspiceTwin.For(rc.Circuit), new OperatingPointAnalysis())).Plot("op");
        var difference = ScaledDifference(rc, (node, _) => op.Voltage(node), plot, 1);
        Assert.True(difference <= 1e-8, $"operating point {difference:G3} of the scale from ngspice's");
    }

    [NgspiceFact]
    public void Source_stepping_finds_the_operating_point_where_gmin_stepping_fails()
    {
        // Seed 13 of the large run (15 nodes at most): neither Newton from zero nor gmin stepping converges.
        var rc = Circuit(13, maxNodes: 15);
        var op = OperatingPoint.Solve(rc.Circuit);
        Assert.Equal(ConvergenceAid.SourceStepping, op.Aid);
        // Reference: ngspice 39, as above.
        var plot = DifferentialNgspice.Run(SpiceDeckWriter.Write(NgspiceTwin.For(rc.Circuit), new OperatingPointAnalysis())).Plot("op");
        var difference = ScaledDifference(rc, (node, _) => op.Voltage(node), plot, 1);
        Assert.True(difference <= 1e-8, $"operating point {difference:G3} of the scale from ngspice's");
    }

    [NgspiceFact]
    public void A_sweep_point_out_of_reach_is_approached_in_halved_steps_and_says_so()
    {
        // Seed 155: a source sweep where Newton from the previous point fails once; continuation in halved steps
        // reaches it.
        var rc = Circuit(155);
        var step = (rc.SweepTo - rc.SweepFrom) / (DifferentialCase.SweepPoints - 1);
        var values = Enumerable.Range(0, DifferentialCase.SweepPoints).Select(i => rc.SweepFrom + i * step).ToArray();
        var sweep = DcSweep.Element(rc.Circuit, rc.SweepSource, values);
        var note = Assert.Single(sweep.Notes, n => n.Aid == ConvergenceAid.SweepStepHalving);
        Assert.Contains("halved", note.Message);
        // Reference: ngspice's .dc of the same source over the same points; 1e-8 of the scale as above.
        var plot = DifferentialNgspice.Run(SpiceDeckWriter.Write(NgspiceTwin.For(rc.Circuit),
            new DcSourceSweep(rc.SweepSource, rc.SweepFrom, step, DifferentialCase.SweepPoints))).Plot("dc");
        var difference = ScaledDifference(rc, (node, p) => sweep.Voltage(node)[p], plot, values.Length);
        Assert.True(difference <= 1e-8, $"sweep {difference:G3} of the scale from ngspice's");
    }
}
