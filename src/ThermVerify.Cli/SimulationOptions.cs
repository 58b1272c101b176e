using System.CommandLine;
using ThermVerify.Check;

namespace ThermVerify.Cli;

/// <summary>
/// The options of the commands that run the check and record what it found (check, baseline): the engine and the
/// sampling grid. Both change results, so a baseline can be made the way the checks it serves are run.
/// </summary>
internal sealed class SimulationOptions
{
    private readonly Option<int> samplingPoints = new("--sampling-points")
    {
        Description = "simulate sampling at this many temperatures at most (every point of the sweep when it has fewer)",
        DefaultValueFactory = _ => new CheckOptions().MaximumSamplingPoints,
    };
    private readonly Option<string> engine = new("--engine")
    {
        Description = "simulation engine: built-in, or ngspice (needs the ngspice shared library; a design's own subcircuit needs ngspice)",
        DefaultValueFactory = _ => EngineChoice.BuiltIn,
    };
    private readonly Option<bool> process = new("--ngspice-process") { Description = "with --engine ngspice: run every deck in a child 'ngspice -b' process instead of the shared library" };

    public static SimulationOptions AddTo(Command command)
    {
        var options = new SimulationOptions();
        options.engine.AcceptOnlyFromAmong(EngineChoice.BuiltIn, EngineChoice.Ngspice);
        options.samplingPoints.Validators.Add(r =>
        {
            if (r.GetValueOrDefault<int>() < 2) r.AddError("--sampling-points must be at least 2 (both ends of the range)");
        });
        command.Options.Add(options.samplingPoints);
        command.Options.Add(options.engine);
        command.Options.Add(options.process);
        return options;
    }

    /// <summary>The engine asked for, to be disposed when the run ends.</summary>
    public ChosenEngine Engine(ParseResult parsed) => EngineChoice.Create(parsed.GetValue(engine)!, parsed.GetValue(process));

    public int SamplingPoints(ParseResult parsed) => parsed.GetValue(samplingPoints);
}
