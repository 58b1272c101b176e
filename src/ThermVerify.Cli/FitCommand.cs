using System.CommandLine;
using ThermVerify.Quantities;
using ThermVerify.Reporting;
using ThermVerify.Reporting.Text;
using ThermVerify.Sensors;
using static ThermVerify.Cli.SensorCommand;

namespace ThermVerify.Cli;

/// <summary>`thermverify fit`: Beta and Steinhart–Hart coefficients from calibration points, with residuals.</summary>
internal static class FitCommand
{
    public static Command Create()
    {
        var points = new Argument<string[]>("points")
        {
            Description = "calibration points \"temperature = resistance\", e.g. \"0 degC = 32.65k\" \"25 degC = 10k\" \"85 degC = 1.451k\"",
            Arity = ArgumentArity.OneOrMore,
        };
        var command = new Command("fit", "Fit Beta and Steinhart–Hart coefficients to 2 or more (temperature, resistance) points.") { points };
        command.SetAction(parsed =>
        {
            var summary = SensorFitSummary.Fit(parsed.GetValue(points)!.Select(ParsePoint).ToList());
            parsed.InvocationConfiguration.Output.Write(FitText.Render(summary));
            return ExitCodes.Success;
        });
        return command;
    }

    private static TablePoint ParsePoint(string text)
    {
        var parts = text.Split('=');
        if (parts.Length != 2)
            throw new UsageException($"\"{text}\": write a point as \"temperature = resistance\", e.g. \"25 degC = 10k\"");
        return new TablePoint(QuantityParser.Parse(parts[0].Trim(), UnitKind.Celsius).Value, QuantityParser.Parse(parts[1].Trim(), UnitKind.Ohm).Value);
    }
}
