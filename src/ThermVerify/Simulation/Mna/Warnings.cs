namespace ThermVerify.Simulation.Mna;

/// <summary>
/// Collects the warnings of the stamps that check their converged points, keeping the first occurrence
/// of each (element, subject). The scratch list is reused, so a run without warnings allocates nothing.
/// </summary>
internal sealed class Warnings(BoundSystem system)
{
    private readonly Stamp[] checkers = [.. system.Stamps.Where(s => s.HasChecks)];
    private readonly List<SimulationWarning> scratch = [];

    public List<SimulationWarning> Found { get; } = [];

    public bool Any => checkers.Length > 0;

    /// <summary>Checks the present solution; new warnings are stamped with the time or sweep value.</summary>
    public void Check(double? timeSeconds = null, double? sweepValue = null)
    {
        if (checkers.Length == 0)
            return;
        scratch.Clear();
        foreach (var s in checkers)
            s.Check(system.Context, scratch);
        foreach (var w in scratch)
            if (!Found.Exists(x => x.Element == w.Element && x.Subject == w.Subject))
                Found.Add(w with { TimeSeconds = timeSeconds, SweepValue = sweepValue });
    }

    public static List<SimulationWarning> Collect(BoundSystem system)
    {
        var w = new Warnings(system);
        w.Check();
        return w.Found;
    }
}
