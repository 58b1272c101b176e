using ThermVerify.Tests.Cli;

namespace ThermVerify.Tests.Docs;

/// <summary>
/// Every output docs/user-guide.md and docs/design-file.md show is what the tool prints now: each block is produced
/// here by the command shown above it, run on a copy of the example in a folder of its own (whose path is taken out,
/// so the block reads as if run in that folder). THERMVERIFY_REWRITE_DOCS=1 rewrites the blocks.
/// </summary>
public sealed class UserGuideTests : IDisposable
{
    private static string Guide => Repository.PathOf("docs", "user-guide.md");

    private readonly DirectoryInfo folder = Directory.CreateTempSubdirectory("tv-guide-");

    public void Dispose() => folder.Delete(recursive: true);

    private string Copy(string example, Func<string, string>? edit = null)
    {
        var text = File.ReadAllText(Path.Combine(Repository.Netlists, example));
        File.WriteAllText(Path.Combine(folder.FullName, example), edit?.Invoke(text) ?? text);
        return example;
    }

    /// <summary>Runs a command in the folder as the guide shows it ("$ thermverify ..."), returning that line and what it printed.</summary>
    private string Shown(string[] args, bool error = false)
    {
        var inFolder = args.Select((a, i) => i > 0 && !a.StartsWith('-') && !int.TryParse(a, out _) ? Path.Combine(folder.FullName, a) : a).ToArray();
        var run = CliRunner.Run(inFolder);
        var printed = (error ? run.Error : run.Output).Replace(folder.FullName + Path.DirectorySeparatorChar, "");
        return $"$ thermverify {string.Join(' ', args)}\n{printed}";
    }

    [Fact]
    public void Validate_prints_the_normal_form()
    {
        DocBlocks.AssertCurrent(Guide, "guide-validate", Shown(["validate", Copy("cold-storage-logger.toml")]));
    }

    [Fact]
    public void The_check_of_the_logger_with_every_output()
    {
        DocBlocks.AssertCurrent(Guide, "guide-check",
            Shown(["check", Copy("cold-storage-logger.toml"), "--report", "report", "--junit", "junit.xml", "--json", "check.json"]));
    }

    /// <summary>
    /// The logger with the guide's edits: the acquisition time the settling finding's first remedy asks for, rounded up,
    /// and the firmware averaging the noise finding's remedy asks for, rounded up to a power of two.
    /// </summary>
    private string FixedLogger() => Copy("cold-storage-logger.toml", text =>
    {
        Assert.Contains("acquisition_time = \"2 us\"", text);
        Assert.DoesNotContain("[noise]", text);
        return text.Replace("acquisition_time = \"2 us\"", "acquisition_time = \"12 us\"") + "\n[noise]\nreadings_averaged = 16\n";
    });

    [Fact]
    public void The_check_after_the_first_remedy()
    {
        DocBlocks.AssertCurrent(Guide, "guide-check-fixed", Shown(["check", FixedLogger(), "--no-remedies"]));
    }

    [Fact]
    public void A_baseline_written_then_compared()
    {
        var design = FixedLogger();
        DocBlocks.AssertCurrent(Guide, "guide-baseline", Shown(["baseline", design]));
        var compared = Shown(["check", design, "--baseline", "cold-storage-logger.baseline.json"]);
        var from = compared.IndexOf("BASELINE", StringComparison.Ordinal);
        Assert.True(from > 0, "the check prints the baseline comparison after its own output");
        var firstLine = compared[..(compared.IndexOf('\n') + 1)];
        DocBlocks.AssertCurrent(Guide, "guide-baseline-check", firstLine + "[... the check's own output, as in section 2 ...]\n\n" + compared[from..]);
    }

    [Fact]
    public void Monte_carlo_with_a_report_and_its_refusal_to_replace_it()
    {
        var design = Copy("oven-pt1000.toml");
        string[] command = ["montecarlo", design, "-n", "2000", "--report", "mc-report", "--json", "mc.json"];
        DocBlocks.AssertCurrent(Guide, "guide-montecarlo", Shown(command));
        DocBlocks.AssertCurrent(Guide, "guide-montecarlo-again", Shown(command, error: true));
    }

    [Fact]
    public void The_design_file_reference_shows_real_error_messages()
    {
        var probe = Copy("buffered-cable-probe.toml");
        var text = File.ReadAllText(Path.Combine(folder.FullName, probe));
        File.WriteAllText(Path.Combine(folder.FullName, "typo.toml"), text.Replace("fixed_resistor =", "fixed_resistr ="));
        File.WriteAllText(Path.Combine(folder.FullName, "unit.toml"), text.Replace("excitation = \"3.3 V\"", "excitation = \"3.3 ohm\""));
        Assert.Contains("excitation = \"3.3 V\"", text);
        DocBlocks.AssertCurrent(Repository.PathOf("docs", "design-file.md"), "design-file-errors",
            Shown(["validate", "typo.toml"], error: true) + Shown(["validate", "unit.toml"], error: true));
    }

    [Fact]
    public void The_firmware_tables_page_shows_a_differential_bridge_table_with_its_signed_fault_thresholds()
    {
        DocBlocks.AssertCurrent(Repository.PathOf("docs", "firmware-tables.md"), "bridge-table",
            Shown(["table", Copy("brine-chiller-bridge-differential.toml")]));
    }

    [Fact]
    public void The_firmware_tables_page_shows_a_bridge_table_through_an_amplifier()
    {
        DocBlocks.AssertCurrent(Repository.PathOf("docs", "firmware-tables.md"), "bridge-amplifier-table",
            Shown(["table", Copy("autoclave-pt100-bridge-inamp.toml")]));
    }
}
