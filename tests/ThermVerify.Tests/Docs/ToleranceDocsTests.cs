using ThermVerify.Cli;
using ThermVerify.Tests.Cli;

namespace ThermVerify.Tests.Docs;

/// <summary>The outputs docs/tolerances.md shows are what the tool prints now (THERMVERIFY_REWRITE_DOCS=1 rewrites them).</summary>
public class ToleranceDocsTests
{
    [Fact]
    public void The_worst_case_of_the_delta_sigma_example()
    {
        var example = "stability-chamber-pt100-pga.toml";
        var run = CliRunner.Run("worstcase", Path.Combine(Repository.Netlists, example));
        Assert.Equal(ExitCodes.CheckFailed, run.ExitCode);
        var printed = run.Output.Replace(Repository.Netlists + Path.DirectorySeparatorChar, "");
        DocBlocks.AssertCurrent(Repository.PathOf("docs", "tolerances.md"), "tolerances-deltasigma-worstcase", $"$ thermverify worstcase {example}\n{printed}");
    }

    [Fact]
    public void Choose_fixed_on_a_bridge()
    {
        var example = "fermenter-pt1000-bridge.toml";
        var run = CliRunner.Run("choose-fixed", Path.Combine(Repository.Netlists, example), "--series", "E24", "--threads", "1");
        Assert.Equal(0, run.ExitCode);
        var printed = run.Output.Replace(Repository.Netlists + Path.DirectorySeparatorChar, "");
        DocBlocks.AssertCurrent(Repository.PathOf("docs", "tolerances.md"), "tolerances-bridge-choose-fixed",
            $"$ thermverify choose-fixed {example} --series E24\n{printed}");
    }
}
