using System.CommandLine;
using ThermVerify.Api;
using ThermVerify.Design;
using ThermVerify.Files;
using ThermVerify.FrontEnd;

namespace ThermVerify.Cli;

/// <summary>`thermverify deck`: write a design's SPICE deck for one analysis, to standard output or a file.</summary>
internal static class DeckCommand
{
    public static Command Create()
    {
        var design = new Argument<FileInfo>("design") { Description = "the design file (TOML)" };
        var analysis = new Option<string>("--analysis", "-a")
        {
            Description = "dc (temperature sweep over the check range), tran (sampling transient), ac or noise (excitation to ADC pin)",
            DefaultValueFactory = _ => "dc",
        };
        analysis.AcceptOnlyFromAmong("dc", "tran", "ac", "noise");
        var output = new Option<FileInfo?>("--out", "-o") { Description = "write the deck to this file instead of standard output" };
        var force = new Option<bool>("--force") { Description = "replace an existing --out file" };
        var temperature = new Option<double?>("--temperature") { Description = "circuit temperature in °C for tran, ac and noise (default: middle of the check range)" };
        var conversions = new Option<int>("--conversions") { Description = "conversions the sampling transient covers (a delta-sigma converter: readings after a channel switch)", DefaultValueFactory = _ => 16 };
        conversions.Validators.Add(r =>
        {
            if (r.GetValueOrDefault<int>() is < 1 or > 1_000_000) r.AddError("--conversions must be between 1 and 1000000");
        });
        var bare = new Option<bool>("--bare") { Description = "only the netlist and its analysis, without the statements that make a batch run print the figures" };
        var command = new Command("deck", "Write a SPICE deck of the design for one analysis (runs in ngspice or any SPICE engine).")
        {
            design, analysis, output, temperature, conversions, bare, force,
        };
        var work = WorkOptions.AddTo(command);
        command.SetAction((parsed, interrupt) => work.Run(parsed, interrupt, _ =>
        {
            string? deck = null;
            var outputs = new OutputSet(parsed.GetValue(force));
            if (parsed.GetValue(output) is { } file)
                outputs.Add(file.ToString(), () => deck!);
            outputs.CheckTargets();
            var loaded = DesignLoader.Load(parsed.GetValue(design)!.FullName);
            var which = parsed.GetValue(analysis) switch
            {
                "tran" => DeckAnalysis.Tran,
                "ac" => DeckAnalysis.Ac,
                "noise" => DeckAnalysis.Noise,
                _ => DeckAnalysis.Dc,
            };
            deck = Verifier.Deck(loaded, which, new DeckOptions
            {
                TemperatureCelsius = parsed.GetValue(temperature),
                Conversions = parsed.GetValue(conversions),
                PrintFigures = !parsed.GetValue(bare),
            });
            if (outputs.IsEmpty)
                parsed.InvocationConfiguration.Output.Write(deck);
            else
                outputs.Write();
            return ExitCodes.Success;
        }));
        return command;
    }
}
