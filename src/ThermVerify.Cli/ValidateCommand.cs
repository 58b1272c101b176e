using System.CommandLine;
using ThermVerify.Design;

namespace ThermVerify.Cli;

/// <summary>`thermverify validate`: load a design strictly and print it normalised, every default explicit.</summary>
internal static class ValidateCommand
{
    public static Command Create()
    {
        var design = new Argument<FileInfo>("design") { Description = "the design file (TOML)" };
        var command = new Command("validate", "Check a design file and print it normalised, with every default made explicit.") { design };
        var work = WorkOptions.AddTo(command);
        command.SetAction((parsed, interrupt) => work.Run(parsed, interrupt, _ =>
        {
            var loaded = DesignLoader.Load(parsed.GetValue(design)!.FullName);
            loaded.Sensor.Build(); // a table that cannot be used is an error of the design, found here rather than later
            parsed.InvocationConfiguration.Output.Write(DesignWriter.ToToml(loaded));
            return ExitCodes.Success;
        }));
        return command;
    }
}
