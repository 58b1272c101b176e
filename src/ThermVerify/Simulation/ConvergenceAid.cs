namespace ThermVerify.Simulation;

/// <summary>What a DC solution needed beyond plain Newton–Raphson from its starting point, in the usual order of trying.</summary>
internal enum ConvergenceAid
{
    /// <summary>Newton–Raphson (with junction voltage limiting) converged from the starting point.</summary>
    None,

    /// <summary>A DC sweep reached the point through intermediate values (the sweep step halved).</summary>
    SweepStepHalving,

    /// <summary>A conductance from every node to ground, relaxed step by step to zero.</summary>
    GminStepping,

    /// <summary>Every independent source ramped up from zero.</summary>
    SourceStepping,
}

/// <summary>
/// Something the solver had to do beyond its plain course, for the record: a DC solution that needed a convergence
/// aid (<see cref="Aid"/> set), or a transient that changed its integration method. Says which analysis, where
/// (sweep value or time), and gives a sentence for a report.
/// </summary>
internal sealed record SolverNote(string Analysis, string Message, ConvergenceAid? Aid = null, double? SweepValue = null, double? TimeSeconds = null);
