namespace ThermVerify.Simulation.Switched;

/// <summary>
/// One cursor over a run, read at rising times, that stops where an op-amp leaves its linear region instead of
/// raising: what a hybrid transient needs, together with the solution where it stopped (the start of the interval that
/// failed), from which time stepping can take over for that stretch alone.
/// </summary>
internal sealed class ExactReader(TimelineCursor cursor, Func<double, string, double> read)
{
    /// <summary>The node's voltage at t, or NaN and the violation once the run has stopped.</summary>
    public (double Volts, LinearityViolation? Violation) Read(double timeSeconds, string node)
    {
        var volts = read(timeSeconds, node);
        return (volts, cursor.Violation);
    }

    /// <summary>Every unknown at the start of the interval that failed (<see cref="LinearityViolation.FromSeconds"/>).</summary>
    public double[] SolutionWhereStopped() =>
        cursor.Violation is null ? throw new InvalidOperationException("The exact run has not stopped.") : cursor.Solution();
}
