using ThermVerify.Cli;

namespace ThermVerify.Tests.Cli;

/// <summary>The command line with a delta-sigma design: check runs it; the analyses that do not model it refuse it with exit code 2.</summary>
public class DeltaSigmaCommandTests
{
    private static string Example(string name) =>
        Path.Combine(AppContext.BaseDirectory, "..", "..", "..", "..", "..", "netlists", name);

    [Theory]
    [InlineData("worstcase")]
    [InlineData("montecarlo")]
    [InlineData("table")]
    public void An_analysis_built_on_an_acquisition_window_refuses_a_delta_sigma_design_with_exit_code_2(string command)
    {
        var run = CliRunner.Run(command, Example("kiln-bank-pt100-deltasigma.toml"));
        Assert.Equal(ExitCodes.BadInput, run.ExitCode);
        Assert.Contains("delta-sigma", run.Error);
        Assert.Contains("refused rather than treated as the other kind", run.Error);
        Assert.DoesNotContain("internal error", run.Error);
    }

    [Fact]
    public void Check_fails_the_kiln_example_on_its_channel_switch()
    {
        var run = CliRunner.Run("check", Example("kiln-bank-pt100-deltasigma.toml"), "--no-remedies");
        Assert.Equal(ExitCodes.CheckFailed, run.ExitCode);
        Assert.Contains("FAIL channel-switch", run.Output);
        Assert.Contains("readings_discarded = ", run.Output);
    }
}
