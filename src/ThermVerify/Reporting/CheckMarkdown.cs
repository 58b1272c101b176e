using System.Text;
using ThermVerify.Baselines;
using ThermVerify.Check;
using ThermVerify.Quantities;
using static ThermVerify.Reporting.ReportFormat;

namespace ThermVerify.Reporting;

/// <summary>The report as Markdown for a pull request: the same sections as the HTML page, figures as PNG files beside it.</summary>
internal static class CheckMarkdown
{
    /// <param name="plotFolder">Folder of the PNG files, relative to the Markdown file.</param>
    public static string Render(CheckReport report, string plotFolder = "plots")
    {
        var r = report.Result;
        var md = new StringBuilder();
        ReportMarkdown.AppendHeader(md, $"thermverify check: {r.Design.Name}", r.Design.Description, Verdict(r));
        ReportMarkdown.AppendSettings(md, Settings(r), report.DesignFile, report.Provenance);

        if (report.Baseline is { } b)
        {
            md.AppendLine("## Baseline comparison");
            md.AppendLine();
            md.AppendLine($"{(b.Passed ? "No figure got worse than its tolerance" : $"**{b.Figures.Count(f => f.Change == Change.Worse)} figure(s) got worse than their tolerance**")} against `{b.BaselinePath}`" +
                          $"{(b.DesignChanged ? " (the design has changed since the baseline was written)" : "")}.");
            md.AppendLine();
            if (b.RunDifferences.Count > 0)
            {
                md.AppendLine("The baseline was made differently, which alone may move figures:");
                md.AppendLine();
                foreach (var d in b.RunDifferences) md.AppendLine($"- {ReportMarkdown.UserText(d)}");
                md.AppendLine();
            }
            md.AppendLine("| figure | baseline | now | change | tolerance | verdict |\n|---|--:|--:|--:|--:|---|");
            foreach (var f in b.Figures)
                md.AppendLine($"| {Cell(f.Description)} (`{f.Id}`) | {Figure(f.Before, f.Unit)} | {Figure(f.Now, f.Unit)} | {Delta(f)} | ±{N(f.Tolerance, "0.####")} {f.Unit} | {ChangeText(f.Change)} |");
            md.AppendLine();
        }

        ReportMarkdown.AppendFigures(md, report.Plots, plotFolder);

        md.Append(BufferSectionRender.Markdown(r.Buffer));
        md.Append(BufferSectionRender.Markdown(NoiseSections.Build(r.Noise)));
        md.Append(BufferSectionRender.Markdown(DeltaSigmaSections.Build(r.DeltaSigma)));
        md.AppendLine("## Findings");
        md.AppendLine();
        if (r.Findings.Count == 0) md.AppendLine("None: every effect is within ½ LSB.\n");
        foreach (var f in r.Findings)
        {
            md.AppendLine($"### {f.Severity.ToString().ToUpperInvariant()} `{f.Id}`: {Cell(f.Title)}");
            md.AppendLine();
            md.AppendLine($"{C(f.FromCelsius)} to {C(f.ToCelsius)}, worst at {C(f.WorstCelsius)}: {V(f.SizeVolts, Quantities.UnitKind.Volt)} = {N(f.SizeLsb, "+0.##;-0.##")} LSB = {K(f.SizeKelvin)}.");
            md.AppendLine();
            md.AppendLine($"Cause: {Cell(f.Cause)}" + (f.EstimateVolts is { } e && f.SimulatedVolts is { } s
                ? $"; closed form {V(e, Quantities.UnitKind.Volt)}, simulated {V(s, Quantities.UnitKind.Volt)}." : "."));
            md.AppendLine();
            if (f.RemedyNote is { } note)
            {
                md.AppendLine($"Remedies: {Cell(note)}");
                md.AppendLine();
            }
            foreach (var m in f.Remedies)
            {
                md.AppendLine($"- **{Cell(m.Action)}{(m.Value is null ? "" : " " + RemedyValue(m))}** (`{m.Key}`): {Cell(m.Method)}. {Cell(m.Proof)}.");
                foreach (var t in m.Together)
                    md.AppendLine($"  - together with **{Cell(t.Action)}{(t.Value is null ? "" : " " + RemedyValue(t))}** (`{t.Key}`): {Cell(t.Method)}");
            }
            if (f.Remedies.Count > 0) md.AppendLine();
        }

        md.AppendLine("## Points");
        md.AppendLine();
        md.AppendLine("The error split by cause, in K (reported minus true), at selected points; the columns add up to the error, and an effect the design does not have is left out. \"reading\" is the precharge case, the sample (first conversion or steady state) and the INL sign the worst reading at that temperature has. The HTML report and `--json` have every point.");
        md.AppendLine();
        var headers = PointHeaders(r.Points);
        md.AppendLine("| " + string.Join(" | ", headers) + " |");
        md.AppendLine("|" + string.Concat(headers.Select(_ => "--:|")));
        foreach (var p in Selected(r.Points, r.Worst, 9))
            md.AppendLine("| " + string.Join(" | ", PointCells(p, r.Points)) + " |");
        md.AppendLine();

        ReportMarkdown.AppendDesignAndCautions(md, report.DesignToml, report.Provenance.ToolVersion);
        return md.ToString();
    }

    private static string Cell(string text) => ReportMarkdown.Cell(text);
}
