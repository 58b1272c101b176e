using ThermVerify.Baselines;
using static ThermVerify.Reporting.ReportFormat;

namespace ThermVerify.Reporting.Text;

/// <summary>A baseline comparison for the terminal: a verdict line and the table of figures.</summary>
public static class BaselineTable
{
    public static string Render(BaselineComparison comparison)
    {
        var head = Headline(comparison);
        var table = new TextTable("figure", "baseline", "now", "change", "tolerance", "verdict");
        foreach (var f in comparison.Figures)
            table.AddRow(f.Id, Figure(f.Before, f.Unit), Figure(f.Now, f.Unit), Delta(f), $"±{N(f.Tolerance, "0.####")} {f.Unit}", ChangeText(f.Change));
        return head + "\n" + table;
    }

    /// <summary>The verdict line alone (for --quiet).</summary>
    public static string Headline(BaselineComparison comparison)
    {
        var worse = comparison.Figures.Count(f => f.Change == Change.Worse);
        var head = worse == 0
            ? $"BASELINE PASS: no figure got worse than its tolerance against {comparison.BaselinePath}"
            : $"BASELINE FAIL: {worse} figure(s) got worse than their tolerance against {comparison.BaselinePath}";
        if (comparison.DesignChanged) head += " (the design has changed since the baseline)";
        if (comparison.RunDifferences.Count > 0) head += $" (the baseline was made differently, which alone may move figures: {string.Join("; ", comparison.RunDifferences)})";
        return head;
    }
}
