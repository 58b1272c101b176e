namespace ThermVerify.Simulation;

/// <summary>An analysis could not produce a solution.</summary>
public class SimulationException : Exception
{
    public SimulationException(string message) : base(message) { }

    public SimulationException(string message, Exception inner) : base(message, inner) { }
}

/// <summary>
/// Newton iterations (with gmin and source stepping, or step-size reduction in a transient) did not
/// converge. Says which analysis, at which sweep value or time, and the unknown that moved most.
/// </summary>
public sealed class ConvergenceException(string message, string analysis, double? sweepValue, double? timeSeconds, string worstUnknown)
    : SimulationException(message)
{
    public string Analysis { get; } = analysis;

    public double? SweepValue { get; } = sweepValue;

    public double? TimeSeconds { get; } = timeSeconds;

    /// <summary>The node (or branch current) with the largest remaining change relative to its tolerance.</summary>
    public string WorstUnknown { get; } = worstUnknown;
}

/// <summary>The MNA matrix is singular; names the unknown whose pivot vanished and the elements on it.</summary>
public sealed class SingularMatrixException(string message, string unknown, IReadOnlyList<string> elements)
    : SimulationException(message)
{
    public string Unknown { get; } = unknown;

    public IReadOnlyList<string> Elements { get; } = elements;
}

/// <summary>
/// The MNA matrix is so ill-conditioned that the solution has lost more than half its digits: rounding alone can
/// move some unknown by more than √u ≈ 1e-8 of the circuit's scale (u the unit roundoff). Names those unknowns and
/// the elements on them.
/// </summary>
public sealed class IllConditionedMatrixException(string message, double amplification, IReadOnlyList<string> unknowns,
    IReadOnlyList<string> elements) : SimulationException(message)
{
    /// <summary>Largest componentwise error amplification, in units of the unit roundoff of the circuit's scale.</summary>
    public double Amplification { get; } = amplification;

    public IReadOnlyList<string> Unknowns { get; } = unknowns;

    public IReadOnlyList<string> Elements { get; } = elements;
}
