using ThermVerify.Files;

namespace ThermVerify.Reporting;

/// <summary>
/// Writes a report folder: report.html (self-contained), report.md and plots/*.png and *.svg. Every file is
/// written atomically; existing files are replaced only when asked, and that is decided before anything is written,
/// so a refused run leaves the folder as it was.
/// </summary>
public static class ReportDirectory
{
    public const string HtmlFile = "report.html";
    public const string MarkdownFile = "report.md";
    public const string PlotFolder = "plots";

    /// <returns>The files written, full paths.</returns>
    public static IReadOnlyList<string> Write(CheckReport report, string directory, bool overwrite) =>
        Write(CheckHtml.Render(report), CheckMarkdown.Render(report, PlotFolder), report.Plots, directory, overwrite);

    /// <summary>As <see cref="Write(CheckReport, string, bool)"/>, with the page's HTML passed through <paramref name="finishHtml"/> first.</summary>
    internal static IReadOnlyList<string> Write(CheckReport report, string directory, bool overwrite, Func<string, string> finishHtml) =>
        Write(finishHtml(CheckHtml.Render(report)), CheckMarkdown.Render(report, PlotFolder), report.Plots, directory, overwrite);

    /// <returns>The files written, full paths.</returns>
    public static IReadOnlyList<string> Write(AnalysisReport report, string directory, bool overwrite) =>
        Write(AnalysisHtml.Render(report), AnalysisMarkdown.Render(report, PlotFolder), report.Plots, directory, overwrite);

    /// <summary>Refuses before any work is done when the folder holds a report and replacing it was not asked for.</summary>
    public static void EnsureWritable(string directory, bool overwrite)
    {
        if (overwrite) return;
        var existing = new[] { HtmlFile, MarkdownFile }.Select(f => Path.Combine(directory, f)).Where(File.Exists).ToList();
        if (existing.Count > 0)
            throw new OutputExistsException($"{directory} holds a report already ({string.Join(", ", existing.Select(Path.GetFileName))}); pass --force to replace it");
    }

    private static IReadOnlyList<string> Write(string html, string markdown, IReadOnlyList<Plots.RenderedPlot> plots, string directory, bool overwrite)
    {
        var files = new List<(string Path, Action<string, bool> Write)>
        {
            (Path.Combine(directory, HtmlFile), (p, o) => AtomicFile.WriteAllText(p, html, o)),
            (Path.Combine(directory, MarkdownFile), (p, o) => AtomicFile.WriteAllText(p, markdown, o)),
        };
        foreach (var plot in plots)
        {
            files.Add((Path.Combine(directory, PlotFolder, plot.FileStem + ".png"), (p, o) => AtomicFile.WriteAllBytes(p, plot.Png, o)));
            files.Add((Path.Combine(directory, PlotFolder, plot.FileStem + ".svg"), (p, o) => AtomicFile.WriteAllText(p, plot.Svg, o)));
        }
        if (!overwrite)
        {
            var existing = files.Select(f => f.Path).Where(File.Exists).ToList();
            if (existing.Count > 0)
                throw new OutputExistsException($"{directory} holds a report already ({string.Join(", ", existing.Select(Path.GetFileName))}); pass --force to replace it");
        }
        foreach (var (path, write) in files) write(path, overwrite);
        return [.. files.Select(f => Path.GetFullPath(f.Path))];
    }
}
