using System.Text;
using ThermVerify.Files;

namespace ThermVerify.Reporting;

/// <summary>
/// A report folder: report.html (self-contained), report.md and plots/*.png and *.svg. The files go out as one
/// <see cref="OutputSet"/> (with the run's other outputs when a command adds them to its set): existing files are
/// replaced only when asked, and that is decided before anything is written, so a refused run leaves the folder as it
/// was.
/// </summary>
public static class ReportDirectory
{
    public const string HtmlFile = "report.html";
    public const string MarkdownFile = "report.md";
    public const string PlotFolder = "plots";

    /// <summary>The files every report has, known before it is built (so an existing report is refused before the work).</summary>
    public static IReadOnlyList<string> ExpectedFiles { get; } = [HtmlFile, MarkdownFile];

    /// <returns>The files written, full paths.</returns>
    public static IReadOnlyList<string> Write(CheckReport report, string directory, bool overwrite) =>
        new OutputSet(overwrite).AddFolder(directory, () => Files(report), ExpectedFiles).Write();

    /// <summary>As <see cref="Write(CheckReport, string, bool)"/>, with the page's HTML passed through <paramref name="finishHtml"/> first.</summary>
    internal static IReadOnlyList<string> Write(CheckReport report, string directory, bool overwrite, Func<string, string> finishHtml) =>
        new OutputSet(overwrite).AddFolder(directory,
            () => Files(finishHtml(CheckHtml.Render(report)), CheckMarkdown.Render(report, PlotFolder), report.Plots), ExpectedFiles).Write();

    /// <returns>The files written, full paths.</returns>
    public static IReadOnlyList<string> Write(AnalysisReport report, string directory, bool overwrite) =>
        new OutputSet(overwrite).AddFolder(directory, () => Files(report), ExpectedFiles).Write();

    /// <summary>The report's files, relative to its folder, rendered.</summary>
    public static IReadOnlyList<(string RelativePath, byte[] Content)> Files(CheckReport report) =>
        Files(CheckHtml.Render(report), CheckMarkdown.Render(report, PlotFolder), report.Plots);

    /// <summary>The report's files, relative to its folder, rendered.</summary>
    public static IReadOnlyList<(string RelativePath, byte[] Content)> Files(AnalysisReport report) =>
        Files(AnalysisHtml.Render(report), AnalysisMarkdown.Render(report, PlotFolder), report.Plots);

    /// <summary>Refuses before any work is done when the folder cannot hold a report, or holds one and replacing it was not asked for.</summary>
    public static void EnsureWritable(string directory, bool overwrite)
    {
        OutputTarget.CheckFolder(directory);
        foreach (var file in new[] { HtmlFile, MarkdownFile })
        {
            try
            {
                OutputTarget.CheckFile(Path.Combine(directory, file), overwrite, parentMayBeCreated: true);
            }
            catch (OutputExistsException)
            {
                throw new OutputExistsException($"{directory} holds a report already ({file}); pass --force to replace it");
            }
        }
    }

    private static IReadOnlyList<(string, byte[])> Files(string html, string markdown, IReadOnlyList<Plots.RenderedPlot> plots)
    {
        var utf8 = new UTF8Encoding(false);
        var files = new List<(string, byte[])> { (HtmlFile, utf8.GetBytes(html)), (MarkdownFile, utf8.GetBytes(markdown)) };
        foreach (var plot in plots)
        {
            files.Add((Path.Combine(PlotFolder, plot.FileStem + ".png"), plot.Png));
            files.Add((Path.Combine(PlotFolder, plot.FileStem + ".svg"), utf8.GetBytes(plot.Svg)));
        }
        return files;
    }
}
