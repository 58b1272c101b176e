using ThermVerify.Check;
using ThermVerify.Design;
using ThermVerify.FrontEnd;
using ThermVerify.Ngspice;
using ThermVerify.Sensors;
using ThermVerify.Tests.Ngspice;
using ThermVerify.Tolerances;

namespace ThermVerify.Tests.FrontEnd;

/// <summary>
/// An instrumentation amplifier between a bridge and the converter. The outside reference is the amplifier's output
/// by the definition of its terms (instrumentation-amplifier chapters of analog-design texts, from memory):
/// V_out = G_d·V_d + G_cm·V_cm with V_d = V+ − V−, V_cm = (V+ + V−)/2 and CMRR = G_d/G_cm, the offset referred to the
/// input (V_d + V_os), and the bias currents dropping across each output's Thevenin resistance (Ohm's law); the
/// bridge's outputs by the divider formula, written out here by hand.
/// </summary>
public class AmplifierTests
{
    private static readonly CheckOptions Options = new() { ComputeRemedies = false, MaximumSamplingPoints = 3 };

    /// <summary>The Pt1000 bridge of <see cref="BridgeDesigns"/> (1 kΩ arms, 2.5 V, balanced at 0 °C) behind a gain of 8 (2.23 V at 150 °C, inside the 2.5 V scale).</summary>
    private static FrontEndDesign Amplified(params (string, string?)[] more) =>
        BridgeDesigns.Pt1000([("amplifier.gain", "8"), ("check.range", "\"5 degC .. 150 degC\""), .. more]);

    [Fact]
    public void Keys_are_read_written_back_and_refused_with_their_position()
    {
        var design = Amplified(("amplifier.gain_error", "\"-0.1 %\""), ("amplifier.offset_voltage", "\"25 uV\""), ("amplifier.cmrr", "\"80 dB\""),
            ("amplifier.offset_drift", "\"0.2 uV/K\""), ("amplifier.bias_current", "\"+2 nA\""), ("amplifier.output_range", "\"0.05 V .. 4.9 V\""),
            ("amplifier.input_common_mode", "\"0.5 V .. 4 V\""));
        var a = design.Amplifier!;
        Assert.Equal(8, a.Gain);
        Assert.Equal(-1e-3, a.GainError, 15);
        Assert.True(a.GainErrorSigned);
        Assert.False(a.OffsetSigned);
        Assert.Equal(1e-4, a.CommonModeFraction, 15);
        Assert.Equal(new VoltageRange(0.05, 4.9), a.OutputRange);
        var again = DesignLoader.Parse(DesignWriter.ToToml(design), "normal.toml", Path.GetTempPath()).Amplifier!;
        Assert.Equal(a with { CommonModeFraction = 0 }, again with { CommonModeFraction = 0 });
        Assert.Equal(a.CommonModeFraction, again.CommonModeFraction, 15);

        void Refused(string key, string text, Func<FrontEndDesign> make)
        {
            var e = Assert.Throws<DesignException>(make);
            Assert.Equal(key, e.KeyPath);
            Assert.True(e.Line > 1, $"{key}: a line of the file ({e.Line})");
            Assert.Contains(text, e.Message);
        }
        Refused("amplifier.gain", "missing", () => BridgeDesigns.Pt1000(("amplifier.cmrr", "\"80 dB\"")));
        Refused("amplifier.gain_error", "100 % or more", () => Amplified(("amplifier.gain_error", "\"100 %\"")));
        Refused("amplifier.output_range", "", () => Amplified(("amplifier.output_range", "\"3 V .. 1 V\"")));
        Refused("amplifier.cmrr", "", () => Amplified(("amplifier.cmrr", "\"80 V\"")));
        Refused("amplifier.gian", "Did you mean \"gain\"?", () => Amplified(("amplifier.gian", "2")));
        Refused("amplifier", "this design has no bridge", () => Check.TestDesign.Make(("amplifier.gain", "10")));
        Refused("adc.input", "behind an amplifier the converter reads its single output", () => Amplified(("adc.input", "\"differential\"")));
    }

    [Fact]
    public void The_simulated_output_is_the_amplifiers_defining_equation()
    {
        // Gain 8 with −0.2 % gain error, 50 µV offset drifting 1 µV/K with the sweep (no board temperature), 60 dB
        // CMRR and 5 nA bias currents: every term large enough to see, the output at every temperature of the sweep.
        var design = Amplified(("amplifier.gain_error", "\"-0.2 %\""), ("amplifier.offset_voltage", "\"+50 uV\""), ("amplifier.offset_drift", "\"+1 uV/K\""),
            ("amplifier.cmrr", "\"60 dB\""), ("amplifier.bias_current", "\"+5 nA\""));
        var temperatures = SensorTabulation.Grid(design.Check.Range, design.Check.StepKelvin).ToArray();
        var output = ((ICheckEngine)BuiltInEngine.Instance).TemperatureSweep(FrontEndCircuit.Dc(design, null), temperatures, [FrontEndNodes.AmplifierOutput])[0];
        for (var i = 0; i < temperatures.Length; i++)
        {
            var t = temperatures[i];
            var rs = CurrentDesigns.Ohms(t, 1000);
            // Each output less the bias current through its Thevenin resistance.
            var positive = 2.5 * rs / (rs + 1000) - 5e-9 * rs * 1000 / (rs + 1000);
            var negative = 1.25 - 5e-9 * 500;
            var expected = 8 * (1 - 0.002) * (positive - negative + 50e-6 + 1e-6 * (t - 25)) + 8 * 1e-3 * (positive + negative) / 2;
            Tolerance.AssertClose(expected, output[i], 1e-9, 1e-12, $"V_out at {t} °C");
        }
    }

    [Fact]
    public void The_checks_amplifier_finding_has_its_closed_form_beside_the_simulated_value()
    {
        var result = FrontEndCheck.Run(Amplified(("amplifier.offset_voltage", "\"100 uV\""), ("amplifier.cmrr", "\"70 dB\""), ("amplifier.bias_current", "\"2 nA\""),
            ("check.board_temperature", "\"50 degC\"")), Options);
        var finding = Assert.Single(result.Findings, f => f.Id == "amplifier-static");
        Tolerance.AssertClose(finding.SimulatedVolts!.Value, finding.EstimateVolts!.Value, 1e-6, 1e-9, "closed form beside the simulated value");
        Assert.Contains("CMRR of 70 dB", finding.Cause);
        // The ideal reading is G·V_d: the closed form the check compares against, the quarter bridge times 8.
        foreach (var p in result.Points)
        {
            var x = CurrentDesigns.Ohms(p.Celsius, 1000) / 1000 - 1;
            Tolerance.AssertClose(8 * 2.5 * x / (4 + 2 * x), p.IdealVolts, 1e-12, 1e-15, $"G·V_d at {p.Celsius} °C");
        }
    }

    [Fact]
    public void Leaving_the_output_or_the_input_common_mode_range_fails_with_the_closed_form()
    {
        // The output reaches 8·2.5·x/(4 + 2x) = 2.23 V at 150 °C and 1 V where x/(4 + 2x) = 0.05, x = 0.222 (about 57 °C):
        // a range up to 1 V is left from the next point of the 25 K grid up, 80 °C (55 °C reads 0.965 V).
        var output = FrontEndCheck.Run(Amplified(("amplifier.output_range", "\"0 V .. 1 V\"")), Options);
        var o = Assert.Single(output.Findings, f => f.Id == AmplifierRangeRule.OutputId);
        Assert.Equal(Severity.Fail, o.Severity);
        Assert.Equal(150, o.WorstCelsius);
        var x = CurrentDesigns.Ohms(150, 1000) / 1000 - 1;
        Tolerance.AssertClose(8 * 2.5 * x / (4 + 2 * x), o.EstimateVolts!.Value, 1e-12, 0, "closed form G·V_d");
        Tolerance.AssertClose(o.EstimateVolts.Value, o.SimulatedVolts!.Value, 1e-9, 1e-12, "simulated beside it");
        Assert.Equal(80, o.FromCelsius);
        // The inputs sit at (V+ + 1.25 V)/2, about 1.27 V .. 1.4 V: a range from 1.5 V is left at every temperature.
        var input = FrontEndCheck.Run(Amplified(("amplifier.input_common_mode", "\"1.5 V .. 3 V\"")), Options);
        var c = Assert.Single(input.Findings, f => f.Id == AmplifierRangeRule.CommonModeId);
        Assert.Equal((5.0, 150.0), (c.FromCelsius, c.ToCelsius));
        var rs = CurrentDesigns.Ohms(5, 1000);
        Tolerance.AssertClose((2.5 * rs / (rs + 1000) + 1.25) / 2, c.EstimateVolts!.Value, 1e-12, 0, "closed form (V+ + V−)/2 at 5 °C");
        Assert.False(input.Passed);
    }

    [Fact]
    public void A_cmrr_remedy_asks_for_more_rejection_and_passes_when_applied()
    {
        // 60 dB at a gain of 8: G·V_cm/CMRR = 8·1.3 V·10⁻³ ≈ 10 mV, about half a kelvin on G·dV_d/dT ≈ 19 mV/K.
        var design = Amplified(("amplifier.cmrr", "\"60 dB\""), ("adc.noise", "\"0 LSB\""));
        var result = FrontEndCheck.Run(design, new CheckOptions { MaximumSamplingPoints = 3 });
        var finding = Assert.Single(result.Findings, f => f.Id == "amplifier-static");
        var remedy = Assert.Single(finding.Remedies, r => r.Key == "amplifier.cmrr");
        Assert.InRange(remedy.Value!.Value, 60, 160);
        var applied = FrontEndCheck.Run(design with { Amplifier = design.Amplifier! with { CommonModeFraction = Math.Pow(10, -remedy.Value.Value / 20) } }, Options);
        Assert.DoesNotContain(applied.Findings, f => f.Id == "amplifier-static");
    }

    [Fact]
    public void The_worst_case_spreads_the_amplifiers_bounds()
    {
        // ±100 µV of offset: dT = G·V_os/(G·dV_d/dT) at every point, V_os over the bridge's slope E·R_f/(R_s + R_f)²·dR_s/dT.
        var result = WorstCase.Run(Amplified(("amplifier.offset_voltage", "\"100 uV\""), ("amplifier.cmrr", "\"80 dB\"")), new WorstCaseOptions { Threads = 1 });
        var offset = Assert.Single(result.Sensitivities, s => s.Parameter.Kind == ToleranceKind.AmplifierOffset);
        Assert.Single(result.Sensitivities, s => s.Parameter.Kind == ToleranceKind.AmplifierCommonMode);
        for (var k = 0; k < result.Points.Count; k++)
        {
            var t = result.Points[k].Celsius;
            var rs = CurrentDesigns.Ohms(t, 1000);
            var slope = 2.5 * 1000 / ((rs + 1000) * (rs + 1000)) * CurrentDesigns.OhmsPerKelvin(t, 1000);
            Tolerance.AssertClose(1 / slope, offset.KelvinPerUnit[k], 2e-3, 1e-6, $"dT/dV_os at {t} °C");
        }
    }

    /// <summary>ngspice, the trade's reference engine, on the amplifier's controlled sources: every node within 1 µV.</summary>
    [NgspiceFact]
    public void Sweep_agrees_with_ngspice_within_a_microvolt()
    {
        var design = Amplified(("amplifier.gain_error", "\"+0.3 %\""), ("amplifier.offset_voltage", "\"-40 uV\""), ("amplifier.offset_drift", "\"+0.5 uV/K\""),
            ("amplifier.cmrr", "\"66 dB\""), ("amplifier.bias_current", "\"+3 nA\""), ("bridge.opposite_low_tempco", "\"30 ppm/K\""),
            ("filter.series_resistor", "\"1 kohm\""), ("filter.reservoir_capacitor", "\"100 nF\""), ("adc.pin_leakage", "\"2 nA\""), ("check.step", "\"5 K\""));
        string[] nodes = [FrontEndNodes.Divider, FrontEndNodes.BridgeNegative, FrontEndNodes.AmplifierOutput, FrontEndNodes.Pin];
        var worst = SweepCrossCheck.AssertAgrees(design, nodes);
        Console.WriteLine($"amplifier sweep: largest difference from ngspice {worst:G3} V");
    }
}
