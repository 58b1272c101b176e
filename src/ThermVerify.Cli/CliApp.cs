using System.CommandLine;

namespace ThermVerify.Cli;

/// <summary>
/// Wires the commands, turns parse errors into exit code 2 and exceptions into a message and a code.
/// No stack trace ever reaches the user.
/// </summary>
public static class CliApp
{
    public static int Run(string[] args, TextWriter output, TextWriter error)
    {
        var root = new RootCommand(
            "thermverify: prove that the temperature your firmware reports from a thermistor or RTD on an ADC " +
            "is the temperature that is really there.")
        {
            SensorCommand.Create(),
            FitCommand.Create(),
            ValidateCommand.Create(),
            CheckCommand.Create(),
            BaselineCommand.Create(),
            TableCommand.Create(),
            VerifyTableCommand.Create(),
            CompareCommand.Create(),
            WorstCaseCommand.Create(),
            MonteCarloCommand.Create(),
            ChooseFixedCommand.Create(),
            DeckCommand.Create(),
            ImportCommand.Create(),
            WatchCommand.Create(),
        };
        if (args.Length == 0)
        {
            root.Parse(["--help"]).Invoke(new InvocationConfiguration { Output = error, Error = error });
            return ExitCodes.BadInput;
        }
        var parsed = root.Parse(args);
        if (parsed.Errors.Count > 0)
        {
            foreach (var parseError in parsed.Errors) error.WriteLine($"thermverify: {parseError.Message}");
            foreach (var hint in Suggestions.For(parsed)) error.WriteLine($"thermverify: {hint}");
            error.WriteLine("Run 'thermverify --help' for the commands and their options.");
            return ExitCodes.BadInput;
        }

        // Ctrl+C and SIGTERM are the process's own (Interruption, linked into every command's token by WorkOptions):
        // System.CommandLine's handling is off, since it let a second Ctrl+C kill the process during the clean-up.
        var configuration = new InvocationConfiguration
        {
            Output = output, Error = error, EnableDefaultExceptionHandler = false, ProcessTerminationTimeout = null,
        };
        try
        {
            return parsed.Invoke(configuration);
        }
        catch (Exception exception)
        {
            return ErrorReport.Write(exception, error);
        }
    }
}
