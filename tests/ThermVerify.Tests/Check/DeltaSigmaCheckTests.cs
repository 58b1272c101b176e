using ThermVerify.Check;
using ThermVerify.Check.DeltaSigma;
using ThermVerify.Design;
using ThermVerify.Tests.Design;

namespace ThermVerify.Tests.Check;

/// <summary>The check of a delta-sigma design: its own findings, remedies proven by analysing the changed design again.</summary>
public class DeltaSigmaCheckTests
{
    private static string Example(string name) => Path.Combine(AppContext.BaseDirectory, "..", "..", "..", "..", "..", "netlists", name);

    [Fact]
    public void The_kiln_example_fails_on_its_first_reading_after_a_switch_and_says_how_many_to_discard()
    {
        var design = DesignLoader.Load(Example("kiln-bank-pt100-deltasigma.toml"));
        var result = FrontEndCheck.Run(design);
        Assert.False(result.Passed);
        var channel = Assert.Single(result.Findings, f => f.Id == DeltaSigmaFindings.ChannelSwitchId);
        Assert.Equal(Severity.Fail, channel.Severity);
        var discard = result.DeltaSigma!.ChannelSwitch.ReadingsToDiscard!.Value;
        Assert.InRange(discard, 1, 10);
        Assert.Contains($"readings_discarded = {discard}", channel.Cause);
        // The shared filter starts a conversion-length RC (1.16 kΩ · 4.7 µF = 5.4 ms) at the other channel's 1.95 V:
        // with a reset sinc3 the first reading comes after 3 conversions (60 ms) and is still far off.
        Assert.Equal(0.06, result.DeltaSigma.ChannelSwitch.Readings[0].Seconds, 9);
        Assert.True(result.DeltaSigma.ChannelSwitch.FirstUsedErrorVolts > 1e-3);
        var remedy = Assert.Single(channel.Remedies, r => r.Key == "adc.readings_discarded");
        Assert.True(remedy.Value >= discard);
        Assert.Contains("within ½ LSB", remedy.Proof);

        // The remedy applied: the check no longer has the finding (the proof, made again here on the whole check).
        var fixedDesign = design with { Adc = design.Adc with { DeltaSigma = design.Adc.DeltaSigma! with { ReadingsDiscarded = (int)remedy.Value!.Value } } };
        var again = FrontEndCheck.Run(fixedDesign, new CheckOptions { ComputeRemedies = false });
        Assert.DoesNotContain(again.Findings, f => f.Id == DeltaSigmaFindings.ChannelSwitchId);
        Assert.True(again.Passed, string.Join("; ", again.Findings.Where(f => f.Severity == Severity.Fail).Select(f => f.Id)));
    }

    [Fact]
    public void The_input_load_finding_gives_remedies_whose_check_clears_it()
    {
        var design = DesignLoader.Load(Example("kiln-bank-pt100-deltasigma.toml"));
        var result = FrontEndCheck.Run(design);
        var loading = Assert.Single(result.Findings, f => f.Id == DeltaSigmaFindings.InputLoadingId);
        Assert.NotEmpty(loading.Remedies);
        foreach (var remedy in loading.Remedies)
        {
            var changed = remedy.Key switch
            {
                "adc.input" => design with { Adc = design.Adc with { DeltaSigma = design.Adc.DeltaSigma! with { InputBuffered = true, SamplingCapacitanceFarads = 0 } } },
                "filter.reservoir_capacitor" => design with { Filter = design.Filter with { ReservoirCapacitorFarads = remedy.Value!.Value } },
                "filter.series_resistor" => design with { Filter = design.Filter with { SeriesResistorOhms = remedy.Value!.Value } },
                var key => throw new Xunit.Sdk.XunitException($"unexpected remedy {key}"),
            };
            var again = FrontEndCheck.Run(changed, new CheckOptions { ComputeRemedies = false });
            Assert.DoesNotContain(again.Findings, f => f.Id == DeltaSigmaFindings.InputLoadingId);
        }
    }

    [Fact]
    public void Interference_at_60_Hz_on_a_50_Hz_sinc3_is_a_finding_whose_remedy_is_the_data_rate_that_nulls_it()
    {
        // sinc3 at 50 Hz passes 60 Hz at |sin(1.2π)/(1.2π)|³ = 4.0e-3 (Hogenauer 1981, from memory): 10 mV at the sensor,
        // halved by the divider, moves a reading by about 20 µV, far beyond ½ LSB of a 24-bit converter.
        var design = DeltaSigmaDesigns.Make(("adc.rejection_frequencies", "[\"60 Hz\"]"), ("adc.interference", "\"10 mV\""));
        var result = FrontEndCheck.Run(design);
        var report = result.DeltaSigma!;
        var finding = Assert.Single(result.Findings, f => f.Id == DeltaSigmaFindings.InterferenceId);
        var row = Assert.Single(report.Rejection);
        var x = Math.PI * 60 / 256e3;
        var expected = 0.01 * row.AnalogGain * Math.Pow(Math.Abs(Math.Sin(5120 * x) / (5120 * Math.Sin(x))), 3);
        Tolerance.AssertClose(expected, finding.SizeVolts, 1e-6, 0, "interference in volts");
        // 10 Hz is the fastest whole decimation whose zeros (multiples of the data rate) include 60 Hz: 25, 16.7 and
        // 12.5 Hz do not null it and are not enough.
        var remedy = Assert.Single(finding.Remedies);
        Assert.Equal("adc.data_rate", remedy.Key);
        Assert.Equal(10, remedy.Value!.Value, 9);
        Assert.Contains("a check of the changed design has no interference finding", remedy.Proof);
    }
}

/// <summary>The check's JSON and text carry the delta-sigma analyses as the result holds them (docs/json-output.md).</summary>
public class DeltaSigmaOutputTests
{
    [Fact]
    public void The_json_deltaSigma_block_and_the_text_sections_show_the_results()
    {
        var result = ExampleVerdictTests.Checked("kiln-bank-pt100-deltasigma.toml");
        var r = result.DeltaSigma!;
        var root = System.Text.Json.JsonDocument.Parse(ThermVerify.Reporting.CheckJson.Write(result, TestRun.Provenance)).RootElement;
        var ds = root.GetProperty("deltaSigma");
        Assert.Equal(r.Decimation, ds.GetProperty("decimation").GetInt32());
        Assert.Equal(r.NoiseBandwidthHertz, ds.GetProperty("noiseBandwidthHertz").GetDouble());
        var channel = ds.GetProperty("channelSwitch");
        Assert.Equal(r.ChannelSwitch.ReadingsToDiscard, channel.GetProperty("readingsToDiscard").GetInt32());
        Assert.Equal("shared", channel.GetProperty("filter").GetString());
        Assert.Equal(r.ChannelSwitch.Readings.Count, channel.GetProperty("readings").GetArrayLength());
        Assert.Equal(r.InputLoading.Count, ds.GetProperty("inputLoading").GetArrayLength());
        Assert.Equal(r.InputLoading[0].ErrorVolts, ds.GetProperty("inputLoading")[0].GetProperty("errorVolts").GetDouble());
        Assert.Equal(2, ds.GetProperty("rejection").GetArrayLength());
        // A successive-approximation design has none.
        var sar = ExampleVerdictTests.Checked("mash-tun-pt100-current.toml");
        var sarRoot = System.Text.Json.JsonDocument.Parse(ThermVerify.Reporting.CheckJson.Write(sar, TestRun.Provenance)).RootElement;
        Assert.Equal(System.Text.Json.JsonValueKind.Null, sarRoot.GetProperty("deltaSigma").ValueKind);

        var text = ThermVerify.Reporting.Text.CheckSummaryText.Render(result, TestRun.Provenance);
        Assert.Contains("Readings after a channel switch", text);
        Assert.Contains($"Readings to discard: {r.ChannelSwitch.ReadingsToDiscard}", text);
        Assert.Contains("Delta-sigma input load", text);
        Assert.DoesNotContain("precharge", text.Split("Findings:")[0]);
    }
}
