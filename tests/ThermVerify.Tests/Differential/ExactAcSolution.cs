using ThermVerify.Simulation.Mna;
using ThermVerify.Tests.Simulation.Mna;
using Complex = System.Numerics.Complex;

namespace ThermVerify.Tests.Differential;

/// <summary>
/// The exact AC solution of the engine's own small-signal equations at one frequency: A = G + j·ωB with every entry as
/// the engine forms it (G the Jacobian at its operating point, ω·B rounded once, as <see cref="SmallSignalSystem.Factor"/>
/// does), written as the real system [G −ωB; ωB G]·[x_re; x_im] = [b_re; b_im] and solved in rational arithmetic
/// (<see cref="ExactLinearSolve"/>; elementary algebra). As <see cref="ExactDcSolution"/> for DC: where a circuit is
/// ill-conditioned and the engines' roundings part, this says which of them kept its digits.
/// </summary>
internal static class ExactAcSolution
{
    /// <param name="conductances">G as the comparison used it (ngspice's switch view, or the system's own).</param>
    public static Complex[] NodeVoltages(SmallSignalSystem system, double[] conductances, IReadOnlyList<string> nodes, double frequencyHertz)
    {
        var n = system.Size;
        var w = 2 * Math.PI * frequencyHertz;
        var a = new double[2 * n, 2 * n];
        for (var i = 0; i < n; i++)
            for (var j = 0; j < n; j++)
            {
                var g = conductances[i * n + j];
                var b = w * system.Reactances[i * n + j];
                a[i, j] = g;
                a[i + n, j + n] = g;
                a[i, j + n] = -b;
                a[i + n, j] = b;
            }
        var rhs = system.NewVector();
        foreach (var s in system.System.Stamps)
            s.LoadAcExcitation(rhs);
        var r = new double[2 * n];
        for (var i = 0; i < n; i++)
        {
            r[i] = rhs[i].Real;
            r[i + n] = rhs[i].Imaginary;
        }
        var x = ExactLinearSolve.Solve(a, r);
        return [.. nodes.Select(node => system.System.Layout.IndexOfNode(node) is var k ? new Complex(x[k], x[k + n]) : default)];
    }
}
