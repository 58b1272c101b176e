using System.CommandLine;
using ThermVerify.Limits;
using ThermVerify.Quantities;
using ThermVerify.Reporting;
using ThermVerify.Reporting.Text;
using ThermVerify.Sensors;

namespace ThermVerify.Cli;

/// <summary>`thermverify sensor`: a sensor's R(T) table and slope, and T(R) for given resistances.</summary>
internal static class SensorCommand
{
    public static Command Create()
    {
        var sensor = new SensorOptions();
        var range = new Option<string?>("--range") { Description = "temperature range, e.g. \"-40 degC .. 125 degC\" (default: the model's valid range)" };
        var step = new Option<string>("--step") { Description = "table step", DefaultValueFactory = _ => "5 K" };
        var resistance = new Option<string[]>("--resistance") { Description = "print the temperature at this resistance (repeatable)", AllowMultipleArgumentsPerToken = true };
        var command = new Command("sensor", "Print a sensor's resistance, slope and coefficient over temperature, and temperature at given resistances.");
        foreach (var option in sensor.All) command.Add(option);
        command.Add(range);
        command.Add(step);
        command.Add(resistance);
        var work = WorkOptions.AddTo(command);
        command.SetAction((parsed, interrupt) => work.Run(parsed, interrupt, _ =>
        {
            var model = sensor.Build(parsed);
            var rangeText = parsed.GetValue(range);
            var span = rangeText is null ? model.ValidRange : ToRange(QuantityParser.ParseRange(rangeText, UnitKind.Celsius));
            var stepKelvin = QuantityParser.Parse(parsed.GetValue(step), UnitKind.Kelvin).Value;
            var rows = (span.MaxCelsius - span.MinCelsius) / stepKelvin + 1;
            if (!(stepKelvin > 0 && rows <= Work.Limits.MaximumSweepPoints))
                throw new UsageException($"--step {parsed.GetValue(step)}: the table would have {rows:G3} rows, more than the limit of {Work.Limits.MaximumSweepPoints}; " +
                                         "use a coarser step or raise --max-points.");
            var resistances = (parsed.GetValue(resistance) ?? []).Select(r => QuantityParser.Parse(r, UnitKind.Ohm).Value).ToList();
            parsed.InvocationConfiguration.Output.Write(SensorText.Render(model, span, stepKelvin, resistances));
            return ExitCodes.Success;
        }));
        return command;
    }

    internal static TemperatureRange ToRange(QuantityRange range) => new(range.Min, range.Max);
}
