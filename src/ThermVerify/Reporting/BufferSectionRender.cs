using System.Net;
using System.Text;
using ThermVerify.Reporting.Text;
using ThermVerify.Check.Buffer;

namespace ThermVerify.Reporting;

/// <summary>The buffer sections (and the noise section, built the same way) as terminal text, Markdown and HTML fragments.</summary>
internal static class BufferSectionRender
{
    public static string Text(BufferReport? buffer) => buffer is null ? "" : Text(BufferSections.Build(buffer));

    public static string Text(IReadOnlyList<BufferSection> sections)
    {
        var text = new StringBuilder();
        foreach (var s in sections)
        {
            text.AppendLine($"{s.Title}:");
            foreach (var n in s.Notes) text.AppendLine($"  {n}");
            if (s.Rows.Count > 0)
            {
                var table = new TextTable([.. s.Headers]);
                foreach (var r in s.Rows) table.AddRow(r);
                text.Append(table);
            }
            text.AppendLine();
        }
        return text.ToString();
    }

    public static string Markdown(BufferReport? buffer) => buffer is null ? "" : Markdown(BufferSections.Build(buffer, staticRows: 9));

    public static string Markdown(IReadOnlyList<BufferSection> sections)
    {
        var md = new StringBuilder();
        foreach (var s in sections)
        {
            md.AppendLine($"## {s.Title}");
            md.AppendLine();
            foreach (var n in s.Notes) md.AppendLine($"{Cell(n)}\n");
            if (s.Rows.Count > 0)
            {
                md.AppendLine("| " + string.Join(" | ", s.Headers.Select(Cell)) + " |");
                md.AppendLine("|" + string.Concat(s.Headers.Select(_ => "--:|")));
                foreach (var r in s.Rows) md.AppendLine("| " + string.Join(" | ", r.Select(Cell)) + " |");
                md.AppendLine();
            }
        }
        return md.ToString();
    }

    public static string Html(BufferReport? buffer) => buffer is null ? "" : Html(BufferSections.Build(buffer, staticRows: 13));

    public static string Html(IReadOnlyList<BufferSection> sections)
    {
        var html = new StringBuilder();
        foreach (var s in sections)
        {
            html.Append($"<section id=\"{s.Id}\"><h2>{E(s.Title)}</h2>\n");
            foreach (var n in s.Notes) html.Append($"<p>{E(n)}</p>\n");
            if (s.Rows.Count > 0)
            {
                html.Append("<table><thead><tr>" + string.Concat(s.Headers.Select(h => $"<th>{E(h)}</th>")) + "</tr></thead><tbody>\n");
                foreach (var r in s.Rows) html.Append("<tr>" + string.Concat(r.Select(c => $"<td class=\"num\">{E(c)}</td>")) + "</tr>\n");
                html.Append("</tbody></table>\n");
            }
            html.Append("</section>\n");
        }
        return html.ToString();
    }

    private static string E(string text) => WebUtility.HtmlEncode(text);
    private static string Cell(string text) => text.Replace("|", "\\|").Replace("\n", " ");
}
