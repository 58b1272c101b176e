using ThermVerify.Cli;

namespace ThermVerify.Tests.Cli;

/// <summary>A mistyped command or option is answered with the nearest valid name; options that exclude each other are refused.</summary>
public class UsageHintTests
{
    [Fact]
    public void A_mistyped_command_gets_the_nearest_command()
    {
        var run = CliRunner.Run("chek", "design.toml");
        Assert.Equal(ExitCodes.BadInput, run.ExitCode);
        Assert.Contains("'chek' is not a command; did you mean 'check'?", run.Error);
    }

    [Fact]
    public void A_mistyped_option_gets_the_nearest_option_of_that_command()
    {
        var run = CliRunner.Run("check", "design.toml", "--thread", "2");
        Assert.Equal(ExitCodes.BadInput, run.ExitCode);
        Assert.Contains("'--thread' is not an option of 'check'; did you mean '--threads'?", run.Error);
    }

    [Fact]
    public void A_word_far_from_every_command_gets_no_guess()
    {
        var run = CliRunner.Run("photosynthesis");
        Assert.Equal(ExitCodes.BadInput, run.ExitCode);
        Assert.DoesNotContain("did you mean", run.Error);
    }

    [Fact]
    public void Table_refuses_a_bound_and_a_breakpoint_count_together()
    {
        var run = CliRunner.Run("table", Path.Combine(Repository.Netlists, "oven-pt1000.toml"), "--bound", "0.1 K", "--breakpoints", "20");
        Assert.Equal(ExitCodes.BadInput, run.ExitCode);
        Assert.Contains("--bound and --breakpoints", run.Error);
    }
}
