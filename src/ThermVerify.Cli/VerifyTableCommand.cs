using System.CommandLine;
using System.Globalization;
using ThermVerify.Design;
using ThermVerify.Firmware;
using ThermVerify.Quantities;
using ThermVerify.Reporting;

namespace ThermVerify.Cli;

/// <summary>`thermverify verify-table`: does the firmware's table match the hardware? Exit 1 where it does not.</summary>
internal static class VerifyTableCommand
{
    public static Command Create()
    {
        var design = new Argument<FileInfo>("design") { Description = "the design file (TOML)" };
        var table = new Argument<FileInfo>("table") { Description = "the firmware's table: CSV of ADC code and temperature" };
        var unit = new Option<string?>("--unit") { Description = "temperatures are fixed point in this unit (1K, 0.1K, 0.01K, 0.001K); default °C as decimals" };
        unit.AcceptOnlyFromAmong("1K", "0.1K", "0.01K", "0.001K");
        var budget = new Option<string?>("--budget") { Description = "allowed disagreement (default: the design's [check] budget)" };
        var corrected = new Option<bool>("--corrected") { Description = "compare with the model corrected for the simulated DC loading" };
        var command = new Command("verify-table", "Check a firmware code-to-temperature table against the design and name the likely cause of disagreement.")
        {
            design, table, unit, budget, corrected,
        };
        command.SetAction(parsed =>
        {
            var loaded = DesignLoader.Load(parsed.GetValue(design)!.FullName);
            var file = parsed.GetValue(table)!;
            FixedPointScale? scale = parsed.GetValue(unit) is { } u
                ? new FixedPointScale((int)Math.Round(1 / double.Parse(u.TrimEnd('K'), CultureInfo.InvariantCulture)))
                : null;
            var rows = TableCsvReader.Parse(File.ReadAllText(file.FullName), file.Name, scale);
            var allowed = parsed.GetValue(budget) is { } b ? QuantityParser.Parse(b, UnitKind.Kelvin).Value : loaded.Check.BudgetKelvin;
            var result = TableVerifier.Verify(FirmwareFromDesign.Model(loaded, parsed.GetValue(corrected)), rows, allowed);

            var output = parsed.InvocationConfiguration.Output;
            output.WriteLine(FormattableString.Invariant(
                $"{(result.Passes ? "PASS" : "FAIL")}: {file.Name}, {result.RowCount} rows, worst disagreement {result.MaxAbsErrorKelvin:0.0000} K (budget {allowed:0.###} K)"));
            if (result.Disagreements.Count > 0)
            {
                var rowsTable = new TextTable("line", "code", "table (°C)", "hardware (°C)", "error (K)");
                foreach (var d in result.Disagreements.Take(20))
                    rowsTable.AddRow(d.Row.Line.ToString(CultureInfo.InvariantCulture), d.Row.Code.ToString(CultureInfo.InvariantCulture),
                        N(d.Row.Celsius), N(d.ModelCelsius), N(d.ErrorKelvin));
                output.WriteLine();
                output.Write(rowsTable);
                if (result.Disagreements.Count > 20) output.WriteLine($"... and {result.Disagreements.Count - 20} more rows");
            }
            foreach (var cause in result.LikelyCauses)
                output.WriteLine($"likely cause: {cause.Explanation}");
            if (result.BetweenRows is { } between)
                output.WriteLine(FormattableString.Invariant($"between rows, linear interpolation errs by up to {between.MaxAbsErrorKelvin:0.0000} K (at code {between.AtCode})"));
            return result.Passes ? ExitCodes.Success : ExitCodes.CheckFailed;
        });
        return command;
    }

    private static string N(double value) => value.ToString("0.0000", CultureInfo.InvariantCulture);
}
