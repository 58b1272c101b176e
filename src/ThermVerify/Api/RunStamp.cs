using System.Globalization;
using ThermVerify.Check;
using ThermVerify.Design;
using ThermVerify.Firmware;
using ThermVerify.Limits;
using ThermVerify.Provenance;
using ThermVerify.Tolerances;

namespace ThermVerify.Api;

/// <summary>
/// The provenance of each job (<see cref="RunProvenance"/>): the design's digest, the engine and the settings of
/// its options that change results, named as the command line names them (not the thread count, and not the remedy
/// search, which adds remedies and changes no figure). Call it after the job, in the same
/// limits (the conversion limit is one of the settings); the command line does, once per run, and hands the record
/// to every writer.
/// </summary>
public static class RunStamp
{
    public static RunProvenance Check(FrontEndDesign design, CheckOptions? options = null)
    {
        options ??= new CheckOptions();
        return RunProvenance.Of(options.Engine.Name, options.Engine.Version, design.Source,
            Setting("sampling-points", options.MaximumSamplingPoints), Conversions());
    }

    public static RunProvenance MonteCarlo(FrontEndDesign design, MonteCarloOptions? options = null)
    {
        options ??= new MonteCarloOptions();
        return RunProvenance.Of(RunProvenance.BuiltInEngine, null, design.Source, Setting("units", options.Units), Setting("seed", options.Seed),
            new RunSetting("unit-settling", design.Adc.Kind == ConverterKind.DeltaSigma
                ? options.SimulateSettling ? "channel-switch" : "static"
                : options.SimulateSettling ? "simulated" : "nominal"), Conversions());
    }

    /// <summary>A delta-sigma design's units are static readings (no sampling transient per unit): the setting says so.</summary>
    public static RunProvenance WorstCase(FrontEndDesign design) => design.Adc.Kind == ConverterKind.DeltaSigma
        ? RunProvenance.Of(RunProvenance.BuiltInEngine, null, design.Source, new RunSetting("unit-settling", "static"), Conversions())
        : RunProvenance.Of(RunProvenance.BuiltInEngine, null, design.Source, Conversions());

    public static RunProvenance ChooseFixed(FrontEndDesign design, FixedResistorSearchOptions? options = null)
    {
        options ??= new FixedResistorSearchOptions();
        List<RunSetting> settings = [new("series", options.Series.Name.ToString()), new("objective", options.Objective switch
        {
            FixedResistorObjective.WorstResolution => "resolution",
            FixedResistorObjective.SlopeAt => "slope",
            _ => "error",
        })];
        if (options.SlopeCelsius is { } at) settings.Add(Setting("at", at, " degC"));
        if (options.MinimumOhms is { } min) settings.Add(Setting("min", min, " ohm"));
        if (options.MaximumOhms is { } max) settings.Add(Setting("max", max, " ohm"));
        settings.Add(Conversions());
        return RunProvenance.Of(RunProvenance.BuiltInEngine, null, design.Source, settings);
    }

    /// <summary>A table is computed in closed form; its settings are how the breakpoints are placed and the unit.</summary>
    public static RunProvenance Table(FrontEndDesign design, TableRequest? request = null)
    {
        request ??= new TableRequest();
        List<RunSetting> settings = [new("unit", request.Scale.Name.Replace(" ", ""))];
        if (request.BoundKelvin is { } bound) settings.Add(Setting("bound", bound, " K"));
        if (request.Breakpoints is { } n) settings.Add(Setting("breakpoints", n));
        settings.Add(new RunSetting("corrected", request.CorrectForLoading ? "yes" : "no"));
        return RunProvenance.Of("closed form", null, design.Source, settings);
    }

    private static RunSetting Conversions() => Setting("max-conversions", Work.Limits.MaximumConversions);

    private static RunSetting Setting(string name, IFormattable value, string unit = "") =>
        new(name, value.ToString(null, CultureInfo.InvariantCulture) + unit);
}
