using ThermVerify.Check;
using ThermVerify.Design;
using ThermVerify.FrontEnd;
using ThermVerify.Tests.Check;
using ThermVerify.Tolerances;

namespace ThermVerify.Tests.FrontEnd;

/// <summary>
/// A current through the sensor: the loader's keys and refusals, the closed form V = I·R_s (Ohm's law) against the IEC
/// 60751 resistance, the current's tolerance and tempco, the source's output resistance (R_s ∥ R_out) and its compliance.
/// </summary>
public class CurrentExcitationTests
{
    private static readonly CheckOptions Options = new() { ComputeRemedies = false, MaximumSamplingPoints = 3 };

    [Fact]
    public void Keys_are_read_and_written_back()
    {
        var design = CurrentDesigns.Ratiometric(("current_source.current_tolerance", "\"5 %\""), ("current_source.current_tempco", "\"-40 ppm/K\""),
            ("current_source.compliance", "\"0 V .. 3 V\""), ("current_source.output_resistance", "\"50 Mohm\""),
            ("current_source.reference_resistor_tolerance", "\"0.02 %\""), ("current_source.reference_resistor_tempco", "\"5 ppm/K\""),
            ("current_source.reference_input_resistance", "\"10 Mohm\""));
        var c = design.CurrentSource!;
        Assert.Null(design.Divider);
        Assert.Equal(1e-3, c.CurrentAmperes, 15);
        Assert.Equal(0.05, c.CurrentTolerance, 15);
        Assert.Equal(-40e-6, c.CurrentTempcoPerKelvin, 15);
        Assert.True(c.CurrentTempcoSigned);
        Assert.Equal(new VoltageRange(0, 3), c.Compliance);
        Assert.Equal(50e6, c.OutputResistanceOhms);
        Assert.Equal(2e3, c.ReferenceResistorOhms);
        Assert.Equal(2.0, design.NominalReferenceVolts, 12);
        var back = DesignLoader.Parse(DesignWriter.ToToml(design), "normal.toml", Path.GetTempPath());
        Assert.Equal(c, back.CurrentSource);
    }

    [Theory]
    [InlineData("current_source.reference_resistor_tempco", "\"5 ppm/K\"", "current_source.reference_resistor_tempco", "without reference_resistor")]
    [InlineData("current_source.compliance", "\"2 V .. 1 V\"", "current_source.compliance", "")]
    [InlineData("adc.reference", "\"ratiometric\"", "adc.reference", "no voltage for the converter to be ratiometric to")]
    [InlineData("divider.excitation", "\"3.3 V\"", "divider.excitation", "")]
    public void Impossible_current_designs_are_refused_with_the_key(string key, string value, string errorKey, string words)
    {
        // A [divider] key beside [current_source] makes an incomplete divider: refused at its own section first.
        var e = Assert.Throws<DesignException>(() => CurrentDesigns.Pt100((key, value)));
        Assert.StartsWith(errorKey.Split('.')[0], e.KeyPath);
        Assert.Contains(words, e.Message);
        Assert.True(e.Line >= 1);
    }

    [Fact]
    public void A_reference_resistor_with_a_fixed_reference_and_a_buffer_are_refused()
    {
        var fixedReference = Assert.Throws<DesignException>(() => CurrentDesigns.Pt100(("current_source.reference_resistor", "\"2 kohm\"")));
        Assert.Equal("adc.reference", fixedReference.KeyPath);
        Assert.Contains("write reference = \"ratiometric\"", fixedReference.Message, StringComparison.OrdinalIgnoreCase);
        var buffer = Assert.Throws<DesignException>(() => CurrentDesigns.Pt100(("buffer.gain_bandwidth", "\"1 MHz\""), ("buffer.supply", "\"0 V .. 3.3 V\"")));
        Assert.Equal("buffer", buffer.KeyPath);
        var neither = Assert.Throws<DesignException>(() => TestDesign.Make(("divider.sensor_side", null), ("divider.fixed_resistor", null),
            ("divider.fixed_tempco", null), ("divider.excitation", null)));
        Assert.Contains("[current_source]", neither.Message);
    }

    [Fact]
    public void Ideal_source_reads_ohms_law_on_the_iec_60751_resistance()
    {
        // V = I·R(t) with R from IEC 60751 by hand; the code is V/Q rounded (IEEE Std 1241), Q = 2.5 V/2^16.
        var result = FrontEndCheck.Run(CurrentDesigns.Pt100(), Options);
        foreach (var p in result.Points)
        {
            var volts = 1e-3 * CurrentDesigns.Ohms(p.Celsius);
            Tolerance.AssertClose(volts, p.IdealVolts, 1e-12, 0, $"ideal at {p.Celsius} °C");
            Tolerance.AssertClose(volts, p.StaticPinVolts, 0, 1e-9, $"simulated at {p.Celsius} °C");
            Assert.Equal((int)Math.Round(volts / (2.5 / 65536)), p.Code);
        }
        Assert.True(result.Passed);
        // The IEC 60751 table: 138.51 Ω at 100 °C, so 138.51 mV (±5 µV, the table's two decimals).
        Tolerance.AssertClose(0.13851, result.Points.Single(p => p.Celsius == 100).IdealVolts, 0, 5e-6, "IEC 60751 table at 100 °C");
    }

    [Fact]
    public void Output_resistance_shunts_the_sensor_as_ohms_law_says()
    {
        // A 100 kΩ output resistance: V = I·(R_s ∥ R_out), so the pin is I·R_s²/(R_s + R_out) low.
        var result = FrontEndCheck.Run(CurrentDesigns.Pt100(("current_source.output_resistance", "\"100 kohm\"")), Options);
        foreach (var p in result.Points)
        {
            var r = CurrentDesigns.Ohms(p.Celsius);
            var expected = -1e-3 * r * r / (r + 100e3);
            Tolerance.AssertClose(expected, p.Simulated.DcLoadingVolts, 1e-9, 1e-12, $"simulated at {p.Celsius} °C");
            Tolerance.AssertClose(expected, p.Estimates.LoadingVolts, 1e-9, 1e-12, $"closed form at {p.Celsius} °C");
        }
    }

    [Fact]
    public void Current_tempco_at_the_board_moves_the_reading_by_its_drift()
    {
        // +100 ppm/K at 75 °C: the current is 0.5 % high, the pin 0.5 % high: ΔV = 0.005·I·R_s (Ohm's law).
        var result = FrontEndCheck.Run(CurrentDesigns.Pt100(("current_source.current_tempco", "\"+100 ppm/K\""), ("check.board_temperature", "\"75 degC\"")), Options);
        foreach (var p in result.Points)
        {
            var expected = 0.005 * 1e-3 * CurrentDesigns.Ohms(p.Celsius);
            Tolerance.AssertClose(expected, p.Simulated.DcLoadingVolts, 1e-9, 1e-12, $"simulated at {p.Celsius} °C");
            Tolerance.AssertClose(expected, p.Estimates.ExcitationVolts, 1e-9, 1e-12, $"closed form at {p.Celsius} °C");
        }
        var loading = Assert.Single(result.Findings, f => f.Id == "dc-loading");
        Assert.Contains("the current source of 1 mA at 75 °C", loading.Cause);
    }

    [Fact]
    public void Current_tempco_follows_the_sweep_without_a_board_temperature()
    {
        // The tempco stage (1 A through 1 Ω with the tempco) scales the current by 1 + tc·(t − 25 °C) at each point.
        var result = FrontEndCheck.Run(CurrentDesigns.Pt100(("current_source.current_tempco", "\"-50 ppm/K\"")), Options);
        foreach (var p in result.Points)
            Tolerance.AssertClose(-50e-6 * (p.Celsius - 25) * 1e-3 * CurrentDesigns.Ohms(p.Celsius), p.Simulated.DcLoadingVolts, 1e-9, 1e-12,
                $"at {p.Celsius} °C");
    }

    [Fact]
    public void Worst_case_reads_a_current_error_as_the_same_resistance_error()
    {
        // Against a fixed reference a unit with the current ε high reads R_s·(1 + ε): dT/dε = R_s/(dR_s/dt), with the
        // derivative of the IEC 60751 equation; central differences over ±1 % leave about 1e-4 relative.
        var result = WorstCase.Run(CurrentDesigns.Pt100(("current_source.current_tolerance", "\"1 %\"")), new WorstCaseOptions { Threads = 1 });
        var s = Assert.Single(result.Sensitivities, x => x.Parameter.Kind == ToleranceKind.Current);
        for (var k = 0; k < result.Points.Count; k++)
        {
            var t = result.Points[k].Celsius;
            Tolerance.AssertClose(CurrentDesigns.Ohms(t) / CurrentDesigns.OhmsPerKelvin(t), s.KelvinPerUnit[k], 2e-3, 1e-9, $"dT/dε at {t} °C");
        }
    }

    [Fact]
    public void Compliance_fails_where_the_sensor_voltage_leaves_the_range()
    {
        // 1 mA into a Pt100 reaches 175.86 mV at 200 °C (IEC 60751 table): a 0 V .. 0.15 V compliance is left above
        // 0.15 V, between 100 °C (138.5 mV) and 150 °C (157.3 mV); the finding gives Ohm's law beside the simulation.
        var result = FrontEndCheck.Run(CurrentDesigns.Pt100(("current_source.compliance", "\"0 V .. 0.15 V\"")), Options);
        var f = Assert.Single(result.Findings, x => x.Id == "compliance");
        Assert.Equal(Severity.Fail, f.Severity);
        Assert.False(result.Passed);
        Assert.Equal(150, f.FromCelsius);
        Assert.Equal(200, f.WorstCelsius);
        Tolerance.AssertClose(0.17586, f.SimulatedVolts!.Value, 0, 5e-6, "simulated output at 200 °C");
        Tolerance.AssertClose(f.SimulatedVolts.Value, f.EstimateVolts!.Value, 1e-9, 0, "I·R_s beside it");
        Tolerance.AssertClose(0.17586 - 0.15, f.SizeVolts, 0, 5e-6, "how far beyond");
        // Inside the range: no finding.
        Assert.DoesNotContain(FrontEndCheck.Run(CurrentDesigns.Pt100(("current_source.compliance", "\"0 V .. 0.2 V\"")), Options).Findings,
            x => x.Id == "compliance");
    }

    [Fact]
    public void Self_heating_cause_names_the_excitation_current_not_a_divider()
    {
        // P = I²·R_s (Joule's law) with no divider to share the power: the cause says so.
        var result = FrontEndCheck.Run(CurrentDesigns.Pt100(("sensor.dissipation_constant", "\"0.1 mW/K\"")), Options);
        var f = Assert.Single(result.Findings, x => x.Id == "self-heating");
        Assert.StartsWith("the sensor dissipates I²R of the excitation current and warms by P/δ", f.Cause);
        Assert.DoesNotContain("divider", f.Cause);
    }

    [Fact]
    public void Choose_fixed_refuses_a_current_source_with_what_to_run_instead()
    {
        var design = CurrentDesigns.Pt100();
        var chooser = Assert.Throws<DesignException>(() => FixedResistorSearch.Run(design));
        Assert.Contains("current source", chooser.Message);
    }
}
