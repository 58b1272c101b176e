using System.Numerics;
using ThermVerify.Circuits;
using ThermVerify.Simulation.Mna;
using ThermVerify.Simulation.Stamps;

namespace ThermVerify.Simulation;

/// <summary>
/// Loop gain of the feedback loop around one op-amp, as Bode's return ratio of its input
/// transconductance (H. W. Bode, Network Analysis and Feedback Amplifier Design, 1945, from memory):
/// the controlled current g·vd is replaced by an independent unit current, every independent source
/// is zeroed, and T = −g·vd of the response. Nothing is cut, so every loading (r_o, the load, the
/// feedback network, the input) stays as it is; for the model it is exact, not an approximation.
/// </summary>
internal static class LoopGain
{
    public const string AnalysisName = "Loop gain";

    public static LoopGainResult Run(Circuit circuit, string opAmpName, FrequencySweep sweep)
    {
        var system = new SmallSignalSystem(circuit, AnalysisName);
        var stamp = system.System.StampOf(opAmpName) as OpAmpStamp
            ?? throw new CircuitException($"'{opAmpName}' is not an op-amp; loop gain is measured at an op-amp's input stage.");
        var conductances = (double[])system.Conductances.Clone();
        var rhs = system.NewVector();
        stamp.BreakLoop(conductances, rhs);
        var x = system.NewVector();
        Complex Evaluate(double f)
        {
            system.Factor(f, conductances: conductances);
            system.Solve(rhs, x);
            return stamp.ReturnRatio(x);
        }
        var f = sweep.FrequenciesHertz;
        var gain = f.Select(Evaluate).ToArray();
        return new LoopGainResult([.. f], gain, Evaluate, system.Warnings);
    }
}
