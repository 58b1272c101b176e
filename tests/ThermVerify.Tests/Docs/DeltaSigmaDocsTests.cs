using ThermVerify.Cli;
using ThermVerify.Tests.Cli;

namespace ThermVerify.Tests.Docs;

/// <summary>The delta-sigma outputs the docs show are what the tool prints now (THERMVERIFY_REWRITE_DOCS=1 rewrites them).</summary>
public class DeltaSigmaDocsTests
{
    private const string Kiln = "kiln-bank-pt100-deltasigma.toml";

    private static string Shown(int exitCode, params string[] args)
    {
        var run = CliRunner.Run([args[0], Path.Combine(Repository.Netlists, args[1]), .. args[2..]]);
        Assert.Equal(exitCode, run.ExitCode);
        var printed = run.Output.Replace(Repository.Netlists + Path.DirectorySeparatorChar, "");
        return $"$ thermverify {string.Join(' ', args)}\n{printed}";
    }

    [Fact]
    public void The_firmware_tables_page_shows_the_kilns_delta_sigma_table()
    {
        DocBlocks.AssertCurrent(Repository.PathOf("docs", "firmware-tables.md"), "deltasigma-table", Shown(ExitCodes.Success, "table", Kiln, "--bound", "0.01K"));
    }

    [Fact]
    public void The_tolerances_page_shows_the_kilns_units_failing_on_their_channel_switch()
    {
        // montecarlo reports the yield and exits 0 (a yield threshold is not asked here).
        DocBlocks.AssertCurrent(Repository.PathOf("docs", "tolerances.md"), "tolerances-deltasigma-montecarlo",
            Shown(ExitCodes.Success, "montecarlo", Kiln, "-n", "50", "--seed", "1"));
    }
}
