using System.Text;
using ThermVerify.Reporting.Text;
using static ThermVerify.Reporting.ReportMarkdown;

namespace ThermVerify.Reporting;

/// <summary>An analysis report as Markdown for a pull request: the same sections as the HTML page, figures as PNG files beside it.</summary>
internal static class AnalysisMarkdown
{
    /// <param name="plotFolder">Folder of the PNG files, relative to the Markdown file.</param>
    public static string Render(AnalysisReport report, string plotFolder = "plots")
    {
        var md = new StringBuilder();
        AppendHeader(md, report.Heading, report.Description, report.Verdict);
        AppendSettings(md, report.Settings, report.DesignFile, report.Provenance);
        AppendFigures(md, report.Plots, plotFolder);
        foreach (var section in report.Sections)
        {
            md.AppendLine($"## {Cell(section.Heading)}");
            md.AppendLine();
            foreach (var p in section.Paragraphs) md.AppendLine($"{Cell(p)}\n");
            foreach (var table in section.Tables)
            {
                md.AppendLine("| " + string.Join(" | ", table.Headers.Select(Cell)) + " |");
                // Alignment from the first row: numbers right, text left.
                var first = table.Rows.FirstOrDefault() ?? [];
                md.AppendLine("|" + string.Concat(table.Headers.Select((_, i) => i < first.Count && TextTable.LooksNumeric(first[i]) ? "--:|" : "---|")));
                foreach (var row in table.Rows) md.AppendLine("| " + string.Join(" | ", row.Select(Cell)) + " |");
                md.AppendLine();
            }
        }
        AppendDesignAndCautions(md, report.DesignToml, report.Provenance.ToolVersion);
        return md.ToString();
    }
}
