using ThermVerify.Simulation.Mna;
using ThermVerify.Tests.Simulation.Mna;

namespace ThermVerify.Tests.Differential;

/// <summary>
/// The exact DC solution of a linear circuit's own equations: the engine's MNA matrix and right-hand side, assembled
/// as they are (every entry a double, so a dyadic rational), solved in rational arithmetic
/// (<see cref="ExactLinearSolve"/>; elementary algebra). Where the circuit is ill-conditioned and the two engines'
/// roundings part, this says which of them kept its digits.
/// </summary>
internal static class ExactDcSolution
{
    /// <summary>Node voltages of <paramref name="nodes"/>, or null for a nonlinear circuit.</summary>
    /// <param name="set">Puts the system at the sweep value wanted (nothing for the operating point).</param>
    public static double[]? NodeVoltages(RandomCircuit rc, IReadOnlyList<string> nodes, Action<BoundSystem> set)
    {
        var system = new BoundSystem(rc.Circuit);
        if (system.IsNonlinear)
            return null;
        set(system);
        system.Assemble();
        var n = system.Size;
        var a = new double[n, n];
        for (var i = 0; i < n; i++)
            for (var j = 0; j < n; j++)
                a[i, j] = system.Context.Matrix[i * n + j];
        var x = ExactLinearSolve.Solve(a, system.Context.Rhs[..n]);
        return [.. nodes.Select(node => x[system.Layout.IndexOfNode(node)])];
    }
}
