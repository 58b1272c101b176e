using System.CommandLine;
using ThermVerify.Api;
using ThermVerify.Files;

namespace ThermVerify.Cli;

/// <summary>`thermverify import`: a starting design file for a SPICE netlist, its guesses marked to confirm.</summary>
internal static class ImportCommand
{
    public static Command Create()
    {
        var netlist = new Argument<FileInfo>("netlist") { Description = "the SPICE netlist of the front end" };
        var output = new Option<FileInfo?>("--out", "-o") { Description = "write the design file here instead of standard output (put it beside the netlist)" };
        var force = new Option<bool>("--force") { Description = "replace an existing --out file" };
        var command = new Command("import", "Write a starting design file for a SPICE netlist: sensor, pin and excitation guessed and marked to confirm.")
        {
            netlist, output, force,
        };
        var work = WorkOptions.AddTo(command);
        command.SetAction((parsed, interrupt) => work.Run(parsed, interrupt, _ =>
        {
            string? design = null;
            var outputs = new OutputSet(parsed.GetValue(force));
            if (parsed.GetValue(output) is { } file)
                outputs.Add(file.ToString(), () => design!);
            outputs.CheckTargets();
            design = Verifier.ImportNetlist(parsed.GetValue(netlist)!.FullName);
            if (outputs.IsEmpty)
                parsed.InvocationConfiguration.Output.Write(design);
            else
                outputs.Write();
            return ExitCodes.Success;
        }));
        return command;
    }
}
