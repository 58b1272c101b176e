using System.Text;
using ThermVerify.Baselines;
using static ThermVerify.Reporting.Text.TextNumbers;

namespace ThermVerify.Reporting.Text;

/// <summary>What `baseline` prints: where the baseline went and its figures with their tolerances.</summary>
public static class BaselineText
{
    public static string Render(string path, Baseline baseline, bool checkPassed)
    {
        var text = new StringBuilder();
        text.AppendLine($"baseline written: {path} ({baseline.Figures.Count} figures; the check itself {(checkPassed ? "passes" : "fails")})");
        if (baseline.Provenance is { } provenance) ProvenanceText.Append(text, provenance);
        var table = new TextTable("figure", "value", "better", "tolerance");
        foreach (var f in baseline.Figures)
            table.AddRow(f.Id, f.Value is { } v ? Invariant($"{v:0.####} {f.Unit}") : "none", f.Better == Better.Lower ? "lower" : "higher",
                Invariant($"±{f.Tolerance:0.####} {f.Unit}"));
        text.Append(table);
        return text.ToString();
    }
}
