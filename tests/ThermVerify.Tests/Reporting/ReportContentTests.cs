using System.Text.RegularExpressions;
using ThermVerify.Files;
using ThermVerify.Reporting;

namespace ThermVerify.Tests.Reporting;

public class ReportContentTests(ReportFixture fixture) : IClassFixture<ReportFixture>
{
    [Fact]
    public void Html_is_self_contained()
    {
        var html = CheckHtml.Render(fixture.Report);
        Assert.DoesNotContain("<script", html);
        Assert.DoesNotContain("<link", html);
        Assert.DoesNotMatch(new Regex("(src|href)=\"(https?:|//)"), html);
        Assert.Equal(fixture.Report.Plots.Count, Regex.Matches(html, "<svg ").Count);
    }

    [Fact]
    public void Inline_figures_never_share_an_id()
    {
        var ids = Regex.Matches(CheckHtml.Render(fixture.Report), "id=\"([^\"]+)\"").Select(m => m.Groups[1].Value).ToList();
        Assert.Equal(ids.Count, ids.Distinct().Count());
    }

    [Fact]
    public void Html_echoes_the_design_findings_remedies_and_cautions()
    {
        var html = CheckHtml.Render(fixture.Report);
        Assert.Contains("[adc]", html);
        Assert.Contains("precharge = &quot;discharged&quot;", html);
        foreach (var f in fixture.Result.Findings) Assert.Contains($"id=\"finding-{f.Id}\"", html);
        Assert.Contains("independent protection", html);
        Assert.Contains("Simulation does not replace measurement", html);
    }

    [Fact]
    public void Markdown_links_png_files_that_the_folder_holds()
    {
        var folder = ReportFixture.NewTempFolder();
        ReportDirectory.Write(fixture.Report, folder, overwrite: false);
        var md = File.ReadAllText(Path.Combine(folder, ReportDirectory.MarkdownFile));
        var links = Regex.Matches(md, @"!\[[^\]]*\]\(([^)]+)\)").Select(m => m.Groups[1].Value).ToList();
        Assert.Equal(fixture.Report.Plots.Count, links.Count);
        foreach (var link in links)
        {
            var png = File.ReadAllBytes(Path.Combine(folder, link));
            // PNG signature (ISO/IEC 15948, 5.2): 137 80 78 71 13 10 26 10.
            Assert.Equal(new byte[] { 137, 80, 78, 71, 13, 10, 26, 10 }, png[..8]);
        }
    }

    [Fact]
    public void Report_folder_is_never_overwritten_without_being_asked()
    {
        var folder = ReportFixture.NewTempFolder();
        ReportDirectory.Write(fixture.Report, folder, overwrite: false);
        var html = Path.Combine(folder, ReportDirectory.HtmlFile);
        File.WriteAllText(html, "kept");

        Assert.Throws<OutputExistsException>(() => ReportDirectory.Write(fixture.Report, folder, overwrite: false));
        Assert.Equal("kept", File.ReadAllText(html));

        ReportDirectory.Write(fixture.Report, folder, overwrite: true);
        Assert.StartsWith("<!DOCTYPE html>", File.ReadAllText(html));
        Assert.Empty(Directory.EnumerateFiles(folder, "*.tmp", SearchOption.AllDirectories));
    }
}
