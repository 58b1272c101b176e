using System.Diagnostics.CodeAnalysis;
using ThermVerify.Circuits;
using ThermVerify.Simulation.Mna;

namespace ThermVerify.Simulation;

/// <summary>DC operating point at the circuit temperature (capacitors open, inductors shorted, t = 0).</summary>
internal static class OperatingPoint
{
    public const string AnalysisName = "Operating point";

    /// <exception cref="TopologyException">The connections make the circuit unsolvable.</exception>
    /// <exception cref="ConvergenceException">Newton with gmin and source stepping failed.</exception>
    /// <exception cref="SingularMatrixException">The matrix is singular.</exception>
    /// <exception cref="IllConditionedMatrixException">The solution would have lost more than half its digits.</exception>
    public static OperatingPointResult Solve(Circuit circuit)
    {
        TopologyCheck.Run(circuit);
        var system = new BoundSystem(circuit);
        var aid = DcSolver.Solve(system, AnalysisName, null);
        return new OperatingPointResult(system, Warnings.Collect(system), aid);
    }

    /// <summary>As <see cref="Solve"/>, but a failure to solve gives false and the reason instead of an exception.
    /// A malformed circuit still throws.</summary>
    public static bool TrySolve(Circuit circuit, [NotNullWhen(true)] out OperatingPointResult? result,
        [NotNullWhen(false)] out SimulationException? failure)
    {
        try
        {
            result = Solve(circuit);
            failure = null;
            return true;
        }
        catch (SimulationException e)
        {
            result = null;
            failure = e;
            return false;
        }
    }
}
