using System.Text;
using ThermVerify.Check;
using static ThermVerify.Reporting.Text.TextNumbers;

namespace ThermVerify.Reporting.Text;

/// <summary>What changed between two checks of the same design (the watch loop's report after each save).</summary>
public static class ChangeText
{
    public static string Render(CheckResult before, CheckResult now)
    {
        var text = new StringBuilder();
        var verdict = Verdict(before) == Verdict(now) ? $"verdict {Verdict(now)} (unchanged)" : $"verdict {Verdict(before)} → {Verdict(now)}";
        text.AppendLine($"  {verdict}; worst error {Worst(before)} → {Worst(now)}");
        var was = before.Findings.ToDictionary(f => f.Id, f => f.Severity);
        var isNow = now.Findings.ToDictionary(f => f.Id, f => f.Severity);
        foreach (var (id, severity) in isNow.Where(f => !was.ContainsKey(f.Key)))
            text.AppendLine($"  finding added: {Name(severity)} {id}");
        foreach (var (id, severity) in was.Where(f => !isNow.ContainsKey(f.Key)))
            text.AppendLine($"  finding cleared: {Name(severity)} {id}");
        foreach (var (id, severity) in isNow.Where(f => was.TryGetValue(f.Key, out var old) && old != f.Value))
            text.AppendLine($"  finding {id}: {Name(was[id])} → {Name(severity)}");
        return text.ToString();
    }

    private static string Verdict(CheckResult r) => r.Passed ? "PASS" : "FAIL";

    private static string Worst(CheckResult r) =>
        Invariant($"{Format(r.Worst.ErrorKelvin, "+0.000;-0.000;0.000", "unreadable")} K at {r.Worst.Celsius:0.##} °C");

    private static string Name(Severity severity) => severity.ToString().ToUpperInvariant();
}
