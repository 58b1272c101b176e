namespace ThermVerify.Baselines;

public enum Change
{
    Same,
    Better,
    Worse,
    /// <summary>A figure the baseline does not have (e.g. a budget region added since).</summary>
    New,
    /// <summary>A figure the baseline has and this check does not.</summary>
    Gone,
}

/// <summary>One figure before and now; <see cref="Change"/> says whether it moved beyond its tolerance and which way.</summary>
public sealed record FigureChange(string Id, string Description, string Unit, double? Before, double? Now, double Tolerance, Better Better, Change Change)
{
    /// <summary>Now minus before; null where either does not exist.</summary>
    public double? Delta => Before is { } b && Now is { } n ? n - b : null;
}

/// <summary>
/// A check compared with its baseline. A figure is worse when it moves the wrong way by more than its tolerance
/// (|now − before| &gt; tolerance); a value that no longer exists (an unreadable code) is worse than any number.
/// New and gone figures are listed but do not fail the comparison. <see cref="RunDifferences"/> says how the run that
/// made the baseline differs from this one (another engine, other settings, another version, other files), because
/// a figure may then move for that reason alone.
/// </summary>
public sealed record BaselineComparison(string BaselinePath, bool DesignChanged, IReadOnlyList<FigureChange> Figures)
{
    /// <summary>One sentence per difference; empty when the runs agree.</summary>
    public IReadOnlyList<string> RunDifferences { get; init; } = [];

    public bool Passed => Figures.All(f => f.Change != Change.Worse);

    public static BaselineComparison Compare(string baselinePath, Baseline before, Baseline now)
    {
        var rows = new List<FigureChange>();
        foreach (var n in now.Figures)
        {
            var b = before.Figures.FirstOrDefault(f => f.Id == n.Id);
            rows.Add(b is null
                ? new FigureChange(n.Id, n.Description, n.Unit, null, n.Value, n.Tolerance, n.Better, Change.New)
                : new FigureChange(n.Id, n.Description, n.Unit, b.Value, n.Value, b.Tolerance, b.Better, Classify(b.Value, n.Value, b.Tolerance, b.Better)));
        }
        rows.AddRange(before.Figures.Where(b => now.Figures.All(n => n.Id != b.Id))
            .Select(b => new FigureChange(b.Id, b.Description, b.Unit, b.Value, null, b.Tolerance, b.Better, Change.Gone)));
        IReadOnlyList<string> differences = (before.Provenance, now.Provenance) switch
        {
            ({ } then, { } current) => current.DifferencesFrom(then),
            (null, _) => [$"the baseline does not say which engine and settings made it (written by thermverify {before.ToolVersion}); write it again to record them"],
            _ => [],
        };
        return new BaselineComparison(baselinePath, before.DesignSha256 != now.DesignSha256, rows) { RunDifferences = differences };
    }

    private static Change Classify(double? before, double? now, double tolerance, Better better)
    {
        // A missing value is the worst a figure can be: for an error, infinitely large; for a margin, infinitely small.
        var worstEnd = better == Better.Lower ? double.PositiveInfinity : double.NegativeInfinity;
        var b = before ?? worstEnd;
        var n = now ?? worstEnd;
        if (b.Equals(n)) return Change.Same;
        if (double.IsInfinity(b) || double.IsInfinity(n))
            return (better == Better.Lower) == (n > b) ? Change.Worse : Change.Better;
        if (Math.Abs(n - b) <= tolerance) return Change.Same;
        return (better == Better.Lower) == (n > b) ? Change.Worse : Change.Better;
    }
}
