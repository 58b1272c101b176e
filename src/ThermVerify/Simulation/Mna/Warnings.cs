namespace ThermVerify.Simulation.Mna;

internal static class Warnings
{
    public static List<SimulationWarning> Collect(BoundSystem system)
    {
        var list = new List<SimulationWarning>();
        foreach (var s in system.Stamps)
            if (s.HasChecks)
                s.Check(system.Context, list);
        return list;
    }

    /// <summary>Adds warnings whose element and subject were not yet reported: the first occurrence is kept.</summary>
    public static void Merge(List<SimulationWarning> into, IEnumerable<SimulationWarning> fresh)
    {
        foreach (var w in fresh)
            if (!into.Any(x => x.Element == w.Element && x.Subject == w.Subject))
                into.Add(w);
    }
}
