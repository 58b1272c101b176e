using ThermVerify.Api;
using System.Text.Json;
using ThermVerify.Check;
using ThermVerify.Reporting;
using ThermVerify.Reporting.Text;

namespace ThermVerify.Tests.Check;

/// <summary>
/// A design that does not say what the sampling capacitor holds is checked for every case, and each temperature
/// reports the worst: a 100 kΩ NTC divider at 1 MSPS behind 4.7 nF passes if the capacitor keeps its last sample and
/// fails badly when it arrives at 0 V or full scale (the average current of a switched capacitor, R_eq = 1/(f_s·C_sh),
/// Johns &amp; Martin, drags the reservoir towards it).
/// </summary>
public class PrechargeWorstTests
{
    private static readonly CheckOptions Options = new() { ComputeRemedies = false };

    private static CheckResult Run(string? precharge) => FrontEndCheck.Run(TestDesign.Make(
        ("sensor.r25", "\"100 kohm\""), ("sensor.beta", "4190"), ("divider.fixed_resistor", "\"100 kohm\""),
        ("filter.reservoir_capacitor", "\"4.7 nF\""), ("adc.sample_rate", "\"1 MHz\""), ("adc.acquisition_time", "\"250 ns\""),
        ("adc.sampling_capacitance", "\"8 pF\""), ("adc.precharge", precharge), ("check.range", "\"0 degC .. 40 degC\""), ("check.step", "\"10 K\"")), Options);

    [Fact]
    public void The_default_is_the_worst_case_at_each_temperature()
    {
        var last = Run("\"last-sample\"");
        var discharged = Run("\"discharged\"");
        var other = Run("\"other-channel\"");
        var worst = Run(null);
        Assert.True(last.Passed);
        Assert.False(discharged.Passed);
        Assert.False(worst.Passed);
        Assert.Equal(["last-sample", "0 V", "full scale"], worst.PrechargeCases.Select(c => c.Name));
        for (var i = 0; i < worst.Points.Count; i++)
        {
            // Every case simulated alike, so the worst run's error at a temperature is the largest of the single cases'.
            var candidates = new[] { last.Points[i], discharged.Points[i], other.Points[i] };
            var largest = candidates.Max(p => Math.Abs(p.ErrorKelvin));
            Assert.Equal(largest, Math.Abs(worst.Points[i].ErrorKelvin));
            var levels = candidates.Where(p => Math.Abs(p.ErrorKelvin) == largest).Select(p => p.PrechargeVolts);
            Assert.Contains(worst.Points[i].PrechargeVolts, levels);
        }
    }

    [Fact]
    public void Header_json_and_table_state_the_case_used_and_which_was_worst()
    {
        var worst = Run(null);
        var text = CheckSummaryText.Render(worst, RunStamp.Check(worst.Design));
        Assert.Contains("precharge worst: every case is checked (last-sample, 0 V, full scale 3.3 V)", text);
        Assert.Contains($"{worst.Worst.Precharge.Name}, {worst.Worst.SampleKind}", text);

        using var json = JsonDocument.Parse(CheckJson.Write(worst, RunStamp.Check(worst.Design)));
        var root = json.RootElement;
        Assert.Equal("worst", root.GetProperty("precharge").GetProperty("mode").GetString());
        Assert.Equal(3, root.GetProperty("precharge").GetProperty("cases").GetArrayLength());
        var points = root.GetProperty("points").EnumerateArray().ToList();
        for (var i = 0; i < points.Count; i++)
            Assert.Equal(worst.Points[i].Precharge.Name, points[i].GetProperty("precharge").GetString());

        // The report's settings say the same, and its points table names each temperature's reading.
        var report = new CheckReport(worst, "test.toml", "", [], null, RunStamp.Check(worst.Design));
        Assert.Contains("| precharge | worst: every case is checked (last-sample, 0 V, full scale 3.3 V)", CheckMarkdown.Render(report));
        Assert.Contains("worst: every case is checked (last-sample, 0 V, full scale 3.3 V)", System.Net.WebUtility.HtmlDecode(CheckHtml.Render(report)));

        var single = Run("\"last-sample\"");
        Assert.Contains("precharge last-sample (last-sample: holding this channel's last sample)", CheckSummaryText.Render(single, RunStamp.Check(single.Design)));
    }
}
