using ThermVerify.Cli;

namespace ThermVerify.Tests.Cli;

/// <summary>Runs the command in-process, as a user would from a shell, and captures what it prints.</summary>
public static class CliRunner
{
    public sealed record Outcome(int ExitCode, string Output, string Error);

    public static Outcome Run(params string[] args)
    {
        var output = new StringWriter();
        var error = new StringWriter();
        var code = CliApp.Run(args, output, error);
        return new Outcome(code, output.ToString(), error.ToString());
    }
}
