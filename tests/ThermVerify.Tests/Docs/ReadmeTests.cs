using System.Globalization;
using ThermVerify.Check;
using ThermVerify.Tests.Check;
using ThermVerify.Tests.Cli;

namespace ThermVerify.Tests.Docs;

/// <summary>
/// The README shows what the tool prints: the first command's output (the buffer's own sections left out, as the
/// README says), and the table of bundled examples with each one's verdict. THERMVERIFY_REWRITE_DOCS=1 rewrites them.
/// </summary>
public class ReadmeTests
{
    private static string Readme => Repository.PathOf("README.md");

    [Fact]
    public void The_readme_shows_what_check_prints_on_the_buffered_probe()
    {
        var run = CliRunner.Run("check", Path.Combine(Repository.Netlists, "buffered-cable-probe.toml"));
        var output = run.Output.Replace("\r\n", "\n");
        var from = output.IndexOf("Buffer stability:", StringComparison.Ordinal);
        var to = output.IndexOf("Findings:", StringComparison.Ordinal);
        Assert.True(from > 0 && to > from, "the check prints the buffer's sections before the findings");
        Assert.Contains("Noise of a reading:", output[from..to]);
        var shown = output[..from] + "[... sections on the buffer: stability, headroom, static errors, recovery after sampling, noise; " +
                    "then the noise of a reading, as docs/user-guide.md shows it ...]\n\n" + output[to..];
        DocBlocks.AssertCurrent(Readme, "readme-check", shown);
    }

    [Fact]
    public void The_readme_table_of_examples_shows_each_verdict()
    {
        var rows = Directory.GetFiles(Repository.Netlists, "*.toml").Order(StringComparer.Ordinal).Select(path =>
        {
            var name = Path.GetFileName(path);
            var result = ExampleVerdictTests.Checked(name);
            var failing = result.Findings.Where(f => f.Severity == Severity.Fail).Select(f => f.Id).ToList();
            var worst = result.Worst;
            var figure = string.Create(CultureInfo.InvariantCulture, $"worst {worst.ErrorKelvin:+0.000;−0.000} K at {worst.Celsius:0.##} °C");
            var warnings = result.Findings.Where(f => f.Severity == Severity.Warn).Select(f => f.Id).ToList();
            var verdict = result.Passed
                ? $"passes, {figure}" + (warnings.Count > 0 ? $" (warnings: {string.Join(", ", warnings)})" : "")
                : $"fails: {string.Join(", ", failing)}; {figure}";
            return $"| {name} | {result.Design.Description} | {verdict} |";
        });
        DocBlocks.AssertCurrentTable(Readme, "examples", "| design | what it is | `check` |\n|---|---|---|\n" + string.Join("\n", rows));
    }

    /// <summary>The list of documents at the end names each document of docs/ once, and no document that does not exist.</summary>
    [Fact]
    public void The_readme_links_every_document_once()
    {
        var more = File.ReadAllText(Readme).Replace("\r\n", "\n").Split("## More")[^1];
        var linked = System.Text.RegularExpressions.Regex.Matches(more, @"\]\((docs/[^)]+\.md)\)").Select(m => m.Groups[1].Value).ToList();
        Assert.Equal(linked.Distinct().Count(), linked.Count);
        var documents = Directory.GetFiles(Repository.Docs, "*.md").Select(f => "docs/" + Path.GetFileName(f)).Order(StringComparer.Ordinal);
        Assert.Equal(documents, linked.Order(StringComparer.Ordinal));
    }
}
