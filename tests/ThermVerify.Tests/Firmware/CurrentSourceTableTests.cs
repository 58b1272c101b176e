using ThermVerify.Api;
using ThermVerify.Design;
using ThermVerify.Firmware;
using ThermVerify.Tests.FrontEnd;

namespace ThermVerify.Tests.Firmware;

/// <summary>
/// The firmware table of a current-excited sensor: a code stands for V = code·Q (bin middle, IEEE Std 1241), the
/// sensor for R_s = V/I, or with a ratiometric reference resistor R_s = R_ref·code/2^N (the current cancels); the
/// temperature is IEC 60751's inverse, for t ≥ 0 the root of the quadratic R0·(1 + A·t + B·t²) = R_s, by hand.
/// </summary>
public class CurrentSourceTableTests
{
    private static FrontEndDesign Example(string name) => DesignLoader.Load(Path.Combine(Repository.Netlists, name));

    [Fact]
    public void Every_code_of_the_ratiometric_mash_tun_reads_R_ref_times_code_over_2_to_the_N()
    {
        var run = Verifier.Table(Example("mash-tun-pt100-current.toml"));
        var scale = run.Table.Scale;
        Assert.Equal(run.Table.Span.Count, run.Table.Codes.Count);
        for (var k = 0; k < run.Table.Codes.Count; k++)
        {
            var code = run.Table.Codes[k];
            var expected = Iec60751ByHand.Celsius(3900.0 * code / 65536);
            // The table's unit is 0.01 K: each entry is the true temperature rounded to it.
            Tolerance.AssertClose(expected, scale.ToCelsius(run.Table.Values[k]), 0, 0.5 * scale.UnitKelvin + 1e-9, $"code {code}");
        }
        // 0 °C reads 2^16·100/3900 = 1680.4, the first whole code inside the range.
        Assert.Equal(1681, run.Table.Span.FirstCode);
    }

    [Fact]
    public void A_fixed_reference_reads_V_over_I()
    {
        var run = Verifier.Table(CurrentDesigns.Pt100(("check.range", "\"0 degC .. 200 degC\"")));
        foreach (var (code, value) in run.Table.Codes.Zip(run.Table.Values).Where((_, i) => i % 97 == 0))
            Tolerance.AssertClose(Iec60751ByHand.Celsius(code * 2.5 / 65536 / 1e-3), run.Table.Scale.ToCelsius(value), 0,
                0.5 * run.Table.Scale.UnitKelvin + 1e-9, $"code {code}");
    }

    [Fact]
    public void The_fault_thresholds_of_a_current_source_by_Ohms_law()
    {
        // An open sensor lets the source run to its compliance (the top code), a shorted one reads 0; with the reference
        // resistor's 0.05 % the healthy codes span 2^16·R_s/(R_ref·(1 ± 0.0005)) at 0 °C and 120 °C.
        var run = Verifier.Table(Example("mash-tun-pt100-current.toml"));
        var f = run.Faults;
        Assert.Equal(65535, f.For(FaultKind.SensorOpen).MinCode);
        Assert.Equal(0, f.For(FaultKind.SensorShorted).MaxCode);
        Assert.Equal((int)Math.Round(65536 * CurrentDesigns.Ohms(0) / (3900 * 1.0005)), f.LowestValidCode);
        Assert.Equal((int)Math.Round(65536 * CurrentDesigns.Ohms(120) / (3900 * 0.9995)), f.HighestValidCode);
        Assert.True(f.IsFault(0) && f.IsFault(65535) && !f.IsFault(2000));
    }

    [Fact]
    public void The_loading_correction_is_refused_for_a_current_source_with_the_fix()
    {
        var e = Assert.Throws<FirmwareInputException>(() => Verifier.Table(Example("mash-tun-pt100-current.toml"), new TableRequest { CorrectForLoading = true }));
        Assert.Contains("current source", e.Message);
        Assert.Contains("--corrected", e.Message);
    }

    [Fact]
    public void Verify_table_passes_the_current_source_table_and_catches_one_made_for_another_reference_resistor()
    {
        var design = Example("mash-tun-pt100-current.toml");
        var csv = TableCsvRenderer.Render(Verifier.Table(design).Table);
        Assert.True(Verifier.VerifyTable(design, csv, "table.csv").Passes);
        // The same table made for a 3.6 kΩ reference resistor reads every code 8 % low in R_s: about 20 K at 100 °C.
        var other = design with { CurrentSource = design.CurrentSource! with { ReferenceResistorOhms = 3600 } };
        var wrong = TableCsvRenderer.Render(Verifier.Table(other).Table);
        Assert.False(Verifier.VerifyTable(design, wrong, "wrong.csv").Passes);
    }
}
