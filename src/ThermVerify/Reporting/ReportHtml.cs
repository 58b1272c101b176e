using System.Net;
using System.Text;
using System.Text.RegularExpressions;
using ThermVerify.Provenance;
using ThermVerify.Reporting.Plots;

namespace ThermVerify.Reporting;

/// <summary>
/// The pieces every HTML report page shares: the head with its inline style, the header with verdict and short
/// caution, the design summary, the figures inline as SVG, the design echoed, the cautions and the footer.
/// </summary>
internal static partial class ReportHtml
{
    public static void AppendHead(StringBuilder html, string title, string toolVersion) => html.Append($"""
        <!DOCTYPE html>
        <html lang="en">
        <head>
        <meta charset="utf-8">
        <meta name="viewport" content="width=device-width, initial-scale=1">
        <meta name="generator" content="thermverify {E(toolVersion)}">
        <title>{E(title)}</title>
        <style>{Style}</style>
        </head>
        <body>

        """);

    /// <param name="passed">Colours the verdict; null for a page without a pass or fail (a ranking).</param>
    public static void AppendHeader(StringBuilder html, string heading, string? description, string verdict, bool? passed, IEnumerable<(string Id, string Label)> nav)
    {
        var cls = passed is { } p ? (p ? " pass" : " fail") : " neutral";
        html.Append($"""
            <header>
            <h1>{E(heading)}</h1>
            {(description is { } desc ? $"<p class=\"description\">{E(desc)}</p>" : "")}
            <p id="verdict" class="verdict{cls}">{E(verdict)}</p>
            <p class="caution-short"><strong>Caution:</strong> simulation does not replace measurement on hardware; a reading that drives a heater, charger or cut-out needs independent protection (see <a href="#cautions">Cautions</a>).</p>
            </header>
            <nav>{string.Join(" · ", nav.Select(n => $"<a href=\"#{n.Id}\">{E(n.Label)}</a>"))}</nav>

            """);
    }

    /// <summary>The design summary, then where the report came from (<see cref="RunProvenance.Lines"/>).</summary>
    public static void AppendSettings(StringBuilder html, IEnumerable<(string Label, string Value)> settings, string designFile, RunProvenance provenance)
    {
        html.Append("<section id=\"settings\"><h2>Design summary</h2>\n<table class=\"settings\">\n");
        foreach (var (label, value) in settings) html.Append($"<tr><th scope=\"row\">{E(label)}</th><td>{E(value)}</td></tr>\n");
        html.Append($"<tr><th scope=\"row\">design file</th><td><code>{E(designFile)}</code></td></tr>\n");
        foreach (var (label, value) in provenance.Lines()) html.Append($"<tr class=\"provenance\"><th scope=\"row\">{E(label)}</th><td>{E(value)}</td></tr>\n");
        html.Append("</table></section>\n");
    }

    public static void AppendFigures(StringBuilder html, IEnumerable<RenderedPlot> plots)
    {
        html.Append("<section id=\"figures\"><h2>Figures</h2>\n");
        foreach (var plot in plots)
            html.Append($"<figure id=\"figure-{plot.FileStem}\" class=\"plot\">\n{InlineSvg(plot.Svg, plot.FileStem, plot.Title)}\n<figcaption><strong>{E(plot.Title)}.</strong> {E(plot.Caption)}</figcaption>\n</figure>\n");
        html.Append("</section>\n");
    }

    public static void AppendDesignAndCautions(StringBuilder html, string designToml)
    {
        html.Append($"<section id=\"design\"><h2>Design file (normal form)</h2>\n<p>Every default made explicit, as <code>thermverify validate</code> prints it.</p>\n<pre><code>{E(designToml)}</code></pre></section>\n");
        html.Append("<section id=\"cautions\"><h2>Cautions</h2>\n<ul>\n");
        foreach (var (heading, text) in ReportCautions.All) html.Append($"<li><strong>{E(heading)}</strong> {E(text)}</li>\n");
        html.Append("</ul></section>\n");
    }

    public static void AppendFooter(StringBuilder html, string toolVersion, string schema) =>
        html.Append($"<footer>thermverify {E(toolVersion)}; every number of this report is also in <code>--json</code> output (schema {schema}).</footer>\n</body>\n</html>\n");

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

    [GeneratedRegex(@"<\?xml[^>]*\?>")] private static partial Regex XmlDeclaration();
    [GeneratedRegex("id=\"([^\"]+)\"")] private static partial Regex IdAttribute();
    [GeneratedRegex(@"url\(#([^)]+)\)")] private static partial Regex UrlReference();
    [GeneratedRegex("(href|xlink:href)=\"#([^\"]+)\"")] private static partial Regex HrefReference();
    [GeneratedRegex("<svg ")] private static partial Regex SvgOpen();
    [GeneratedRegex("<svg [^>]*width=\"([0-9.]+)\"[^>]*height=\"([0-9.]+)\"")] private static partial Regex SvgSize();

    public static string E(string text) => WebUtility.HtmlEncode(text);

    private const string Style = """
        body{font-family:"DejaVu Sans",Verdana,Arial,sans-serif;max-width:1100px;margin:0 auto;padding:1em 1.5em;color:#222;line-height:1.4}
        h1{font-size:1.6em;margin-bottom:.2em}h2{border-bottom:1px solid #ccc;padding-bottom:.2em;margin-top:1.6em}
        .description{color:#555;margin-top:0}
        .verdict{font-weight:bold;padding:.5em .8em;border-radius:4px}
        .verdict.neutral{background:#eef3f8;border-left:6px solid #1f77b4}.verdict.pass{background:#e3f4e3;border-left:6px solid #2ca02c}.verdict.fail{background:#fbe4e4;border-left:6px solid #d62728}
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
