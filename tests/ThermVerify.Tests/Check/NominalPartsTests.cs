using System.Text.Json;
using ThermVerify.Api;
using ThermVerify.Check;
using ThermVerify.Reporting;
using ThermVerify.Reporting.Text;

namespace ThermVerify.Tests.Check;

/// <summary>
/// `check` verifies the unit with its parts at their nominal values; a tolerance of a nominal-valued part (a 5 %
/// fixed resistor) does not move its verdict, so its header, report and JSON must say which tolerances it left to
/// `worstcase` and `montecarlo` rather than let a PASS be read as covering them. Bounds without a nominal (the
/// converter's offset) are counted at their worse sign and are not listed.
/// </summary>
public class NominalPartsTests
{
    private static readonly CheckOptions Options = new() { ComputeRemedies = false };

    private static CheckResult Run(params (string Key, string? Value)[] changes) => FrontEndCheck.Run(TestDesign.Make(
        [("check.range", "\"0 degC .. 40 degC\""), ("check.step", "\"10 K\""), .. changes]), Options);

    [Fact]
    public void Header_report_and_json_name_the_tolerances_left_at_nominal()
    {
        var r = Run(("divider.fixed_tolerance", "\"5 %\""), ("sensor.beta_tolerance", "\"1 %\""), ("adc.offset_error", "\"2 LSB\""));
        const string line = "nominal  parts at their nominal values in this verdict; `thermverify worstcase` and `montecarlo` spread " +
                            "sensor.beta_tolerance ±1 %, divider.fixed_tolerance ±5 %";
        Assert.Contains(line + Environment.NewLine, CheckSummaryText.Render(r, RunStamp.Check(r.Design)));

        var report = new CheckReport(r, "test.toml", "", [], null, RunStamp.Check(r.Design));
        Assert.Contains("| nominal | parts at their nominal values", CheckMarkdown.Render(report));

        using var json = JsonDocument.Parse(CheckJson.Write(r, RunStamp.Check(r.Design)));
        var parts = json.RootElement.GetProperty("nominalParts").EnumerateArray()
            .Select(p => (p.GetProperty("key").GetString(), p.GetProperty("halfWidth").GetDouble())).ToList();
        Assert.Equal([("sensor.beta_tolerance", 0.01), ("divider.fixed_tolerance", 0.05)], parts);
    }

    [Fact]
    public void A_design_without_such_tolerances_has_no_line_and_the_tolerance_does_not_move_the_verdict()
    {
        var plain = Run();
        Assert.DoesNotContain("  nominal  ", CheckSummaryText.Render(plain, RunStamp.Check(plain.Design)));
        using var json = JsonDocument.Parse(CheckJson.Write(plain, RunStamp.Check(plain.Design)));
        Assert.Equal(0, json.RootElement.GetProperty("nominalParts").GetArrayLength());

        // The reason for the line: the nominal unit's error is the same whatever the fixed resistor's tolerance.
        var toleranced = Run(("divider.fixed_tolerance", "\"5 %\""));
        Assert.Equal(plain.Worst.ErrorKelvin, toleranced.Worst.ErrorKelvin);
    }
}
