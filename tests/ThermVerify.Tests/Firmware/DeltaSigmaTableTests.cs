using ThermVerify.Api;
using ThermVerify.Check;
using ThermVerify.Design;
using ThermVerify.Firmware;

namespace ThermVerify.Tests.Firmware;

/// <summary>
/// The firmware table of a design read by a delta-sigma converter: its code is the static transfer, code = 2^N·G·V/V_ref
/// at the pin with the programmable gain G (unipolar, bin middle, IEEE Std 1241); with a ratiometric reference resistor
/// carrying the sensor's current R_s = R_ref·code/(G·2^N), and the temperature IEC 60751's inverse, for t ≥ 0 the root
/// of the quadratic R0·(1 + A·t + B·t²) = R_s (Callendar–Van Dusen, A = 3.9083e-3, B = −5.775e-7), by hand.
/// </summary>
public class DeltaSigmaTableTests
{
    private static FrontEndDesign Example(string name) => DesignLoader.Load(Path.Combine(Repository.Netlists, name));

    [Theory]
    // The kiln: R_ref = 3.9 kΩ, gain 1; 0 °C (100 Ω) is code 2^24·100/3900 = 430185.03, which reads just below 0 °C, so 430186.
    [InlineData("kiln-bank-pt100-deltasigma.toml", 3900.0, 1.0, 430186)]
    // The stability chamber: R_ref = 1.62 kΩ, gain 8; 0 °C is code 2^24·8·100/1620 = 8285044.94, so 8285045.
    [InlineData("stability-chamber-pt100-pga.toml", 1620.0, 8.0, 8285045)]
    public void Every_breakpoint_and_every_code_between_reads_the_IEC_60751_inverse_of_R_ref_times_code_over_G_2_to_the_24(string file, double rRef, double gain, int first)
    {
        const double bound = 0.01;
        var run = Verifier.Table(Example(file), new TableRequest { BoundKelvin = bound });
        var scale = run.Table.Scale;
        double Expected(int code) => Iec60751ByHand.Celsius(rRef * code / (gain * (1 << 24)));
        Assert.Equal(first, run.Table.Span.FirstCode);
        Assert.True(run.Table.Codes.Count is > 2 and < 100, $"{run.Table.Codes.Count} breakpoints");
        for (var k = 0; k < run.Table.Codes.Count; k++)
            // The table's unit is 0.01 K: each breakpoint is the true temperature rounded to it.
            Tolerance.AssertClose(Expected(run.Table.Codes[k]), scale.ToCelsius(run.Table.Values[k]), 0, 0.5 * scale.UnitKelvin + 1e-9, $"{file}: breakpoint {run.Table.Codes[k]}");
        // Between the breakpoints the interpolation stays within the bound plus the rounding of the two ends.
        for (var code = run.Table.Span.FirstCode; code <= run.Table.Span.LastCode; code += 997)
            Tolerance.AssertClose(Expected(code), run.Table.EvaluateCelsius(code), 0, bound + scale.UnitKelvin, $"{file}: code {code}");
    }

    [Fact]
    public void An_open_or_shorted_Pt100_on_the_kiln_reads_beyond_the_thresholds_and_the_check_carries_the_same_ones()
    {
        var design = Example("kiln-bank-pt100-deltasigma.toml");
        var run = Verifier.Table(design, new TableRequest { BoundKelvin = 0.01 });
        var f = run.Faults;
        // Shorted: the node at 0 V, code 0. Open: the current source runs into its 3 V compliance, far above the 1.95 V
        // reference, so the top code 2^24 − 1 (the converter clips; Ohm's law).
        Assert.Equal(0, f.For(FaultKind.SensorShorted).MaxCode);
        Assert.Equal((1 << 24) - 1, f.For(FaultKind.SensorOpen).MinCode);
        Assert.True(f.IsFault(0) && f.IsFault((1 << 24) - 1));
        Assert.False(f.IsFault(run.Table.Span.FirstCode) || f.IsFault(run.Table.Span.LastCode));
        var check = FrontEndCheck.Run(design, new CheckOptions { ComputeRemedies = false });
        Assert.Equal(f.FaultBelowCode, check.Faults!.FaultBelowCode);
        Assert.Equal(f.FaultAboveCode, check.Faults.FaultAboveCode);
    }

    [Fact]
    public void The_corrected_kiln_table_takes_the_unbuffered_inputs_average_load()
    {
        // The correction is the pin against the ideal node I·R: the 20 MΩ output resistance, across R_ref + R, takes
        // I·(R_ref + R)/(R_out + R_ref + R) of the current, and the input's average load, the switched-capacitor resistor
        // R_eq = 1/(f_mod·C) = 1/(64 kHz · 2 pF) = 7.8125 MΩ (Johns & Martin, from memory), divides the node's Thévenin
        // voltage by R_eq/(R_th + R_eq), R_th = R ∥ (R_ref + R_out) + 1 kΩ (elementary).
        var design = Example("kiln-bank-pt100-deltasigma.toml");
        var corrected = FirmwareFromDesign.Model(design, correctForLoading: true);
        var plain = FirmwareFromDesign.Model(design, correctForLoading: false);
        const double rOut = 20e6, rRef = 3900, req = 1 / (64e3 * 2e-12);
        foreach (var celsius in new[] { 0.0, 75, 150 })
        {
            var r = plain.Sensor.ResistanceOhms(celsius);
            var node = 500e-6 * r * rOut / (rOut + rRef + r);
            var rth = r * (rRef + rOut) / (r + rRef + rOut) + 1e3;
            var expected = node * req / (rth + req) - 500e-6 * r;
            // At the sweep's own temperatures the interpolation is exact: to rounding.
            Tolerance.AssertClose(expected, corrected.NodeVolts(celsius) - plain.NodeVolts(celsius), 1e-9, 1e-15, $"offset at {celsius} °C");
            Assert.True(Math.Abs(expected) > 50 * plain.Adc.LsbVolts, "the load is tens of LSB");
        }
    }

    [Fact]
    public void Verify_table_passes_the_kilns_table_and_catches_one_made_for_the_wrong_gain()
    {
        var design = Example("kiln-bank-pt100-deltasigma.toml");
        var csv = TableCsvRenderer.Render(Verifier.Table(design, new TableRequest { BoundKelvin = 0.01 }).Table, breakpointsOnly: true);
        Assert.True(Verifier.VerifyTable(design, csv, "table.csv").Passes);
        // A table made for a gain of 2 takes every code for half the resistance the design means (R_ref·code/(2·2^24)): hundreds of K off.
        var doubled = design with { Adc = design.Adc with { DeltaSigma = design.Adc.DeltaSigma! with { Gain = 2 }, GainStage = new GainStageSpec(2) } };
        var wrong = TableCsvRenderer.Render(Verifier.Table(doubled, new TableRequest { BoundKelvin = 0.01 }).Table, breakpointsOnly: true);
        Assert.False(Verifier.VerifyTable(design, wrong, "wrong.csv").Passes);
    }
}
