using System.CommandLine;
using ThermVerify.Api;
using ThermVerify.Components;
using ThermVerify.Design;
using ThermVerify.Provenance;
using ThermVerify.Quantities;
using ThermVerify.Reporting;
using ThermVerify.Reporting.Text;
using ThermVerify.Tolerances;

namespace ThermVerify.Cli;

/// <summary>`thermverify choose-fixed`: rank the values of an E-series as the divider's fixed resistor (or a current source's reference resistor).</summary>
internal static class ChooseFixedCommand
{
    private static readonly Dictionary<string, FixedResistorObjective> Objectives = new()
    {
        ["error"] = FixedResistorObjective.WorstError,
        ["resolution"] = FixedResistorObjective.WorstResolution,
        ["slope"] = FixedResistorObjective.SlopeAt,
    };

    public static Command Create()
    {
        var design = new Argument<FileInfo>("design") { Description = "the design file (TOML)" };
        var series = new Option<string>("--series") { Description = "IEC 60063 series to choose from (E6 … E192)", DefaultValueFactory = _ => "E96" };
        var objective = new Option<string>("--objective")
        {
            Description = "error: smallest worst reported error; resolution: finest worst K per LSB; slope: steepest dV/dT at --at",
            DefaultValueFactory = _ => "error",
        };
        objective.AcceptOnlyFromAmong([.. Objectives.Keys]);
        var at = new Option<string?>("--at") { Description = "temperature of the slope objective (default: the middle of the check range)" };
        var min = new Option<string?>("--min") { Description = "smallest candidate (default: the sensor's smallest resistance over the range; a reference resistor: G·R_s(max))" };
        var max = new Option<string?>("--max") { Description = "largest candidate (default: the sensor's largest resistance over the range; a reference resistor: 4 times the smallest)" };
        var top = new Option<int>("--top") { Description = "candidates to print", DefaultValueFactory = _ => 15 };
        var threads = new Option<int>("--threads") { Description = "candidates checked in parallel", DefaultValueFactory = _ => Environment.ProcessorCount };
        var command = new Command("choose-fixed", "Search an E-series for the fixed resistor that gives the smallest worst error (loading, settling and self-heating included) or the finest resolution.")
        {
            design, series, objective, at, min, max, top, threads,
        };
        var outputs = AnalysisOutputs.AddTo(command);
        var work = WorkOptions.AddTo(command);
        command.SetAction((parsed, interrupt) => work.Run(parsed, interrupt, cancel =>
        {
            var loaded = DesignLoader.Load(parsed.GetValue(design)!.FullName);
            var seriesName = parsed.GetValue(series)!;
            if (!ESeries.TryParse(seriesName, out var chosen))
                throw new UsageException($"--series {seriesName}: not an IEC 60063 series; use E6, E12, E24, E48, E96 or E192.");
            IReadOnlyList<FixedResistorCandidate>? ranked = null;
            FixedResistorSearchOptions? options = null;
            var designPath = parsed.GetValue(design)!.ToString();
            var set = outputs.NewSet(parsed);
            RunProvenance? provenance = null;
            outputs.Declare(parsed, set, () => FixedResistorJson.Write(ranked!, loaded, options!, provenance!, designPath),
                () => FixedResistorReport.Build(ranked!, loaded, options!, provenance!, designPath, parsed.GetValue(top)));
            set.CheckTargets();
            var goal = Objectives[parsed.GetValue(objective)!];
            options = new FixedResistorSearchOptions
            {
                Series = chosen,
                Objective = goal,
                SlopeCelsius = parsed.GetValue(at) is { } a ? QuantityParser.Parse(a, UnitKind.Celsius).Value : null,
                MinimumOhms = parsed.GetValue(min) is { } lo ? QuantityParser.Parse(lo, UnitKind.Ohm).Value : null,
                MaximumOhms = parsed.GetValue(max) is { } hi ? QuantityParser.Parse(hi, UnitKind.Ohm).Value : null,
                Threads = Math.Max(1, parsed.GetValue(threads)),
                Progress = goal == FixedResistorObjective.SlopeAt ? null : work.Progress(parsed, "candidates"),
                Cancel = cancel,
            };
            if (options.MinimumOhms is { } minimum && options.MaximumOhms is { } maximum && !(minimum > 0 && maximum >= minimum))
                throw new UsageException($"--min {parsed.GetValue(min)} and --max {parsed.GetValue(max)}: give a positive range with --min not above --max.");
            ranked = Verifier.ChooseFixed(loaded, options);
            provenance = RunStamp.ChooseFixed(loaded, options);
            if (ranked.Count == 0)
                throw new UsageException($"No {chosen} value lies between the bounds; widen --min/--max or choose a finer series.");
            set.Write();
            parsed.InvocationConfiguration.Output.Write(FixedResistorText.Render(loaded, chosen, goal, ranked, parsed.GetValue(top), provenance));
            outputs.Announce(parsed);
            return ExitCodes.Success;
        }));
        return command;
    }
}
