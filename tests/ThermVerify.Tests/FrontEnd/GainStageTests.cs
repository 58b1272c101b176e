using ThermVerify.Check;
using ThermVerify.Design;
using ThermVerify.Ngspice;
using ThermVerify.Tests.Check;
using ThermVerify.Tests.Design;
using ThermVerify.Tests.Ngspice;
using ThermVerify.Tolerances;

namespace ThermVerify.Tests.FrontEnd;

/// <summary>
/// A programmable-gain stage ahead of the converter: the converter sees G·(1 + e)·V_pin, so the code is
/// 2^N·G·V/V_ref (IEEE Std 1241's ideal converter with the amplifier's gain as a scale; textbook) and the pin carries
/// only the amplifier's input current. The sensor's resistance comes from IEC 60751 by hand (CurrentDesigns.Ohms).
/// </summary>
public class GainStageTests
{
    private static readonly CheckOptions Options = new() { ComputeRemedies = false, MaximumSamplingPoints = 3 };

    /// <summary>A Pt100 at 1 mA into a 16-bit converter with a fixed 2.5 V reference, behind a gain of 8 (0.176 V at 200 °C, 1.41 V amplified).</summary>
    private static FrontEndDesign Amplified(params (string Path, string? Value)[] more) => CurrentDesigns.Pt100([("adc.gain", "8"), .. more]);

    [Fact]
    public void The_code_is_the_amplified_pin_voltage_over_the_converter_LSB()
    {
        var result = FrontEndCheck.Run(Amplified(), Options);
        // The converter's LSB referred to the pin is V_ref/(G·2^N).
        Tolerance.AssertClose(2.5 / 8 / 65536, result.Adc.LsbVolts, 1e-12, what: "LSB at the pin");
        foreach (var p in result.Points)
        {
            var amplified = 8 * 1e-3 * CurrentDesigns.Ohms(p.Celsius);
            Assert.Equal((int)Math.Round(amplified / 2.5 * 65536), p.Code);
        }
        Assert.DoesNotContain(result.Findings, f => f.Id == GainRangeRule.Id);
        // Eight times the resolution of the same converter without the amplifier (the Pt100's 0.385 Ω/K at 1 mA).
        var bare = FrontEndCheck.Run(CurrentDesigns.Pt100(), Options);
        Tolerance.AssertClose(bare.Points[2].KelvinPerLsb / 8, result.Points[2].KelvinPerLsb, 1e-9, what: "LSB in K");
    }

    [Fact]
    public void The_amplifier_drives_the_sampling_capacitor_so_the_pin_no_longer_feels_the_acquisition()
    {
        // A 100 kΩ series resistor and no reservoir: 10 pF charged for 2 µs through it does not settle (τ = 1 µs), a
        // settling finding. With a gain stage (gain 1 here) the capacitor is charged from the amplifier's output.
        var slow = new[] { ("filter.series_resistor", (string?)"\"100 kohm\"") };
        var bare = FrontEndCheck.Run(CurrentDesigns.Pt100([.. slow, ("adc.precharge", "\"discharged\"")]), Options);
        Assert.Contains(bare.Findings, f => f.Id == "settling");
        var amplified = FrontEndCheck.Run(CurrentDesigns.Pt100([.. slow, ("adc.precharge", "\"discharged\""), ("adc.gain", "1")]), Options);
        Assert.DoesNotContain(amplified.Findings, f => f.Id == "settling");
        Assert.All(amplified.Points, p => Assert.True(Math.Abs(p.Simulated.SettlingVolts) < 0.01 * amplified.Adc.LsbVolts));
    }

    [Fact]
    public void The_input_current_drops_across_the_source_resistance_by_Ohms_law()
    {
        // +50 nA into the amplifier through a 10 kΩ series resistor (plus the Pt100): ΔV = −I·(R_series + R_s).
        var result = FrontEndCheck.Run(Amplified(("filter.series_resistor", "\"10 kohm\""), ("adc.pga_input_current", "\"+50 nA\"")), Options);
        foreach (var p in result.Points)
        {
            var expected = -50e-9 * (10e3 + CurrentDesigns.Ohms(p.Celsius));
            Tolerance.AssertClose(expected, p.Simulated.DcLoadingVolts, 1e-6, 1e-12, $"loading at {p.Celsius} °C");
            Tolerance.AssertClose(expected, p.Estimates.LoadingVolts, 1e-6, 1e-12, $"estimate at {p.Celsius} °C");
        }
        var finding = Assert.Single(result.Findings, f => f.Id == "dc-loading");
        Assert.Contains("the gain stage's input current +50 nA", finding.Cause);
    }

    [Fact]
    public void An_input_current_bound_is_taken_at_the_worse_sign()
    {
        var result = FrontEndCheck.Run(Amplified(("filter.series_resistor", "\"10 kohm\""), ("adc.pga_input_current", "\"50 nA\"")), Options);
        foreach (var p in result.Points)
            Tolerance.AssertClose(50e-9 * (10e3 + CurrentDesigns.Ohms(p.Celsius)), Math.Abs(p.Simulated.DcLoadingVolts), 1e-5, 1e-12);
    }

    [Fact]
    public void A_gain_that_pushes_the_signal_past_the_reference_fails_with_the_closed_form_beside_it()
    {
        // Gain 16: 16·1 mA·R_s passes 2.5 V where R_s > 156.25 Ω, above about 146 °C (IEC 60751).
        var result = FrontEndCheck.Run(CurrentDesigns.Pt100(("adc.gain", "16"), ("check.step", "\"10 K\"")), Options);
        var finding = Assert.Single(result.Findings, f => f.Id == GainRangeRule.Id);
        Assert.Equal(Severity.Fail, finding.Severity);
        Assert.Equal(150, finding.FromCelsius, 9);
        Assert.Equal(200, finding.WorstCelsius, 9);
        var closedForm = 16 * 1e-3 * CurrentDesigns.Ohms(200);
        Tolerance.AssertClose(closedForm, finding.EstimateVolts!.Value, 1e-12, what: "closed form");
        Tolerance.AssertClose(closedForm, finding.SimulatedVolts!.Value, 1e-9, what: "simulated");
        Tolerance.AssertClose(closedForm - 2.5, finding.SizeVolts, 1e-8, what: "beyond the reference");
        Assert.False(result.Passed);
    }

    [Fact]
    public void A_gain_error_bound_counts_in_the_check_at_the_worse_sign()
    {
        // 0.5 % gain error: the code moves by e·code, so the reading by e·R/(dR/dT) (IEC 60751 by hand): 1.76 K at 100 °C.
        var result = FrontEndCheck.Run(Amplified(("adc.pga_gain_error", "\"0.5 %\""), ("check.budget", "\"5 K\"")), Options);
        var p = result.Points.Single(x => x.Celsius == 100);
        var expected = 0.005 * CurrentDesigns.Ohms(100) / CurrentDesigns.OhmsPerKelvin(100);
        Tolerance.AssertClose(expected, Math.Abs(p.Contributions.ConverterKelvin), 0.01, what: "converter part in K");
        Assert.Contains(result.Findings, f => f.Id == "converter" && f.Cause.Contains("the gain stage's gain error ±0.5 %"));
    }

    [Fact]
    public void Worst_case_spreads_the_gain_error_and_its_sensitivity_is_R_over_dR_dT()
    {
        var result = WorstCase.Run(Amplified(("adc.pga_gain_error", "\"0.5 %\""), ("adc.pga_input_current", "\"20 nA\"")),
            new WorstCaseOptions { Threads = 1 });
        var gain = Assert.Single(result.Sensitivities, s => s.Parameter.Kind == ToleranceKind.GainStageGain);
        Assert.Equal("adc.pga_gain_error", gain.Parameter.Key);
        Assert.Single(result.Sensitivities, s => s.Parameter.Kind == ToleranceKind.GainStageInputCurrent);
        var i = result.Points.Select((p, k) => (p, k)).Single(x => x.p.Celsius == 100).k;
        // K per unit gain error: R/(dR/dT), IEC 60751 by hand (351.5 K at 100 °C).
        Tolerance.AssertClose(CurrentDesigns.Ohms(100) / CurrentDesigns.OhmsPerKelvin(100), gain.KelvinPerUnit[i], 0.01, what: "sensitivity");
    }

    [Fact]
    public void Monte_Carlo_units_carry_the_gain_error()
    {
        var result = MonteCarlo.Run(Amplified(("adc.pga_gain_error", "\"0.5 %\""), ("check.budget", "\"5 K\"")),
            new MonteCarloOptions { Units = 40, Seed = 7, Threads = 1 });
        Assert.Contains(result.Parameters, p => p.Kind == ToleranceKind.GainStageGain);
        // Every unit's gain error lies within ±0.5 %, so its error at 100 °C within ±e·R/(dR/dT) = ±1.76 K and ½ LSB.
        var bound = 0.005 * CurrentDesigns.Ohms(100) / CurrentDesigns.OhmsPerKelvin(100) + 0.01;
        var at100 = result.Envelope.Single(e => e.Celsius == 100);
        Assert.True(Math.Max(Math.Abs(at100.MaxKelvin), Math.Abs(at100.MinKelvin)) <= bound, $"{at100.MinKelvin} .. {at100.MaxKelvin} against ±{bound}");
        Assert.True(at100.MaxKelvin - at100.MinKelvin > 0.5, $"{at100.MinKelvin} .. {at100.MaxKelvin}: the spread gain error must show");
    }

    [Fact]
    public void A_delta_sigma_converter_with_a_gain_is_checked_on_the_amplified_scale()
    {
        // The divider's 1.65 V at 25 °C on a 3.3 V ratiometric reference: gain 2 puts 3.3 V on the converter there and more
        // when colder (the sensor on the low side grows), so the signal leaves the range; gain 1.5 leaves room down to
        // about 12 °C (1.5·V = 3.3 V where V = 2.2 V, R_s = 2·R_f, beta model) and fails below it.
        var result = FrontEndCheck.Run(DeltaSigmaDesigns.Make(("adc.gain", "1.5"), ("check.range", "\"20 degC .. 80 degC\"")), Options);
        Tolerance.AssertClose(3.3 / 1.5 / (1 << 24), result.Adc.LsbVolts, 1e-12);
        Assert.DoesNotContain(result.Findings, f => f.Id == GainRangeRule.Id);
        var outOfRange = FrontEndCheck.Run(DeltaSigmaDesigns.Make(("adc.gain", "2"), ("check.range", "\"20 degC .. 80 degC\"")), Options);
        var finding = Assert.Single(outOfRange.Findings, f => f.Id == GainRangeRule.Id);
        Assert.Equal(20, finding.FromCelsius, 9);
        Assert.Equal(20, finding.WorstCelsius, 9);
    }

    [NgspiceFact]
    public void Ngspice_gives_the_same_points_with_the_gain_stage_and_its_input_current()
    {
        // ngspice (an outside engine) simulates the same circuit: the pin with the amplifier's input current, and the
        // sampling capacitor charged from the amplifier's output.
        var design = Amplified(("filter.series_resistor", "\"10 kohm\""), ("filter.reservoir_capacitor", "\"10 nF\""),
            ("adc.pga_input_current", "\"+50 nA\""), ("adc.precharge", "\"discharged\""));
        var ours = FrontEndCheck.Run(design, Options);
        using var engine = new NgspiceEngine();
        var theirs = FrontEndCheck.Run(design, Options with { Engine = engine });
        for (var i = 0; i < ours.Points.Count; i++)
        {
            Tolerance.AssertClose(ours.Points[i].StaticPinVolts, theirs.Points[i].StaticPinVolts, 0, 1e-6, "pin, sweep");
            Tolerance.AssertClose(ours.Points[i].SampleVolts, theirs.Points[i].SampleVolts, 0, 0.01 * ours.Adc.LsbVolts, "sample");
        }
    }

    [Fact]
    public void The_bundled_stability_chamber_reads_the_amplified_resistance_ratio()
    {
        // The example: 250 µA through R_ref = 1.62 kΩ and a Pt100 on 3 wires, gain 8 on a 24-bit converter whose reference is
        // I·R_ref: the ideal code is 2^24·8·R_s/R_ref, the current cancelling (Ohm's law twice; R_s from IEC 60751 by hand).
        var result = ExampleVerdictTests.Checked("stability-chamber-pt100-pga.toml");
        foreach (var p in result.Points)
            Tolerance.AssertClose((1 << 24) * 8 * CurrentDesigns.Ohms(p.Celsius) / 1620, p.IdealVolts / result.Adc.LsbVolts, 1e-9, what: $"ideal code at {p.Celsius} °C");
        Assert.True(result.Passed);
        var json = System.Text.Json.JsonDocument.Parse(ThermVerify.Reporting.CheckJson.Write(result, TestRun.Provenance)).RootElement;
        var stage = json.GetProperty("adc").GetProperty("gainStage");
        Assert.Equal(8, stage.GetProperty("gain").GetDouble());
        Tolerance.AssertClose(0.405, stage.GetProperty("converterReferenceVolts").GetDouble(), 1e-12);
        Tolerance.AssertClose(0.405 / 8, json.GetProperty("adc").GetProperty("referenceVolts").GetDouble(), 1e-12);
    }
}
