using ThermVerify.Circuits;

namespace ThermVerify.Simulation;

/// <summary>Transient analysis from t = 0 (or from a captured state) to the options' stop time.</summary>
internal static class Transient
{
    /// <exception cref="TopologyException">The connections make the circuit unsolvable.</exception>
    /// <exception cref="ConvergenceException">A step could not be completed above the minimum step.</exception>
    public static TransientResult Run(Circuit circuit, TransientOptions options, TransientState? initialState = null)
    {
        var simulation = new TransientSimulation(circuit, options, initialState);
        simulation.AdvanceTo(options.StopTimeSeconds);
        return simulation.Result;
    }
}
