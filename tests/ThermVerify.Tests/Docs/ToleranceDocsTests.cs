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
}
