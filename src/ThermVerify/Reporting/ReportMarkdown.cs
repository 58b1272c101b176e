using System.Text;
using ThermVerify.Provenance;
using ThermVerify.Reporting.Plots;

namespace ThermVerify.Reporting;

/// <summary>The pieces every Markdown report shares, in the same order as the HTML page: header, summary, figures, design, cautions.</summary>
internal static class ReportMarkdown
{
    public static void AppendHeader(StringBuilder md, string heading, string? description, string verdict)
    {
        md.AppendLine($"# {UserText(heading)}");
        md.AppendLine();
        if (description is { } d) md.AppendLine($"{UserText(d)}\n");
        md.AppendLine($"**{Cell(verdict)}**");
        md.AppendLine();
        md.AppendLine("> **Caution:** simulation does not replace measurement on hardware; a reading that drives a heater, charger or cut-out needs independent protection (see Cautions below).");
        md.AppendLine();
    }

    public static void AppendSettings(StringBuilder md, IEnumerable<(string Label, string Value)> settings, string designFile, RunProvenance provenance)
    {
        md.AppendLine("| | |\n|---|---|");
        foreach (var (label, value) in settings) md.AppendLine($"| {label} | {Cell(value)} |");
        md.AppendLine($"| design file | {UserText(designFile)} |");
        foreach (var (label, value) in provenance.Lines()) md.AppendLine($"| {label} | {UserText(value)} |");
        md.AppendLine();
    }

    /// <param name="plotFolder">Folder of the PNG files, relative to the Markdown file.</param>
    public static void AppendFigures(StringBuilder md, IEnumerable<RenderedPlot> plots, string plotFolder)
    {
        md.AppendLine("## Figures");
        md.AppendLine();
        foreach (var p in plots)
        {
            md.AppendLine($"![{p.Title}]({plotFolder}/{p.FileStem}.png)");
            md.AppendLine();
            md.AppendLine($"*{Cell(p.Title)}.* {Cell(p.Caption)}");
            md.AppendLine();
        }
    }

    public static void AppendDesignAndCautions(StringBuilder md, string designToml, string toolVersion)
    {
        md.AppendLine("<details><summary>Design file (normal form)</summary>");
        md.AppendLine();
        md.AppendLine("```toml");
        md.Append(designToml.TrimEnd('\n'));
        md.AppendLine();
        md.AppendLine("```");
        md.AppendLine();
        md.AppendLine("</details>");
        md.AppendLine();
        md.AppendLine("## Cautions");
        md.AppendLine();
        foreach (var (heading, text) in ReportCautions.All) md.AppendLine($"- **{heading}** {text}");
        md.AppendLine();
        md.AppendLine($"thermverify {toolVersion}");
    }

    /// <summary>Text safe inside a Markdown table cell and paragraph: pipes escaped, no line breaks.</summary>
    public static string Cell(string text) => text.Replace("|", "\\|").Replace("\n", " ");

    /// <summary>
    /// Text the user wrote (a design's name and description, a path) as plain Markdown text: every character Markdown
    /// or HTML gives a meaning is escaped with a backslash, so a name cannot add a link, an image, markup or a table cell.
    /// </summary>
    public static string UserText(string text)
    {
        var b = new StringBuilder(text.Length + 8);
        foreach (var c in text)
        {
            if (c is '\\' or '`' or '*' or '_' or '{' or '}' or '[' or ']' or '(' or ')' or '<' or '>' or '#' or '+' or '-' or '!' or '|' or '~' or '&' or '=')
                b.Append('\\');
            b.Append(c is '\n' or '\r' ? ' ' : c);
        }
        return b.ToString();
    }
}
