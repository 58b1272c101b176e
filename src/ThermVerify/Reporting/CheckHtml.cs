using System.Text;
using ThermVerify.Baselines;
using ThermVerify.Check;
using ThermVerify.Quantities;
using static ThermVerify.Reporting.ReportFormat;

namespace ThermVerify.Reporting;

/// <summary>
/// The report as one self-contained HTML page: styles inline, figures inline as SVG, no script and no outside
/// reference, so it can be archived as a CI artefact and opened anywhere.
/// </summary>
internal static class CheckHtml
{
    public static string Render(CheckReport report)
    {
        var r = report.Result;
        var html = new StringBuilder();
        ReportHtml.AppendHead(html, $"thermverify check: {r.Design.Name}", report.Provenance.ToolVersion);
        ReportHtml.AppendHeader(html, $"thermverify check: {r.Design.Name}", r.Design.Description, Verdict(r), r.Passed,
        [
            ("settings", "Design summary"), .. report.Baseline is null ? Array.Empty<(string, string)>() : [("baseline", "Baseline")],
            ("figures", "Figures"), ("findings", "Findings"), ("points", "Points"), ("design", "Design file"), ("cautions", "Cautions"),
        ]);
        ReportHtml.AppendSettings(html, Settings(r), report.DesignFile, report.Provenance);

        if (report.Baseline is { } baseline) AppendBaseline(html, baseline);

        ReportHtml.AppendFigures(html, report.Plots);

        html.Append(BufferSectionRender.Html(r.Buffer));
        html.Append(BufferSectionRender.Html(NoiseSections.Build(r.Noise)));
        html.Append(BufferSectionRender.Html(DeltaSigmaSections.Build(r.DeltaSigma)));
        AppendFindings(html, r);
        AppendPoints(html, r);

        ReportHtml.AppendDesignAndCautions(html, report.DesignToml);
        ReportHtml.AppendFooter(html, report.Provenance.ToolVersion, CheckJson.Schema);
        return html.ToString();
    }

    private static void AppendBaseline(StringBuilder html, BaselineComparison b)
    {
        html.Append($"<section id=\"baseline\"><h2>Baseline comparison</h2>\n<p class=\"verdict {(b.Passed ? "pass" : "fail")}\">" +
                    $"{(b.Passed ? "No figure got worse than its tolerance" : $"{b.Figures.Count(f => f.Change == Change.Worse)} figure(s) got worse than their tolerance")} " +
                    $"against <code>{E(b.BaselinePath)}</code>{(b.DesignChanged ? " (the design has changed since the baseline was written)" : "")}.</p>\n");
        if (b.RunDifferences.Count > 0)
            html.Append($"<p>The baseline was made differently, which alone may move figures:</p>\n<ul>{string.Concat(b.RunDifferences.Select(d => $"<li>{E(d)}</li>"))}</ul>\n");
        html.Append("<table><thead><tr><th>figure</th><th>baseline</th><th>now</th><th>change</th><th>tolerance</th><th>verdict</th></tr></thead><tbody>\n");
        foreach (var f in b.Figures)
            html.Append($"<tr class=\"{f.Change.ToString().ToLowerInvariant()}\"><td>{E(f.Description)}<br><code>{E(f.Id)}</code></td><td class=\"num\">{E(Figure(f.Before, f.Unit))}</td>" +
                        $"<td class=\"num\">{E(Figure(f.Now, f.Unit))}</td><td class=\"num\">{E(Delta(f))}</td><td class=\"num\">±{E(N(f.Tolerance, "0.####"))} {E(f.Unit)}</td><td>{E(ChangeText(f.Change))}</td></tr>\n");
        html.Append("</tbody></table></section>\n");
    }

    private static void AppendFindings(StringBuilder html, CheckResult r)
    {
        html.Append("<section id=\"findings\"><h2>Findings</h2>\n");
        if (r.Findings.Count == 0) html.Append("<p>None: every effect is within ½ LSB.</p>\n");
        foreach (var f in r.Findings)
        {
            var severity = f.Severity.ToString().ToLowerInvariant();
            html.Append($"<article class=\"finding {severity}\" id=\"finding-{E(f.Id)}\">\n<h3><span class=\"badge {severity}\">{severity.ToUpperInvariant()}</span> {E(f.Id)}: {E(f.Title)}</h3>\n");
            html.Append($"<p>{E(C(f.FromCelsius))} to {E(C(f.ToCelsius))}, worst at {E(C(f.WorstCelsius))}: {E(V(f.SizeVolts, Quantities.UnitKind.Volt))} = {E(N(f.SizeLsb, "+0.##;-0.##"))} LSB = {E(K(f.SizeKelvin))}</p>\n");
            html.Append($"<p><em>Cause:</em> {E(f.Cause)}" + (f.EstimateVolts is { } e && f.SimulatedVolts is { } s
                ? $"; closed form {E(V(e, Quantities.UnitKind.Volt))}, simulated {E(V(s, Quantities.UnitKind.Volt))}" : "") + "</p>\n");
            if (f.RemedyNote is { } note) html.Append($"<p><em>Remedies:</em> {E(note)}</p>\n");
            if (f.Remedies.Count > 0)
            {
                html.Append("<ul class=\"remedies\">\n");
                foreach (var m in f.Remedies)
                {
                    html.Append($"<li><strong>{E(m.Action)}{(m.Value is null ? "" : " " + E(RemedyValue(m)))}</strong> <code>{E(m.Key)}</code>");
                    foreach (var t in m.Together)
                        html.Append($"<br>together with <strong>{E(t.Action)}{(t.Value is null ? "" : " " + E(RemedyValue(t)))}</strong> <code>{E(t.Key)}</code>");
                    html.Append($"<br><span class=\"method\">{E(m.Method)}. {E(m.Proof)}.</span></li>\n");
                }
                html.Append("</ul>\n");
            }
            html.Append("</article>\n");
        }
        html.Append("</section>\n");
    }

    private static void AppendPoints(StringBuilder html, CheckResult r)
    {
        html.Append("<section id=\"points\"><h2>Points</h2>\n<p>The error split by cause, in K (reported minus true): the columns add up to the error, and an effect the design does not have is left out. <em>reading</em> is the precharge case, the sample (first conversion or steady state) and the INL sign of the worst reading at that temperature. Selected points below; every point in the table that follows.</p>\n");
        AppendPointTable(html, [.. Selected(r.Points, r.Worst, 9)], r.Points, r.Worst);
        html.Append($"<details><summary>All {r.Points.Count} points</summary>\n");
        AppendPointTable(html, r.Points, r.Points, r.Worst);
        html.Append("</details></section>\n");
    }

    private static void AppendPointTable(StringBuilder html, IReadOnlyList<CheckPoint> rows, IReadOnlyList<CheckPoint> points, CheckPoint worst)
    {
        html.Append("<table class=\"points\"><thead><tr>");
        foreach (var h in PointHeaders(points)) html.Append($"<th>{E(h)}</th>");
        html.Append("</tr></thead><tbody>\n");
        foreach (var p in rows)
        {
            var cls = (p == worst ? "worst " : "") + (p.WithinBudget ? "" : "over");
            html.Append($"<tr{(cls.Trim().Length > 0 ? $" class=\"{cls.Trim()}\"" : "")}>");
            foreach (var c in PointCells(p, points)) html.Append($"<td class=\"num\">{E(c)}</td>");
            html.Append("</tr>\n");
        }
        html.Append("</tbody></table>\n");
    }

    private static string E(string text) => ReportHtml.E(text);
}
