using System.Numerics;
using ThermVerify.Circuits;
using ThermVerify.Simulation.Mna;

namespace ThermVerify.Simulation;

/// <summary>
/// Small-signal AC analysis about the operating point: the complex MNA system (G + jωB)·x = b is
/// solved at every frequency, b holding each source's AC magnitude and phase.
/// </summary>
internal static class AcAnalysis
{
    public const string AnalysisName = "AC";

    /// <param name="start">Where the operating point's Newton starts (see <see cref="SmallSignalSystem"/>).</param>
    public static AcResult Run(Circuit circuit, FrequencySweep sweep, Action<BoundSystem>? start = null)
    {
        var system = new SmallSignalSystem(circuit, AnalysisName, start);
        var rhs = system.NewVector();
        foreach (var s in system.System.Stamps)
            s.LoadAcExcitation(rhs);
        var width = system.System.Layout.VectorLength;
        var f = sweep.FrequenciesHertz;
        var data = new Complex[f.Count * width];
        var x = system.NewVector();
        for (var k = 0; k < f.Count; k++)
        {
            system.Factor(f[k]);
            system.Solve(rhs, x);
            Array.Copy(x, 0, data, k * width, width);
        }
        return new AcResult(system.System.Layout, [.. f], data, system.Warnings);
    }
}
