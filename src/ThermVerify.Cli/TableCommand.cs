using System.CommandLine;
using System.Globalization;
using ThermVerify.Api;
using ThermVerify.Design;
using ThermVerify.Files;
using ThermVerify.Firmware;
using ThermVerify.Provenance;
using ThermVerify.Quantities;
using ThermVerify.Reporting.Text;

namespace ThermVerify.Cli;

/// <summary>`thermverify table`: the code-to-temperature table a design needs, as a C header and CSV, with its error.</summary>
internal static class TableCommand
{
    public static Command Create()
    {
        var design = new Argument<FileInfo>("design") { Description = "the design file (TOML)" };
        var header = new Option<FileInfo?>("--header") { Description = "write a C99 header with the table, the interpolation routine and fault thresholds" };
        var csv = new Option<FileInfo?>("--csv") { Description = "write the table as CSV (code, temperature in °C)" };
        var bound = new Option<string?>("--bound") { Description = "place breakpoints so that interpolation stays within this error, e.g. \"0.05 K\"" };
        var breakpoints = new Option<int?>("--breakpoints") { Description = "use at most this many breakpoints, placed to minimise the worst error" };
        var unit = new Option<string>("--unit") { Description = "fixed-point unit of the table: 0.1K, 0.01K or 0.001K", DefaultValueFactory = _ => "0.01K" };
        unit.AcceptOnlyFromAmong("1K", "0.1K", "0.01K", "0.001K");
        var corrected = new Option<bool>("--corrected") { Description = "correct the table for the simulated DC loading of the pin" };
        var prefix = new Option<string?>("--prefix") { Description = "C identifier prefix (default: from the design name)" };
        var force = new Option<bool>("--force") { Description = "replace output files that exist" };
        var command = new Command("table", "Generate the ADC-code-to-temperature table for firmware, with its error at every code.")
        {
            design, header, csv, bound, breakpoints, unit, corrected, prefix, force,
        };
        command.Validators.Add(result =>
        {
            if (result.GetValue(bound) is not null && result.GetValue(breakpoints) is not null)
                result.AddError("--bound and --breakpoints place the breakpoints in two different ways; give one of them");
        });
        var work = WorkOptions.AddTo(command);
        command.SetAction((parsed, interrupt) => work.Run(parsed, interrupt, _ =>
        {
            var loaded = DesignLoader.Load(parsed.GetValue(design)!.FullName);
            FirmwareTableRun? run = null;
            RunProvenance? provenance = null;
            var outputs = new OutputSet(parsed.GetValue(force));
            if (parsed.GetValue(header) is { } h)
                outputs.Add(h.ToString(), () => CHeaderRenderer.Render(run!.Header, provenance!));
            if (parsed.GetValue(csv) is { } c)
                outputs.Add(c.ToString(), () => TableCsvRenderer.Render(run!.Table, breakpointsOnly: !run.Table.IsDense));
            outputs.CheckTargets();
            var request = new TableRequest
            {
                Scale = FixedPointUnit(parsed.GetValue(unit)!),
                BoundKelvin = parsed.GetValue(bound) is { } b ? QuantityParser.Parse(b, UnitKind.Kelvin).Value : null,
                Breakpoints = parsed.GetValue(breakpoints),
                CorrectForLoading = parsed.GetValue(corrected),
                Prefix = parsed.GetValue(prefix),
            };
            run = Verifier.Table(loaded, request);
            provenance = RunStamp.Table(loaded, request);
            outputs.Write();
            parsed.InvocationConfiguration.Output.Write(TableText.Render(run, provenance));
            return ExitCodes.Success;
        }));
        return command;
    }

    /// <summary>"0.01K" → hundredths of a kelvin.</summary>
    internal static FixedPointScale FixedPointUnit(string text) =>
        new((int)Math.Round(1 / double.Parse(text.TrimEnd('K'), CultureInfo.InvariantCulture)));
}
