using System.Net;
using System.Text;
using System.Text.RegularExpressions;
using ThermVerify.Baselines;
using ThermVerify.Verification;
using static ThermVerify.Reporting.ReportFormat;

namespace ThermVerify.Reporting;

/// <summary>
/// The report as one self-contained HTML page: styles inline, figures inline as SVG, no script and no outside
/// reference, so it can be archived as a CI artefact and opened anywhere.
/// </summary>
public static partial class CheckHtml
{
    public static string Render(CheckReport report)
    {
        var r = report.Result;
        var html = new StringBuilder();
        html.Append($"""
            <!DOCTYPE html>
            <html lang="en">
            <head>
            <meta charset="utf-8">
            <meta name="viewport" content="width=device-width, initial-scale=1">
            <meta name="generator" content="thermverify {E(report.ToolVersion)}">
            <title>thermverify check: {E(r.Design.Name)}</title>
            <style>{Style}</style>
            </head>
            <body>
            <header>
            <h1>thermverify check: {E(r.Design.Name)}</h1>
            {(r.Design.Description is { } desc ? $"<p class=\"description\">{E(desc)}</p>" : "")}
            <p id="verdict" class="verdict {(r.Passed ? "pass" : "fail")}">{E(Verdict(r))}</p>
            <p class="caution-short"><strong>Caution:</strong> simulation does not replace measurement on hardware; a reading that drives a heater, charger or cut-out needs independent protection (see <a href="#cautions">Cautions</a>).</p>
            </header>
            <nav><a href="#settings">Design summary</a> · {(report.Baseline is null ? "" : "<a href=\"#baseline\">Baseline</a> · ")}<a href="#figures">Figures</a> · <a href="#findings">Findings</a> · <a href="#points">Points</a> · <a href="#design">Design file</a> · <a href="#cautions">Cautions</a></nav>

            """);

        html.Append("<section id=\"settings\"><h2>Design summary</h2>\n<table class=\"settings\">\n");
        foreach (var (label, value) in Settings(r)) html.Append($"<tr><th scope=\"row\">{E(label)}</th><td>{E(value)}</td></tr>\n");
        html.Append($"<tr><th scope=\"row\">design file</th><td><code>{E(report.DesignFile)}</code></td></tr>\n</table></section>\n");

        if (report.Baseline is { } baseline) AppendBaseline(html, baseline);

        html.Append("<section id=\"figures\"><h2>Figures</h2>\n");
        foreach (var plot in report.Plots)
            html.Append($"<figure id=\"figure-{plot.FileStem}\" class=\"plot\">\n{InlineSvg(plot.Svg, plot.FileStem, plot.Title)}\n<figcaption><strong>{E(plot.Title)}.</strong> {E(plot.Caption)}</figcaption>\n</figure>\n");
        html.Append("</section>\n");

        html.Append(BufferSectionRender.Html(r.Buffer));
        AppendFindings(html, r);
        AppendPoints(html, r);

        html.Append($"<section id=\"design\"><h2>Design file (normal form)</h2>\n<p>Every default made explicit, as <code>thermverify validate</code> prints it.</p>\n<pre><code>{E(report.DesignToml)}</code></pre></section>\n");
        html.Append("<section id=\"cautions\"><h2>Cautions</h2>\n<ul>\n");
        foreach (var (heading, text) in ReportCautions.All) html.Append($"<li><strong>{E(heading)}</strong> {E(text)}</li>\n");
        html.Append("</ul></section>\n");
        html.Append($"<footer>thermverify {E(report.ToolVersion)}; every number of this report is also in <code>--json</code> output (schema {CheckJson.Schema}).</footer>\n</body>\n</html>\n");
        return html.ToString();
    }

    private static void AppendBaseline(StringBuilder html, BaselineComparison b)
    {
        html.Append($"<section id=\"baseline\"><h2>Baseline comparison</h2>\n<p class=\"verdict {(b.Passed ? "pass" : "fail")}\">" +
                    $"{(b.Passed ? "No figure got worse than its tolerance" : $"{b.Figures.Count(f => f.Change == Change.Worse)} figure(s) got worse than their tolerance")} " +
                    $"against <code>{E(b.BaselinePath)}</code>{(b.DesignChanged ? " (the design has changed since the baseline was written)" : "")}.</p>\n");
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
            if (f.Remedies.Count > 0)
            {
                html.Append("<ul class=\"remedies\">\n");
                foreach (var m in f.Remedies)
                    html.Append($"<li><strong>{E(m.Action)}{(m.Value is null ? "" : " " + E(RemedyValue(m)))}</strong> <code>{E(m.Key)}</code><br><span class=\"method\">{E(m.Method)}</span></li>\n");
                html.Append("</ul>\n");
            }
            html.Append("</article>\n");
        }
        html.Append("</section>\n");
    }

    private static void AppendPoints(StringBuilder html, CheckResult r)
    {
        html.Append("<section id=\"points\"><h2>Points</h2>\n<p>The error split by cause, in K (reported minus true). Selected points below; every point in the table that follows.</p>\n");
        AppendPointTable(html, [.. Selected(r.Points, r.Worst, 9)], r.Worst);
        html.Append($"<details><summary>All {r.Points.Count} points</summary>\n");
        AppendPointTable(html, r.Points, r.Worst);
        html.Append("</details></section>\n");
    }

    private static void AppendPointTable(StringBuilder html, IReadOnlyList<CheckPoint> points, CheckPoint worst)
    {
        html.Append("<table class=\"points\"><thead><tr>");
        foreach (var h in PointHeaders) html.Append($"<th>{E(h)}</th>");
        html.Append("</tr></thead><tbody>\n");
        foreach (var p in points)
        {
            var cls = (p == worst ? "worst " : "") + (p.WithinBudget ? "" : "over");
            html.Append($"<tr{(cls.Trim().Length > 0 ? $" class=\"{cls.Trim()}\"" : "")}>");
            foreach (var c in PointCells(p)) html.Append($"<td class=\"num\">{E(c)}</td>");
            html.Append("</tr>\n");
        }
        html.Append("</tbody></table>\n");
    }

    /// <summary>
    /// An SVG document as an inline element: without its XML declaration, scaling with the page, with its ids
    /// prefixed so that the clip paths of one figure never resolve to another's.
    /// </summary>
    internal static string InlineSvg(string svg, string prefix, string title)
    {
        var body = XmlDeclaration().Replace(svg, "").Trim();
        body = IdAttribute().Replace(body, m => $"id=\"{prefix}-{m.Groups[1].Value}\"");
        body = UrlReference().Replace(body, m => $"url(#{prefix}-{m.Groups[1].Value})");
        body = HrefReference().Replace(body, m => $"{m.Groups[1].Value}=\"#{prefix}-{m.Groups[2].Value}\"");
        var size = SvgSize().Match(body);
        var viewBox = !body.Contains("viewBox") && size.Success ? $"viewBox=\"0 0 {size.Groups[1].Value} {size.Groups[2].Value}\" " : "";
        return SvgOpen().Replace(body, $"<svg role=\"img\" aria-label=\"{E(title)}\" class=\"plot-svg\" {viewBox}", 1);
    }

    private static string E(string text) => WebUtility.HtmlEncode(text);

    [GeneratedRegex(@"<\?xml[^>]*\?>")] private static partial Regex XmlDeclaration();
    [GeneratedRegex("id=\"([^\"]+)\"")] private static partial Regex IdAttribute();
    [GeneratedRegex(@"url\(#([^)]+)\)")] private static partial Regex UrlReference();
    [GeneratedRegex("(href|xlink:href)=\"#([^\"]+)\"")] private static partial Regex HrefReference();
    [GeneratedRegex("<svg ")] private static partial Regex SvgOpen();
    [GeneratedRegex("<svg [^>]*width=\"([0-9.]+)\"[^>]*height=\"([0-9.]+)\"")] private static partial Regex SvgSize();

    private const string Style = """
        body{font-family:"DejaVu Sans",Verdana,Arial,sans-serif;max-width:1100px;margin:0 auto;padding:1em 1.5em;color:#222;line-height:1.4}
        h1{font-size:1.6em;margin-bottom:.2em}h2{border-bottom:1px solid #ccc;padding-bottom:.2em;margin-top:1.6em}
        .description{color:#555;margin-top:0}
        .verdict{font-weight:bold;padding:.5em .8em;border-radius:4px}
        .verdict.pass{background:#e3f4e3;border-left:6px solid #2ca02c}.verdict.fail{background:#fbe4e4;border-left:6px solid #d62728}
        .caution-short{background:#fff6dd;border-left:6px solid #e0a800;padding:.4em .8em}
        nav{margin:1em 0;font-size:.95em}
        table{border-collapse:collapse;margin:.6em 0;font-size:.9em}
        th,td{border:1px solid #ddd;padding:.25em .5em;vertical-align:top}th{background:#f3f3f3;text-align:left}
        td.num{text-align:right;font-variant-numeric:tabular-nums;white-space:nowrap}
        table.settings th{width:7em}
        tr.over td{background:#fdf1f1}tr.worst td{font-weight:bold}tr.worse td{background:#fbe4e4}tr.better td{background:#e9f6e9}
        figure.plot{margin:1.2em 0;text-align:center}.plot-svg{width:100%;height:auto;max-width:960px;border:1px solid #eee}
        figcaption{font-size:.9em;color:#444;text-align:left;max-width:960px;margin:.3em auto}
        article.finding{border:1px solid #ddd;border-radius:4px;padding:.2em 1em;margin:.8em 0}
        article.finding.fail{border-left:6px solid #d62728}article.finding.warn{border-left:6px solid #e0a800}article.finding.note{border-left:6px solid #1f77b4}
        .badge{font-size:.75em;padding:.1em .4em;border-radius:3px;color:#fff;vertical-align:middle}
        .badge.fail{background:#d62728}.badge.warn{background:#b8860b}.badge.note{background:#1f77b4}
        .method{color:#555;font-size:.9em}
        pre{background:#f7f7f7;border:1px solid #e3e3e3;padding:.8em;overflow-x:auto;font-size:.85em}
        footer{margin-top:2em;color:#666;font-size:.85em}
        """;
}
