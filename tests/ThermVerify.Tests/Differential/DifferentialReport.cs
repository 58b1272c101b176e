using System.Globalization;
using System.Text;

namespace ThermVerify.Tests.Differential;

/// <summary>Figures of a differential run: completion of each engine, agreement percentiles, every disagreement.</summary>
internal sealed class DifferentialReport(IReadOnlyList<CaseResult> cases)
{
    public IReadOnlyList<CaseResult> Cases => cases;

    /// <summary>Cases whose linearised circuit is stable (by <see cref="StabilityScreen"/>) or could not be screened
    /// because the built-in operating point failed (counted, so a failure cannot hide behind the screen).</summary>
    public IEnumerable<CaseResult> Screened => cases.Where(c => c.Stable != false);

    public IEnumerable<Comparison> Of(DifferentialAnalysis analysis) =>
        Screened.SelectMany(c => c.Comparisons).Where(x => x.Analysis == analysis);

    /// <summary>Analyses ngspice completed and the built-in engine did not, without saying why (declines excluded).</summary>
    public IEnumerable<(CaseResult Case, Comparison Comparison)> OursOnlyFailures =>
        Screened.SelectMany(c => c.Comparisons.Select(x => (c, x))).Where(p => p.x.NgspiceFailure is null && p.x.OursFailure is not null && !p.x.OursDeclined);

    public IEnumerable<(CaseResult Case, Comparison Comparison)> Declines =>
        Screened.SelectMany(c => c.Comparisons.Select(x => (c, x))).Where(p => p.x.NgspiceFailure is null && p.x.OursDeclined);

    /// <summary>The p-th percentile (nearest rank) of the differences where both completed, unexplained ones only.</summary>
    public double Percentile(DifferentialAnalysis analysis, double p, bool includeExplained = false)
    {
        var values = Of(analysis).Where(x => x.Difference is not null && (includeExplained || x.Explanation is null))
            .Select(x => x.Difference!.Value).Order().ToList();
        if (values.Count == 0)
            return 0;
        var rank = (int)Math.Ceiling(p / 100 * values.Count) - 1;
        return values[Math.Clamp(rank, 0, values.Count - 1)];
    }

    /// <summary>
    /// One tab-separated line per comparison of every case (seed, class, stable, analysis, ngspice failed, built-in
    /// failed, declined, difference, explained, above the limit), so that the reports of a run made in chunks can be
    /// combined into one set of figures.
    /// </summary>
    public string Table(IReadOnlyDictionary<DifferentialAnalysis, double> limits)
    {
        var s = new StringBuilder("seed\tclass\tstable\tanalysis\tngspice_failed\tours_failed\tdeclined\tdifference\texplained\tabove_limit\n");
        foreach (var c in cases)
        {
            if (c.Comparisons.Count == 0)
                s.AppendLine(CultureInfo.InvariantCulture, $"{c.Circuit.Seed}\t{c.Circuit.Class}\t{c.Stable}\t-\t\t\t\t\t\t");
            foreach (var x in c.Comparisons)
                s.AppendLine(CultureInfo.InvariantCulture,
                    $"{c.Circuit.Seed}\t{c.Circuit.Class}\t{c.Stable}\t{x.Analysis}\t{x.NgspiceFailure is not null}\t{x.OursFailure is not null}\t" +
                    $"{x.OursDeclined}\t{x.Difference:R}\t{x.Explanation is not null}\t{x.Difference > limits.GetValueOrDefault(x.Analysis, double.PositiveInfinity)}");
        }
        return s.ToString();
    }

    public string Render(IReadOnlyDictionary<DifferentialAnalysis, double> limits)
    {
        var s = new StringBuilder();
        var inv = CultureInfo.InvariantCulture;
        var stable = cases.Count(c => c.Stable == true);
        var unstable = cases.Count(c => c.Stable == false);
        var unscreened = cases.Count(c => c.Stable is null);
        s.AppendLine(inv, $"circuits: {cases.Count} ({stable} stable, {unstable} unstable and left out, {unscreened} not screened: built-in operating point failed)");
        s.AppendLine("| analysis | both ran | ngspice completed | built-in completed | built-in declined (says why) | built-in failed where ngspice completed | ngspice failed where built-in completed | p50 | p90 | p99 | max | explained | limit (p99) |");
        s.AppendLine("|---|---|---|---|---|---|---|---|---|---|---|---|---|");
        foreach (var analysis in Enum.GetValues<DifferentialAnalysis>())
        {
            var all = Of(analysis).ToList();
            if (all.Count == 0)
                continue;
            var both = all.Count(x => x.BothCompleted);
            s.AppendLine(inv,
                $"| {analysis} | {all.Count} | {all.Count(x => x.NgspiceFailure is null)} | {all.Count(x => x.OursFailure is null)} | " +
                $"{all.Count(x => x.OursDeclined && x.NgspiceFailure is null)} | {all.Count(x => x.NgspiceFailure is null && x.OursFailure is not null && !x.OursDeclined)} | " +
                $"{all.Count(x => x.NgspiceFailure is not null && x.OursFailure is null)} | {Percentile(analysis, 50):G2} | {Percentile(analysis, 90):G2} | " +
                $"{Percentile(analysis, 99):G2} | {Percentile(analysis, 100):G2} | {all.Count(x => x.Explanation is not null)} | {limits.GetValueOrDefault(analysis):G2} |");
        }
        s.AppendLine();
        s.AppendLine("Slowest analyses (ms, built-in / ngspice):");
        foreach (var (c, x) in cases.SelectMany(c => c.Comparisons.Select(x => (c, x))).OrderByDescending(p => Math.Max(p.x.Milliseconds.Ours, p.x.Milliseconds.Ngspice)).Take(8))
            s.AppendLine(inv, $"- {x.Analysis}, seed {c.Circuit.Seed}: {x.Milliseconds.Ours:F0} / {x.Milliseconds.Ngspice:F0}, stop {c.Circuit.TransientStopSeconds:G3} s");
        s.AppendLine("Built-in failures where ngspice completed:");
        foreach (var (c, x) in OursOnlyFailures)
            s.AppendLine(inv, $"- {x.Analysis}, {c.Circuit.Describe()}: {x.OursFailure}");
        s.AppendLine("Declines (the built-in engine says why):");
        foreach (var (c, x) in Declines)
            s.AppendLine(inv, $"- {x.Analysis}, seed {c.Circuit.Seed} ({c.Circuit.Class}): {x.OursFailure}");
        s.AppendLine("Convergence aids and method changes the engine reported:");
        foreach (var c in Screened)
            foreach (var x in c.Comparisons.Where(x => x.Notes is not null))
                s.AppendLine(inv, $"- {x.Analysis}, seed {c.Circuit.Seed} ({c.Circuit.Class}): {x.Notes}");
        s.AppendLine("Explained disagreements:");
        foreach (var c in Screened)
            foreach (var x in c.Comparisons.Where(x => x.Explanation is not null))
                s.AppendLine(inv, $"- {x.Analysis}, seed {c.Circuit.Seed} ({c.Circuit.Class}): {x.Difference:G3}: {x.Explanation}");
        s.AppendLine("Disagreements above the limit without an explanation:");
        foreach (var c in Screened)
            foreach (var x in c.Comparisons.Where(x => x.Explanation is null && x.Difference > limits.GetValueOrDefault(x.Analysis, double.PositiveInfinity)))
                s.AppendLine(inv, $"- {x.Analysis}, {c.Circuit.Describe()}: {x.Difference:G3}");
        s.AppendLine("ngspice failures where the built-in engine completed:");
        foreach (var c in Screened)
            foreach (var x in c.Comparisons.Where(x => x.NgspiceFailure is not null && x.OursFailure is null))
                s.AppendLine(inv, $"- {x.Analysis}, seed {c.Circuit.Seed} ({c.Circuit.Class}): {x.NgspiceFailure}");
        return s.ToString();
    }
}
