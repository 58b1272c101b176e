using System.CommandLine;
using System.Globalization;
using ThermVerify.Quantities;
using ThermVerify.Reporting;
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
        command.SetAction(parsed =>
        {
            var output = parsed.InvocationConfiguration.Output;
            var model = sensor.Build(parsed);
            var rangeText = parsed.GetValue(range);
            var span = rangeText is null ? model.ValidRange : ToRange(QuantityParser.ParseRange(rangeText, UnitKind.Celsius));
            var stepKelvin = QuantityParser.Parse(parsed.GetValue(step), UnitKind.Kelvin).Value;

            output.WriteLine(model.Description);
            output.WriteLine($"valid range: {model.ValidRange}");
            output.WriteLine();
            var table = new TextTable("T (°C)", "R", "dR/dT (Ω/K)", "α (%/K)");
            foreach (var row in SensorTabulation.Tabulate(model, span, stepKelvin))
                table.AddRow(Number(row.Celsius, "0.##"), EngineeringFormat.Format(row.Ohms, UnitKind.Ohm, 5),
                    Number(row.SlopeOhmsPerKelvin, "G5"), Number(100 * row.AlphaPerKelvin, "0.0000"));
            output.Write(table);

            var asked = parsed.GetValue(resistance) ?? [];
            if (asked.Length == 0) return ExitCodes.Success;
            output.WriteLine();
            var inverse = new TextTable("R", "T (°C)");
            foreach (var text in asked)
            {
                var ohms = QuantityParser.Parse(text, UnitKind.Ohm).Value;
                inverse.AddRow(EngineeringFormat.Format(ohms, UnitKind.Ohm, 5), Number(model.TemperatureCelsius(ohms), "0.0000"));
            }
            output.Write(inverse);
            return ExitCodes.Success;
        });
        return command;
    }

    internal static TemperatureRange ToRange(QuantityRange range) => new(range.Min, range.Max);

    internal static string Number(double value, string format) => value.ToString(format, CultureInfo.InvariantCulture);
}
