using ThermVerify.Baselines;
using ThermVerify.Files;
using ThermVerify.Tests.Cli;

namespace ThermVerify.Tests.Reporting;

public class BaselineTests(ReportFixture fixture) : IClassFixture<ReportFixture>
{
    private static Baseline With(params BaselineFigure[] figures) => new("d", "hash", "test", figures);

    private static BaselineFigure Error(double? kelvin) => new("error.worst", "worst error", kelvin, "K", Better.Lower, 0.01);

    private static BaselineFigure Margin(double? kelvin) => new("margin.smallest", "smallest margin", kelvin, "K", Better.Higher, 0.01);

    [Theory]
    [InlineData(0.30, 0.305, Change.Same)]    // within the 0.01 K tolerance
    [InlineData(0.30, 0.32, Change.Worse)]
    [InlineData(0.30, 0.20, Change.Better)]
    public void Error_figure_is_worse_only_beyond_its_tolerance(double before, double now, Change expected)
    {
        var comparison = BaselineComparison.Compare("b.json", With(Error(before)), With(Error(now)));
        Assert.Equal(expected, comparison.Figures.Single().Change);
        Assert.Equal(expected != Change.Worse, comparison.Passed);
    }

    [Fact]
    public void Smaller_margin_is_worse_and_an_unreadable_value_is_worse_than_any_number()
    {
        Assert.False(BaselineComparison.Compare("b", With(Margin(0.2)), With(Margin(0.1))).Passed);
        Assert.True(BaselineComparison.Compare("b", With(Margin(0.1)), With(Margin(0.2))).Passed);
        Assert.False(BaselineComparison.Compare("b", With(Error(0.3)), With(Error(null))).Passed);
        Assert.False(BaselineComparison.Compare("b", With(Margin(0.3)), With(Margin(null))).Passed);
        Assert.True(BaselineComparison.Compare("b", With(Error(null)), With(Error(5))).Passed);
    }

    [Fact]
    public void New_and_gone_figures_are_listed_but_do_not_fail()
    {
        var comparison = BaselineComparison.Compare("b", With(Error(0.3)), With(Margin(0.2)));
        Assert.True(comparison.Passed);
        Assert.Equal([Change.New, Change.Gone], comparison.Figures.Select(f => f.Change));
    }

    [Fact]
    public void Figures_follow_the_points_and_round_trip_through_the_file()
    {
        var baseline = BaselineFigures.From(fixture.Result, TestRun.Provenance);
        var worst = baseline.Figures.Single(f => f.Id == "error.worst").Value;
        Assert.Equal(fixture.Result.Points.Max(p => Math.Abs(p.ErrorKelvin)), worst);
        Assert.Equal(fixture.Result.Points.Count(p => !p.WithinBudget), baseline.Figures.Single(f => f.Id == "points.over-budget").Value);

        var path = Path.Combine(ReportFixture.NewTempFolder(), "b.json");
        BaselineFile.Write(path, baseline, overwrite: false);
        var read = BaselineFile.Read(path);
        Assert.Equal(baseline.Figures, read.Figures);
        Assert.True(BaselineComparison.Compare(path, read, baseline).Figures.All(f => f.Change == Change.Same));

        Assert.Throws<OutputExistsException>(() => BaselineFile.Write(path, baseline, overwrite: false));
    }

    [Fact]
    public void A_baseline_missing_a_field_is_refused_with_its_name()
    {
        var path = Path.Combine(ReportFixture.NewTempFolder(), "b.json");
        File.WriteAllText(path, """{"schema":"thermverify.baseline/1","tool":"x","design":{"name":"d","sha256":"h"},"figures":[{"id":"a","description":"d","unit":"K","better":"lower","tolerance":0.1}]}""");
        var e = Assert.Throws<BaselineException>(() => BaselineFile.Read(path));
        Assert.Contains("figures[0].value", e.Message);
    }

    [Fact]
    public void Command_line_writes_refuses_to_overwrite_and_fails_a_check_that_got_worse()
    {
        var folder = ReportFixture.NewTempFolder();
        var design = Path.Combine(folder, "probe.toml");
        File.Copy(Path.Combine(Netlists(), "oven-pt1000.toml"), design);

        var first = CliRunner.Run("baseline", design, "--threads", "2");
        Assert.True(first.ExitCode == 0, first.Error);
        var baselinePath = Path.Combine(folder, "probe.baseline.json");
        Assert.True(File.Exists(baselinePath));
        var written = File.ReadAllText(baselinePath);

        var again = CliRunner.Run("baseline", design, "--threads", "2");
        Assert.Equal(2, again.ExitCode);
        Assert.Contains("--force", again.Error);
        Assert.Equal(written, File.ReadAllText(baselinePath));

        var same = CliRunner.Run("check", design, "--threads", "2", "--no-remedies", "--baseline", baselinePath);
        Assert.True(same.ExitCode == 0, same.Output + same.Error);
        Assert.Contains("BASELINE PASS", same.Output);

        // A baseline that claims a far smaller worst error: the same check is now a regression.
        var stored = BaselineFile.Read(baselinePath);
        var tighter = stored with { Figures = [.. stored.Figures.Select(f => f.Id == "error.worst" ? f with { Value = f.Value! / 2 } : f)] };
        BaselineFile.Write(baselinePath, tighter, overwrite: true);
        var worse = CliRunner.Run("check", design, "--threads", "2", "--no-remedies", "--baseline", baselinePath);
        Assert.Equal(1, worse.ExitCode);
        Assert.Contains("BASELINE FAIL: 1 figure(s)", worse.Output);
        Assert.Contains("WORSE", worse.Output);
    }

    private static string Netlists()
    {
        for (var dir = new DirectoryInfo(AppContext.BaseDirectory); dir is not null; dir = dir.Parent)
            if (File.Exists(Path.Combine(dir.FullName, "Directory.Build.props")) && Directory.Exists(Path.Combine(dir.FullName, "netlists")))
                return Path.Combine(dir.FullName, "netlists");
        throw new DirectoryNotFoundException("netlists/ not found above the test binaries");
    }
}
