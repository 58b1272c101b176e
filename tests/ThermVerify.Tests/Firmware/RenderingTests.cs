using ThermVerify.Firmware;

namespace ThermVerify.Tests.Firmware;

public class RenderingTests
{
    private static readonly FirmwareModel Model = FirmwareTestModels.NtcLowSide();

    private static string Header(FirmwareTable table, string prefix = "fw_ntc", string name = "Bench rig") =>
        CHeaderRenderer.Render(new FirmwareHeaderContent(name, prefix, Model, table, TableErrorAnalysis.Evaluate(Model, table),
            FaultAnalysis.Thresholds(Model, FaultTolerances.None)), TestRun.Provenance);

    [Fact]
    public void Csv_reads_back_to_the_values_the_routine_returns()
    {
        var table = TableBuilder.WithinBound(Model, FixedPointScale.CentiKelvin, 0.1);
        var rows = TableCsvReader.Parse(TableCsvRenderer.Render(table), "t.csv");
        Assert.Equal(table.Span.Count, rows.Count);
        foreach (var row in rows)
            Assert.Equal(table.Evaluate(row.Code), FixedPointScale.CentiKelvin.ToFixed(row.Celsius));
    }

    [Fact]
    public void Header_states_unit_span_and_thresholds_as_macros()
    {
        var table = TableBuilder.EveryCode(Model, FixedPointScale.CentiKelvin);
        var faults = FaultAnalysis.Thresholds(Model, FaultTolerances.None);
        var header = Header(table);
        Assert.Contains("#define FW_NTC_UNITS_PER_KELVIN 100\n", header);
        Assert.Contains($"#define FW_NTC_FIRST_CODE {table.Span.FirstCode}\n", header);
        Assert.Contains($"#define FW_NTC_LAST_CODE {table.Span.LastCode}\n", header);
        Assert.Contains($"#define FW_NTC_FAULT_BELOW_CODE {faults.FaultBelowCode}\n", header);
        Assert.Contains($"#define FW_NTC_FAULT_ABOVE_CODE {faults.FaultAboveCode}\n", header);
        Assert.Contains("static const int16_t fw_ntc_table_values", header);
        Assert.DoesNotContain("fw_ntc_table_codes", header);
        Assert.True(header.All(c => c is '\n' or (>= ' ' and <= '~')), "the header is plain ASCII");
    }

    [Fact]
    public void Values_beyond_int16_use_int32()
    {
        // 1000 units per kelvin puts 125 °C at 125000, beyond int16_t's 32767.
        var table = TableBuilder.WithinBound(Model, new FixedPointScale(1000), 0.05);
        Assert.Contains("static const int32_t fw_ntc_table_values", Header(table));
    }

    [Theory]
    [InlineData("Fw")]
    [InlineData("9lives")]
    [InlineData("has-dash")]
    public void A_prefix_that_is_not_a_C_identifier_is_refused(string prefix)
    {
        var table = TableBuilder.WithinBound(Model, FixedPointScale.CentiKelvin, 0.1);
        Assert.Throws<FirmwareInputException>(() => Header(table, prefix));
    }

    [Fact]
    public void A_name_that_would_end_the_comment_is_refused()
    {
        var table = TableBuilder.WithinBound(Model, FixedPointScale.CentiKelvin, 0.1);
        Assert.Throws<FirmwareInputException>(() => Header(table, name: "rig */ int x;"));
    }
}
