using System.CommandLine;
using System.Globalization;
using ThermVerify.Api;
using ThermVerify.Design;
using ThermVerify.Files;
using ThermVerify.Firmware;
using ThermVerify.Limits;
using ThermVerify.Quantities;
using ThermVerify.Reporting;
using ThermVerify.Reporting.Text;

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
        var work = WorkOptions.AddTo(command);
        command.SetAction((parsed, interrupt) => work.Run(parsed, interrupt, _ =>
        {
            var loaded = DesignLoader.Load(parsed.GetValue(design)!.FullName);
            var file = parsed.GetValue(table)!;
            var allowed = parsed.GetValue(budget) is { } b ? QuantityParser.Parse(b, UnitKind.Kelvin).Value : loaded.Check.BudgetKelvin;
            var result = Verifier.VerifyTable(loaded, ReadTable(file), file.Name,
                parsed.GetValue(unit) is { } u ? TableCommand.FixedPointUnit(u) : null, allowed, parsed.GetValue(corrected));
            parsed.InvocationConfiguration.Output.Write(TableVerificationText.Render(file.Name, result, allowed));
            return result.Passes ? ExitCodes.Success : ExitCodes.CheckFailed;
        }));
        return command;
    }

    private static string ReadTable(FileInfo file)
    {
        try
        {
            return InputFile.ReadText(file.FullName, Work.Limits.MaximumFileBytes);
        }
        catch (InputFileException e)
        {
            throw new UsageException($"{file}: the firmware table {e.Problem}. {e.Hint}");
        }
    }
}
