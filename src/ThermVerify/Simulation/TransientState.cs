namespace ThermVerify.Simulation;

/// <summary>
/// Everything a transient needs to continue exactly where another stopped: the solution, the integrated
/// states with their recent history (for the error estimate), and the step the run would take next.
/// Valid only for a circuit with the same elements and nodes (values may not change either).
/// </summary>
internal sealed record TransientState
{
    internal TransientState() { }

    public double TimeSeconds { get; internal init; }

    internal string Signature { get; init; } = null!;
    internal double[] Solution { get; init; } = null!;
    internal double[] OlderSolution { get; init; } = null!;
    internal double[] Slopes { get; init; } = null!;
    internal bool UsesGear2 { get; init; }
    internal double[] States { get; init; } = null!;
    internal double[] HistoryTimes { get; init; } = null!;
    internal double[][] HistoryValues { get; init; } = null!;
    internal int SinceBreak { get; init; }
    internal double ProposedStepSeconds { get; init; }
}
