using System.Text.RegularExpressions;
using ThermVerify.Reporting;

namespace ThermVerify.Tests.Reporting;

/// <summary>The HTML report as a browser sees it: loads from disk alone, without errors, with every figure drawn inline.</summary>
public class HtmlReportChromiumTests(ReportFixture fixture) : IClassFixture<ReportFixture>
{
    [ChromiumFact]
    public void Report_loads_in_headless_chromium_with_every_figure_inline()
    {
        var folder = ReportFixture.NewTempFolder();
        ReportDirectory.Write(fixture.Report, folder, overwrite: false);
        var html = Path.Combine(folder, ReportDirectory.HtmlFile);

        var (exit, dom, log) = Chromium("--dump-dom", html);

        Assert.True(exit == 0, $"chromium exited {exit}: {log}");
        // The browser's own DOM, after parsing: each figure holds an SVG with drawn paths and its caption.
        foreach (var plot in fixture.Report.Plots)
        {
            var figure = Regex.Match(dom, $"<figure id=\"figure-{plot.FileStem}\"[^>]*>(.*?)</figure>", RegexOptions.Singleline);
            Assert.True(figure.Success, $"figure {plot.FileStem} missing from the rendered DOM");
            Assert.Contains("<svg", figure.Groups[1].Value);
            Assert.True(Regex.Matches(figure.Groups[1].Value, "<path ").Count >= 5, $"figure {plot.FileStem} has almost nothing drawn");
            Assert.Contains("<figcaption>", figure.Groups[1].Value);
        }
        Assert.Contains("id=\"verdict\"", dom);
        Assert.Contains("FAIL:", dom);
        Assert.Contains("id=\"cautions\"", dom);
        // Nothing was fetched from outside the file and no script ran into an error.
        Assert.DoesNotContain("Failed to load resource", log);
        Assert.DoesNotMatch(new Regex("Uncaught|CONSOLE\\(.*error", RegexOptions.IgnoreCase), log);
    }

    [ChromiumFact]
    public void Screenshot_of_the_report_is_not_blank()
    {
        var folder = ReportFixture.NewTempFolder();
        ReportDirectory.Write(fixture.Report, folder, overwrite: false);
        var shot = Path.Combine(folder, "shot.png");

        var (exit, _, log) = Chromium($"--screenshot={shot}", Path.Combine(folder, ReportDirectory.HtmlFile));

        Assert.True(exit == 0 && File.Exists(shot), $"no screenshot: {log}");
        // A page that failed to render is a uniform white PNG, which compresses to a few kilobytes.
        Assert.True(new FileInfo(shot).Length > 20_000, $"screenshot of {new FileInfo(shot).Length} bytes looks blank");
    }

    private static (int Exit, string Output, string Log) Chromium(string action, string htmlPath) => HeadlessChromium.Run(action, htmlPath);
}
