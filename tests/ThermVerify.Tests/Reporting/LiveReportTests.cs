using ThermVerify.Check;
using ThermVerify.Reporting;
using ThermVerify.Tests.Check;

namespace ThermVerify.Tests.Reporting;

/// <summary>A live report page reloads itself when the watch loop writes a newer report into its folder.</summary>
public class LiveReportTests
{
    private static CheckReport ReportOf(params (string Key, string Value)[] overrides) =>
        CheckReport.Build(FrontEndCheck.Run(TestDesign.Make([("check.step", "\"10 K\""), .. overrides]),
            new CheckOptions { ComputeRemedies = false, MaximumSamplingPoints = 3 }), TestRun.Provenance, "test.toml");

    [Fact]
    public void The_page_names_its_stamp_and_live_js_the_newest()
    {
        var folder = ReportFixture.NewTempFolder();
        LiveReport.Write(ReportOf(), folder, 7);
        Assert.Contains("var stamp = \"7\"", File.ReadAllText(Path.Combine(folder, ReportDirectory.HtmlFile)));
        Assert.Equal("thermverifyLive(\"7\");\n", File.ReadAllText(Path.Combine(folder, LiveReport.StampFile)));
        LiveReport.Write(ReportOf(), folder, 8); // the watch loop replaces its own report without --force
        Assert.Equal("thermverifyLive(\"8\");\n", File.ReadAllText(Path.Combine(folder, LiveReport.StampFile)));
    }

    [ChromiumFact]
    public async Task An_open_page_reloads_itself_with_the_newer_verdict()
    {
        var folder = ReportFixture.NewTempFolder();
        var passing = ReportOf();
        var failing = ReportOf(("check.budget", "\"0.001 K\""));
        Assert.True(passing.Result.Passed);
        Assert.False(failing.Result.Passed);

        LiveReport.Write(passing, folder, 1);
        await using var browser = await ChromiumDevTools.StartAsync();
        await browser.OpenAsync(Path.Combine(folder, ReportDirectory.HtmlFile));
        await browser.WaitUntilAsync("document.getElementById('verdict') !== null && document.getElementById('verdict').textContent.startsWith('PASS')");

        LiveReport.Write(failing, folder, 2);
        await browser.WaitUntilAsync("document.getElementById('verdict') !== null && document.getElementById('verdict').textContent.startsWith('FAIL')");
    }
}
