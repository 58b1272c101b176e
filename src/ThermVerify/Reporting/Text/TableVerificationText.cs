using System.Text;
using ThermVerify.Firmware;
using static ThermVerify.Reporting.Text.TextNumbers;

namespace ThermVerify.Reporting.Text;

/// <summary>What `verify-table` prints: the verdict, the first rows that disagree, the likely causes.</summary>
public static class TableVerificationText
{
    private const int ShownRows = 20;

    public static string Render(string tableName, TableVerification result, double budgetKelvin)
    {
        var text = new StringBuilder();
        text.AppendLine(Invariant(
            $"{(result.Passes ? "PASS" : "FAIL")}: {tableName}, {result.RowCount} rows, worst disagreement {result.MaxAbsErrorKelvin:0.0000} K (budget {budgetKelvin:0.###} K)"));
        if (result.Disagreements.Count > 0)
        {
            var rows = new TextTable("line", "code", "table (°C)", "hardware (°C)", "error (K)");
            foreach (var d in result.Disagreements.Take(ShownRows))
                rows.AddRow(Integer(d.Row.Line), Integer(d.Row.Code), Format(d.Row.Celsius, "0.0000"), Format(d.ModelCelsius, "0.0000"), Format(d.ErrorKelvin, "0.0000"));
            text.AppendLine();
            text.Append(rows);
            if (result.Disagreements.Count > ShownRows) text.AppendLine($"... and {result.Disagreements.Count - ShownRows} more rows");
        }
        foreach (var cause in result.LikelyCauses)
            text.AppendLine($"likely cause: {cause.Explanation}");
        if (result.BetweenRows is { } between)
            text.AppendLine(Invariant($"between rows, linear interpolation errs by up to {between.MaxAbsErrorKelvin:0.0000} K (at code {between.AtCode})"));
        return text.ToString();
    }
}
