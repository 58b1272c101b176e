using System.Text.Json;

namespace ThermVerify.Tests.Cli;

/// <summary>
/// A check shows its progress as the other long runs do: every sampling transient of the check grid, then every
/// finding's remedy search. Plain lines with --progress (standard error is not a terminal here); none without it.
/// </summary>
public class CheckProgressTests
{
    private static readonly string Design = Path.Combine(Repository.Netlists, "cold-storage-logger.toml");

    [Fact]
    public void Check_reports_every_sampling_run_of_its_grid_and_every_remedy_search()
    {
        var json = Path.Combine(Path.GetTempPath(), $"tv-progress-{Guid.NewGuid():N}.json");
        try
        {
            var run = CliRunner.Run("check", Design, "--sampling-points", "4", "--progress", "--json", json);
            var root = JsonDocument.Parse(File.ReadAllText(json)).RootElement;
            // Four grid temperatures for each precharge case the check covered (this design: the other channel's level, each end).
            var runs = 4 * root.GetProperty("precharge").GetProperty("cases").GetArrayLength();
            var findings = root.GetProperty("findings").GetArrayLength();
            var lines = run.Error.Split('\n', StringSplitOptions.RemoveEmptyEntries);
            Assert.StartsWith($"sampling runs: 0/{runs} (0 %)", lines[0]);
            Assert.Contains(lines, l => l.StartsWith($"sampling runs: {runs}/{runs} (100 %)", StringComparison.Ordinal));
            Assert.True(findings > 0, "the example fails and has findings to search remedies for");
            // Remedy progress counts the changes searched (at least one step a finding), each step in order up to the total.
            var remedySteps = lines.Where(l => l.StartsWith("remedy searches: ", StringComparison.Ordinal))
                .Select(l => l["remedy searches: ".Length..l.IndexOf(' ', "remedy searches: ".Length)].Split('/').Select(int.Parse).ToArray()).ToList();
            var total = remedySteps[0][1];
            Assert.True(total > findings, $"{total} changes to search for {findings} findings: more than one change for some finding");
            Assert.Equal([0, total], remedySteps[0]);
            Assert.Equal([total, total], remedySteps[^1]);
            Assert.All(remedySteps.Zip(remedySteps.Skip(1)), p => Assert.InRange(p.Second[0] - p.First[0], 0, total));
            Assert.StartsWith($"remedy searches: {total}/{total} (100 %)", lines[^1]);
        }
        finally
        {
            File.Delete(json);
        }
    }

    [Fact]
    public void Without_the_option_or_with_quiet_standard_error_stays_empty()
    {
        Assert.Equal("", CliRunner.Run("check", Design, "--sampling-points", "3", "--no-remedies").Error);
        Assert.Equal("", CliRunner.Run("check", Design, "--sampling-points", "3", "--no-remedies", "--progress", "--quiet").Error);
        Assert.DoesNotContain("remedy searches", CliRunner.Run("check", Design, "--sampling-points", "3", "--no-remedies", "--progress").Error);
    }
}
