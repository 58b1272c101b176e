using System.Globalization;
using ThermVerify.Design;
using ThermVerify.Firmware;

namespace ThermVerify.Tests.Firmware;

public class TableVerifierTests
{
    private static readonly FirmwareModel Model = FirmwareTestModels.NtcLowSide();

    private static IReadOnlyList<TableRow> Csv(FirmwareModel madeFrom, bool breakpointsOnly = false, double bound = 0.05)
    {
        var table = breakpointsOnly
            ? TableBuilder.WithinBound(madeFrom, FixedPointScale.CentiKelvin, bound)
            : TableBuilder.EveryCode(madeFrom, FixedPointScale.CentiKelvin);
        return TableCsvReader.Parse(TableCsvRenderer.Render(table, breakpointsOnly), "table.csv");
    }

    [Fact]
    public void A_table_made_from_the_model_passes()
    {
        // Every row is the true temperature rounded to 0.01 K, so no row can be more than 0.005 K off.
        var result = TableVerifier.Verify(Model, Csv(Model), budgetKelvin: 0.01);
        Assert.True(result.Passes, string.Join("; ", result.LikelyCauses.Select(c => c.Explanation)));
        Assert.True(result.MaxAbsErrorKelvin <= 0.005 + 1e-12);
    }

    [Fact]
    public void A_breakpoint_table_is_checked_between_its_rows()
    {
        // Made for a 0.05 K bound, so straight lines between the rows stay within 0.05 K plus rounding; a 0.02 K
        // budget passes every row (each is only rounded) but must fail between them.
        var rows = Csv(Model, breakpointsOnly: true, bound: 0.05);
        var loose = TableVerifier.Verify(Model, rows, budgetKelvin: 0.06);
        Assert.True(loose.Passes);
        Assert.True(loose.BetweenRows!.MaxAbsErrorKelvin > 0.02 && loose.BetweenRows.MaxAbsErrorKelvin <= 0.055);
        var tight = TableVerifier.Verify(Model, rows, budgetKelvin: 0.02);
        Assert.Empty(tight.Disagreements);
        Assert.False(tight.Passes);
    }

    [Fact]
    public void A_table_in_fixed_point_units_reads_and_passes()
    {
        var table = TableBuilder.EveryCode(Model, FixedPointScale.DeciKelvin);
        var text = "# deci-degrees\n" + string.Concat(table.Codes.Select((c, i) => FormattableString.Invariant($"{c},{table.Values[i]}\n")));
        var result = TableVerifier.Verify(Model, TableCsvReader.Parse(text, "deci.csv", FixedPointScale.DeciKelvin), 0.05 + 1e-9);
        Assert.True(result.Passes);
    }

    [Fact]
    public void A_table_made_with_another_beta_is_caught_and_beta_is_named()
    {
        var result = TableVerifier.Verify(Model, Csv(FirmwareTestModels.NtcLowSide(beta: 3380)), budgetKelvin: 0.1);
        Assert.False(result.Passes);
        var cause = Assert.Single(result.LikelyCauses);
        Assert.Equal(TableCauseKind.WrongBeta, cause.Kind);
        // The rows were made with β = 3380 K and rounded to 0.01 K, so the fitted β lands within a kelvin of it.
        Tolerance.AssertClose(3380, cause.FittedValue!.Value, rel: 0, abs: 1, what: "fitted β");
    }

    [Fact]
    public void A_table_made_with_another_fixed_resistor_is_caught_and_the_resistor_is_named()
    {
        var result = TableVerifier.Verify(Model, Csv(FirmwareTestModels.NtcLowSide(fixedOhms: 12_000)), budgetKelvin: 0.1);
        Assert.False(result.Passes);
        var cause = Assert.Single(result.LikelyCauses);
        Assert.Equal(TableCauseKind.WrongFixedResistor, cause.Kind);
        Tolerance.AssertClose(12_000, cause.FittedValue!.Value, rel: 1e-3, what: "fitted fixed resistor");
    }

    [Fact]
    public void A_table_made_for_the_other_side_is_caught_and_the_side_is_named()
    {
        var result = TableVerifier.Verify(Model, Csv(FirmwareTestModels.NtcLowSide(SensorSide.High)), budgetKelvin: 0.1);
        Assert.False(result.Passes);
        Assert.Contains(result.LikelyCauses, c => c.Kind == TableCauseKind.SensorOnOtherSide);
        Assert.DoesNotContain(result.LikelyCauses, c => c.Kind is TableCauseKind.WrongBeta or TableCauseKind.WrongFixedResistor);
    }

    [Fact]
    public void Two_swapped_temperatures_are_found_by_line()
    {
        var rows = Csv(Model, breakpointsOnly: true).ToArray();
        (rows[5], rows[9]) = (rows[5] with { Celsius = rows[9].Celsius }, rows[9] with { Celsius = rows[5].Celsius });
        var result = TableVerifier.Verify(Model, rows, budgetKelvin: 0.1);
        Assert.False(result.Passes);
        var swapped = Assert.Single(result.LikelyCauses, c => c.Kind == TableCauseKind.SwappedRows);
        Assert.Equal([rows[5].Line, rows[9].Line], swapped.Lines);
        Assert.DoesNotContain(result.LikelyCauses, c => c.Kind is TableCauseKind.WrongBeta or TableCauseKind.WrongFixedResistor or TableCauseKind.SensorOnOtherSide);
    }

    [Fact]
    public void Neighbouring_codes_swapped_within_the_budget_still_fail_as_not_monotone()
    {
        var rows = Csv(Model).ToArray();
        (rows[100], rows[101]) = (rows[100] with { Celsius = rows[101].Celsius }, rows[101] with { Celsius = rows[100].Celsius });
        var result = TableVerifier.Verify(Model, rows, budgetKelvin: 1);
        Assert.Empty(result.Disagreements);
        Assert.False(result.Passes);
        Assert.Equal([rows[101].Line], Assert.Single(result.LikelyCauses, c => c.Kind == TableCauseKind.NotMonotonic).Lines);
    }

    [Fact]
    public void One_mistyped_row_is_named_and_nothing_else_is_blamed()
    {
        var rows = Csv(Model).ToArray();
        rows[700] = rows[700] with { Celsius = rows[700].Celsius + 2 };
        var result = TableVerifier.Verify(Model, rows, budgetKelvin: 0.1);
        var disagreement = Assert.Single(result.Disagreements);
        Assert.Equal(rows[700].Line, disagreement.Row.Line);
        Assert.Contains(result.LikelyCauses, c => c.Kind == TableCauseKind.RowOutOfPlace && c.Lines.SequenceEqual([rows[700].Line]));
    }

    [Fact]
    public void Rows_out_of_code_order_are_reported()
    {
        var rows = Csv(Model, breakpointsOnly: true).ToList();
        (rows[3], rows[4]) = (rows[4], rows[3]);
        var result = TableVerifier.Verify(Model, rows, budgetKelvin: 0.1);
        Assert.Empty(result.Disagreements);
        Assert.False(result.Passes);
        Assert.Contains(result.LikelyCauses, c => c.Kind == TableCauseKind.RowsOutOfOrder && c.Lines.Contains(rows[4].Line));
    }

    [Theory]
    [InlineData("code,temp\n100,20.5\n101,20.4,7\n", 3, "2 fields")]
    [InlineData("100,20.5\nabc,20.4\n", 2, "not a whole number")]
    [InlineData("100,20.5\n101,warm\n", 2, "not a number")]
    [InlineData("100,20.5\n\n100,20.4\n", 3, "first on line 1")]
    [InlineData("# only a comment\n", 2, "no rows")]
    public void Bad_csv_names_the_line(string text, int line, string hint)
    {
        var e = Assert.Throws<TableFormatException>(() => TableCsvReader.Parse(text, "fw.csv"));
        Assert.Equal(line, e.Line);
        Assert.StartsWith(string.Create(CultureInfo.InvariantCulture, $"fw.csv({line}):"), e.Message);
        Assert.Contains(hint, e.Message);
    }

    [Fact]
    public void A_fixed_point_file_with_decimals_is_refused_with_the_line()
    {
        var e = Assert.Throws<TableFormatException>(() => TableCsvReader.Parse("100,2050\n101,20.4\n", "fw.csv", FixedPointScale.CentiKelvin));
        Assert.Equal(2, e.Line);
    }
}
