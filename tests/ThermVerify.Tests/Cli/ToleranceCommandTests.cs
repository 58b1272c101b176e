using ThermVerify.Cli;

namespace ThermVerify.Tests.Cli;

/// <summary>The tolerance commands from the command line, on a bundled example.</summary>
public class ToleranceCommandTests
{
    private static string Example(string name)
    {
        for (var dir = new DirectoryInfo(AppContext.BaseDirectory); dir is not null; dir = dir.Parent)
            if (File.Exists(Path.Combine(dir.FullName, "Directory.Build.props")) && Directory.Exists(Path.Combine(dir.FullName, "netlists")))
                return Path.Combine(dir.FullName, "netlists", name);
        throw new DirectoryNotFoundException("netlists/ not found above the test binaries");
    }

    [Fact]
    public void MonteCarloPrintsYieldAndNoProgressWhenRedirected()
    {
        var run = CliRunner.Run("montecarlo", Example("table-sensor-freezer.toml"), "-n", "100", "--threads", "2");
        Assert.Equal(ExitCodes.Success, run.ExitCode);
        Assert.Contains("yield:", run.Output);
        Assert.Contains("contributors", run.Output);
        // Redirected output carries the results alone: the progress bar is for an interactive terminal.
        Assert.Equal("", run.Error);
    }

    [Fact]
    public void MonteCarloPrintsPlainProgressLinesWhenAsked()
    {
        var run = CliRunner.Run("montecarlo", Example("table-sensor-freezer.toml"), "-n", "100", "--threads", "2", "--progress");
        Assert.Equal(ExitCodes.Success, run.ExitCode);
        // One line per tenth of the run for a log, never a bar redrawn with carriage returns.
        Assert.Contains("units: 100/100 (100 %)", run.Error);
        Assert.InRange(run.Error.Split('\n', StringSplitOptions.RemoveEmptyEntries).Length, 2, 11);
        Assert.DoesNotContain("\r", run.Error);
    }

    [Fact]
    public void MinimumYieldAboveTheYieldExitsWithCheckFailed()
    {
        // The oven example's class B Pt1000 leaves some units over its 2 K region budget (see docs/tolerances.md).
        var run = CliRunner.Run("montecarlo", Example("oven-pt1000.toml"), "-n", "200", "--minimum-yield", "99.9");
        Assert.Equal(ExitCodes.CheckFailed, run.ExitCode);
    }

    [Fact]
    public void WorstCaseReportsTheEnumeration()
    {
        var run = CliRunner.Run("worstcase", Example("table-sensor-freezer.toml"));
        Assert.Contains("corners enumerated", run.Output);
        Assert.True(run.ExitCode is ExitCodes.Success or ExitCodes.CheckFailed);
    }

    [Fact]
    public void ChooseFixedRejectsAnUnknownSeries()
    {
        var run = CliRunner.Run("choose-fixed", Example("table-sensor-freezer.toml"), "--series", "E7");
        Assert.Equal(ExitCodes.BadInput, run.ExitCode);
        Assert.Contains("E7", run.Error);
    }
}

/// <summary>--json, --report and --force on the tolerance commands, from the command line.</summary>
public class ToleranceCommandOutputTests
{
    private static string Example(string name)
    {
        for (var dir = new DirectoryInfo(AppContext.BaseDirectory); dir is not null; dir = dir.Parent)
            if (File.Exists(Path.Combine(dir.FullName, "Directory.Build.props")) && Directory.Exists(Path.Combine(dir.FullName, "netlists")))
                return Path.Combine(dir.FullName, "netlists", name);
        throw new DirectoryNotFoundException("netlists/ not found above the test binaries");
    }

    [Fact]
    public void Montecarlo_writes_json_and_report_and_refuses_to_replace_them_without_force()
    {
        var folder = ThermVerify.Tests.Reporting.ReportFixture.NewTempFolder();
        var json = Path.Combine(folder, "mc.json");
        var report = Path.Combine(folder, "report");
        string[] args = ["montecarlo", Example("table-sensor-freezer.toml"), "-n", "40", "--threads", "2", "--json", json, "--report", report];

        var first = CliRunner.Run(args);
        Assert.Equal(ExitCodes.Success, first.ExitCode);
        Assert.Contains("\"schema\": \"thermverify.montecarlo/1\"", File.ReadAllText(json));
        Assert.True(File.Exists(Path.Combine(report, "plots", "montecarlo-envelope.png")));

        File.WriteAllText(json, "kept");
        var refused = CliRunner.Run(args);
        Assert.Equal(ExitCodes.BadInput, refused.ExitCode);
        Assert.Contains("--force", refused.Error);
        Assert.Equal("kept", File.ReadAllText(json));
        // Refused before the run: no progress was printed.
        Assert.DoesNotContain("units:", refused.Error);

        var forced = CliRunner.Run([.. args, "--force"]);
        Assert.Equal(ExitCodes.Success, forced.ExitCode);
        Assert.StartsWith("{", File.ReadAllText(json));
    }

    [Fact]
    public void Worstcase_and_choose_fixed_write_their_schemas()
    {
        var folder = ThermVerify.Tests.Reporting.ReportFixture.NewTempFolder();
        var worst = CliRunner.Run("worstcase", Example("table-sensor-freezer.toml"), "--json", Path.Combine(folder, "wc.json"), "--report", Path.Combine(folder, "wc"));
        Assert.True(worst.ExitCode is ExitCodes.Success or ExitCodes.CheckFailed, worst.Error);
        Assert.Contains("\"schema\": \"thermverify.worstcase/1\"", File.ReadAllText(Path.Combine(folder, "wc.json")));
        Assert.True(File.Exists(Path.Combine(folder, "wc", "plots", "worstcase-band.svg")));

        var fixedRun = CliRunner.Run("choose-fixed", Example("table-sensor-freezer.toml"), "--series", "E6", "--json", Path.Combine(folder, "cf.json"),
            "--report", Path.Combine(folder, "cf"));
        Assert.Equal(ExitCodes.Success, fixedRun.ExitCode);
        Assert.Contains("\"schema\": \"thermverify.fixed/1\"", File.ReadAllText(Path.Combine(folder, "cf.json")));
        Assert.True(File.Exists(Path.Combine(folder, "cf", "plots", "fixed-candidates.png")));
    }
}
