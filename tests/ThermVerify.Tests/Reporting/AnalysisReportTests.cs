using System.Text.RegularExpressions;
using ThermVerify.Files;
using ThermVerify.Reporting;

namespace ThermVerify.Tests.Reporting;

/// <summary>The report pages of the tolerance analyses: self-contained, every figure inline and as files, never replaced unasked.</summary>
public class AnalysisReportTests(AnalysisFixture fixture) : IClassFixture<AnalysisFixture>
{
    public static TheoryData<int> Pages => [0, 1, 2];

    [Theory]
    [MemberData(nameof(Pages))]
    public void Html_is_self_contained_with_every_figure_design_and_cautions(int page)
    {
        var report = fixture.Reports[page];
        var html = AnalysisHtml.Render(report);
        Assert.DoesNotContain("<script", html);
        Assert.DoesNotMatch(new Regex("(src|href)=\"(https?:|//)"), html);
        Assert.Equal(report.Plots.Count, Regex.Matches(html, "<svg ").Count);
        Assert.Contains("[divider]", html);
        Assert.Contains("independent protection", html);
        Assert.Contains(report.JsonSchema, html);
        var ids = Regex.Matches(html, "id=\"([^\"]+)\"").Select(m => m.Groups[1].Value).ToList();
        Assert.Equal(ids.Count, ids.Distinct().Count());
    }

    [Fact]
    public void Monte_carlo_report_has_its_three_figures_and_states_the_yield()
    {
        var report = fixture.Reports[0];
        Assert.Equal(["montecarlo-envelope", "montecarlo-worst-error", "montecarlo-contributors"], report.Plots.Select(p => p.FileStem));
        Assert.Contains(FormattableString.Invariant($"{100 * fixture.MonteCarlo.Yield:0.00} %"), report.Verdict);
        Assert.Contains("yield", report.Plots[1].Caption, StringComparison.OrdinalIgnoreCase);
    }

    [Theory]
    [MemberData(nameof(Pages))]
    public void Folder_holds_png_and_svg_of_each_figure_and_markdown_links_them(int page)
    {
        var report = fixture.Reports[page];
        var folder = ReportFixture.NewTempFolder();
        ReportDirectory.Write(report, folder, overwrite: false);
        var md = File.ReadAllText(Path.Combine(folder, ReportDirectory.MarkdownFile));
        var links = Regex.Matches(md, @"!\[[^\]]*\]\(([^)]+)\)").Select(m => m.Groups[1].Value).ToList();
        Assert.Equal(report.Plots.Count, links.Count);
        foreach (var link in links)
        {
            // PNG signature (ISO/IEC 15948, 5.2): 137 80 78 71 13 10 26 10.
            Assert.Equal(new byte[] { 137, 80, 78, 71, 13, 10, 26, 10 }, File.ReadAllBytes(Path.Combine(folder, link))[..8]);
            Assert.Contains("<svg", File.ReadAllText(Path.Combine(folder, Path.ChangeExtension(link, ".svg"))));
        }
    }

    [Fact]
    public void Report_folder_is_never_overwritten_without_being_asked()
    {
        var folder = ReportFixture.NewTempFolder();
        ReportDirectory.Write(fixture.Reports[1], folder, overwrite: false);
        var html = Path.Combine(folder, ReportDirectory.HtmlFile);
        File.WriteAllText(html, "kept");

        Assert.Throws<OutputExistsException>(() => ReportDirectory.EnsureWritable(folder, overwrite: false));
        Assert.Throws<OutputExistsException>(() => ReportDirectory.Write(fixture.Reports[0], folder, overwrite: false));
        Assert.Equal("kept", File.ReadAllText(html));

        ReportDirectory.Write(fixture.Reports[0], folder, overwrite: true);
        Assert.Contains("thermverify montecarlo", File.ReadAllText(html));
        Assert.Empty(Directory.EnumerateFiles(folder, "*.tmp", SearchOption.AllDirectories));
    }

    [ChromiumFact]
    public void Every_analysis_report_loads_in_headless_chromium_with_its_figures_drawn()
    {
        foreach (var report in fixture.Reports)
        {
            var folder = ReportFixture.NewTempFolder();
            ReportDirectory.Write(report, folder, overwrite: false);
            var (exit, dom, log) = HeadlessChromium.Run("--dump-dom", Path.Combine(folder, ReportDirectory.HtmlFile));

            Assert.True(exit == 0, $"chromium exited {exit}: {log}");
            foreach (var plot in report.Plots)
            {
                var figure = Regex.Match(dom, $"<figure id=\"figure-{plot.FileStem}\"[^>]*>(.*?)</figure>", RegexOptions.Singleline);
                Assert.True(figure.Success, $"figure {plot.FileStem} missing from the rendered DOM of {report.Heading}");
                Assert.True(Regex.Matches(figure.Groups[1].Value, "<path ").Count >= 5, $"figure {plot.FileStem} has almost nothing drawn");
            }
            Assert.Contains("id=\"verdict\"", dom);
            Assert.Contains("id=\"cautions\"", dom);
            Assert.DoesNotContain("Failed to load resource", log);
            Assert.DoesNotMatch(new Regex("Uncaught|CONSOLE\\(.*error", RegexOptions.IgnoreCase), log);
        }
    }
}
