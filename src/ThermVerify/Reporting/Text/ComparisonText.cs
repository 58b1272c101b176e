using System.Globalization;
using System.Text;
using ThermVerify.Check;
using ThermVerify.Check.Buffer;
using ThermVerify.Provenance;
using ThermVerify.Quantities;

namespace ThermVerify.Reporting.Text;

/// <summary>
/// Two checks side by side (an unbuffered design against a buffered one, or two op-amps): the verdicts, the same
/// budget table for both at the same temperatures (B's nearest point to each of A's), and the buffer figures.
/// </summary>
public static class ComparisonText
{
    public static string Render(CheckResult a, CheckResult b, RunProvenance runA, RunProvenance runB, int tableRows = 9)
    {
        var text = new StringBuilder();
        text.AppendLine($"thermverify compare: A = {a.Design.Name}, B = {b.Design.Name}");
        // Both ran with the same options, so one run line serves; the files line tells the designs apart.
        ProvenanceText.AppendRun(text, runA);
        ProvenanceText.AppendFiles(text, "files A ", runA);
        ProvenanceText.AppendFiles(text, "files B ", runB);
        text.AppendLine($"  A  {ReportFormat.Verdict(a)}");
        text.AppendLine($"  B  {ReportFormat.Verdict(b)}");
        text.AppendLine();
        text.AppendLine("Reported-temperature error and its causes (K), A | B:");
        var table = new TextTable("T (°C)", "A error", "A quant.", "A DC", "A settling", "A buffer", "|", "B error", "B quant.", "B DC", "B settling", "B buffer", "budget");
        var rows = Enumerable.Range(0, tableRows - 1)
            .Select(i => a.Points[(int)Math.Round(i * (a.Points.Count - 1) / (double)Math.Max(tableRows - 2, 1))])
            .Append(a.Worst).Append(Nearest(a.Points, b.Worst.Celsius)).Distinct().OrderBy(p => p.Celsius);
        foreach (var p in rows)
        {
            var q = Nearest(b.Points, p.Celsius);
            table.AddRow([N(p.Celsius, "0.##"), .. Cells(p), "|", .. Cells(q), N(Math.Min(p.BudgetKelvin, q.BudgetKelvin), "0.###")]);
        }
        text.Append(table);
        text.AppendLine();

        text.AppendLine("Figures:");
        var figures = new TextTable("figure", "A", "B");
        figures.AddRow("worst error (K)", K(a.Worst.ErrorKelvin), K(b.Worst.ErrorKelvin));
        figures.AddRow("points over budget", Count(a.Points.Count(p => !p.WithinBudget)), Count(b.Points.Count(p => !p.WithinBudget)));
        figures.AddRow("failing findings", Count(a.Findings.Count(f => f.Severity == Severity.Fail)), Count(b.Findings.Count(f => f.Severity == Severity.Fail)));
        figures.AddRow("phase margin (°)", Pm(a), Pm(b));
        figures.AddRow("headroom margin", Buf(a, x => V(x.Headroom.MinimumMarginVolts, UnitKind.Volt)), Buf(b, x => V(x.Headroom.MinimumMarginVolts, UnitKind.Volt)));
        figures.AddRow("buffer static error (max)", Buf(a, x => V(x.StaticErrors.MaxBy(s => Math.Abs(s.TotalVolts))!.TotalVolts, UnitKind.Volt)),
            Buf(b, x => V(x.StaticErrors.MaxBy(s => Math.Abs(s.TotalVolts))!.TotalVolts, UnitKind.Volt)));
        figures.AddRow("sampled noise rms (max)", Buf(a, x => V(x.Noise.Worst.RmsVolts, UnitKind.Volt)), Buf(b, x => V(x.Noise.Worst.RmsVolts, UnitKind.Volt)));
        figures.AddRow("GBW needed", Buf(a, x => x.Recovery?.NeededGainBandwidthHertz is { } g ? V(g, UnitKind.Hertz) : "none"),
            Buf(b, x => x.Recovery?.NeededGainBandwidthHertz is { } g ? V(g, UnitKind.Hertz) : "none"));
        text.Append(figures);
        text.AppendLine();
        text.AppendLine(CheckSummaryText.Caution);
        return text.ToString();
    }

    private static CheckPoint Nearest(IReadOnlyList<CheckPoint> points, double celsius) => points.MinBy(p => Math.Abs(p.Celsius - celsius))!;

    private static string[] Cells(CheckPoint p) =>
        [K(p.ErrorKelvin), K(p.Contributions.QuantisationKelvin), K(p.Contributions.DcLoadingKelvin), K(p.Contributions.SettlingKelvin), K(p.Contributions.BufferKelvin)];

    private static string Pm(CheckResult r) => Buf(r, x => x.Stability.Worst.PhaseMarginDegrees is { } pm ? N(pm, "0.0") : "no crossover");

    private static string Buf(CheckResult r, Func<Check.Buffer.BufferReport, string> f) => r.Buffer is { } b ? f(b) : "no buffer";

    private static string Count(int n) => n.ToString(CultureInfo.InvariantCulture);
    private static string V(double value, UnitKind unit) => double.IsFinite(value) ? EngineeringFormat.Format(value, unit, 4) : "n/a";
    private static string N(double value, string format) => value.ToString(format, CultureInfo.InvariantCulture);
    private static string K(double kelvin) => double.IsFinite(kelvin) ? N(kelvin, "+0.000;-0.000;0.000") : "n/a";
}
