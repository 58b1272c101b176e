using System.CommandLine;
using ThermVerify.Quantities;
using ThermVerify.Reporting;
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
            var output = parsed.InvocationConfiguration.Output;
            var summary = SensorFitSummary.Fit(parsed.GetValue(points)!.Select(ParsePoint).ToList());

            output.WriteLine($"Beta (from the outermost points): β = {Number(summary.Beta.Model.Beta, "0.###")} K, " +
                             $"R0 = {EngineeringFormat.Format(summary.Beta.Model.R0Ohms, UnitKind.Ohm, 6)} at {Number(summary.Beta.Model.T0Celsius, "0.###")} °C");
            WriteFit(output, "Steinhart–Hart (A + B ln R + C ln³R)", summary.SteinhartHart);
            WriteFit(output, "Steinhart–Hart with squared term (+ D ln²R)", summary.SteinhartHartWithSquaredTerm);
            output.WriteLine();

            var table = new TextTable(["T (°C)", "R", "Beta residual (K)",
                .. summary.SteinhartHart is null ? Array.Empty<string>() : ["S–H residual (K)"],
                .. summary.SteinhartHartWithSquaredTerm is null ? Array.Empty<string>() : ["S–H4 residual (K)"]]);
            for (var i = 0; i < summary.Points.Count; i++)
            {
                var p = summary.Points[i];
                table.AddRow([Number(p.Celsius, "0.###"), EngineeringFormat.Format(p.Ohms, UnitKind.Ohm, 6), Number(summary.Beta.ResidualsKelvin[i], "0.00000"),
                    .. summary.SteinhartHart is null ? Array.Empty<string>() : [Number(summary.SteinhartHart.ResidualsKelvin[i], "0.0000000")],
                    .. summary.SteinhartHartWithSquaredTerm is null ? Array.Empty<string>() : [Number(summary.SteinhartHartWithSquaredTerm.ResidualsKelvin[i], "0.0000000")]]);
            }
            output.Write(table);
            return ExitCodes.Success;
        });
        return command;
    }

    private static void WriteFit(TextWriter output, string title, SensorFit<SteinhartHartThermistor>? fit)
    {
        if (fit is null) return;
        var m = fit.Model;
        output.WriteLine($"{title}: A = {Sci(m.A)}, B = {Sci(m.B)}, C = {Sci(m.C)}" + (m.D != 0 ? $", D = {Sci(m.D)}" : "") +
                         $"; worst residual {Number(fit.MaxAbsResidualKelvin, "G3")} K");
    }

    private static string Sci(double value) => Number(value, "0.0000000000E+0");

    private static TablePoint ParsePoint(string text)
    {
        var parts = text.Split('=');
        if (parts.Length != 2)
            throw new UsageException($"\"{text}\": write a point as \"temperature = resistance\", e.g. \"25 degC = 10k\"");
        return new TablePoint(QuantityParser.Parse(parts[0].Trim(), UnitKind.Celsius).Value, QuantityParser.Parse(parts[1].Trim(), UnitKind.Ohm).Value);
    }
}
