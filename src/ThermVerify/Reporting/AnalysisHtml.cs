using System.Text;
using ThermVerify.Reporting.Text;
using static ThermVerify.Reporting.ReportHtml;

namespace ThermVerify.Reporting;

/// <summary>An analysis report as one self-contained HTML page, in the frame of the check report (see <see cref="ReportHtml"/>).</summary>
internal static class AnalysisHtml
{
    public static string Render(AnalysisReport report)
    {
        var html = new StringBuilder();
        AppendHead(html, report.Heading, report.Provenance.ToolVersion);
        AppendHeader(html, report.Heading, report.Description, report.Verdict, report.Passed,
        [
            ("settings", "Design summary"), ("figures", "Figures"), .. report.Sections.Select(s => (s.Id, s.Heading)),
            ("design", "Design file"), ("cautions", "Cautions"),
        ]);
        AppendSettings(html, report.Settings, report.DesignFile, report.Provenance);
        AppendFigures(html, report.Plots);
        foreach (var section in report.Sections)
        {
            html.Append($"<section id=\"{E(section.Id)}\"><h2>{E(section.Heading)}</h2>\n");
            foreach (var p in section.Paragraphs) html.Append($"<p>{E(p)}</p>\n");
            foreach (var table in section.Tables) AppendTable(html, table);
            html.Append("</section>\n");
        }
        AppendDesignAndCautions(html, report.DesignToml);
        AppendFooter(html, report.Provenance.ToolVersion, report.JsonSchema);
        return html.ToString();
    }

    private static void AppendTable(StringBuilder html, ReportTable table)
    {
        html.Append("<table><thead><tr>");
        foreach (var h in table.Headers) html.Append($"<th>{E(h)}</th>");
        html.Append("</tr></thead><tbody>\n");
        foreach (var row in table.Rows)
        {
            html.Append("<tr>");
            foreach (var cell in row) html.Append(TextTable.LooksNumeric(cell) ? $"<td class=\"num\">{E(cell)}</td>" : $"<td>{E(cell)}</td>");
            html.Append("</tr>\n");
        }
        html.Append("</tbody></table>\n");
    }
}
