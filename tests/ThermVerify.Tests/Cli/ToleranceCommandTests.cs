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
    public void MonteCarloPrintsYieldAndProgressLinesWhenRedirected()
    {
        var run = CliRunner.Run("montecarlo", Example("table-sensor-freezer.toml"), "-n", "100", "--threads", "2");
        Assert.Equal(ExitCodes.Success, run.ExitCode);
        Assert.Contains("yield:", run.Output);
        Assert.Contains("contributors", run.Output);
        // Redirected output gets plain lines (one per tenth of the run), never a bar redrawn with carriage returns.
        Assert.Contains("units: 100/100 (100 %)", run.Error);
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
