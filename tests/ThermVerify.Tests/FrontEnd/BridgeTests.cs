using ThermVerify.Check;
using ThermVerify.Cli;
using ThermVerify.Design;
using ThermVerify.FrontEnd;
using ThermVerify.Ngspice;
using ThermVerify.Sensors;
using ThermVerify.Tests.Cli;
using ThermVerify.Tests.Ngspice;
using ThermVerify.Tolerances;

namespace ThermVerify.Tests.FrontEnd;

/// <summary>
/// A Wheatstone bridge read differentially, against its closed form. The outside reference is the quarter-bridge
/// equation of strain-gauge and bridge-circuit texts (from memory): with three arms R and the fourth R·(1 + x),
/// V_out/E = x/(4 + 2x), which is x/4 for small x. The general form, V_d = E·(R_s/(R_s + R_f) − R_low/(R_high + R_low)),
/// is Kirchhoff's laws on the two halves, each a voltage divider.
/// </summary>
public class BridgeTests
{
    private static readonly CheckOptions Options = new() { ComputeRemedies = false, MaximumSamplingPoints = 3 };

    [Fact]
    public void Keys_are_read_written_back_and_refused_with_their_position()
    {
        var design = BridgeDesigns.Pt1000(("bridge.opposite_low_tolerance", "\"0.1 %\""), ("bridge.opposite_high_tempco", "\"-15 ppm/K\""));
        Assert.Equal(new BridgeSpec { HighOhms = 1000, LowOhms = 1000, LowTolerance = 0.001, HighTempcoPerKelvin = -15e-6, HighTempcoSigned = true }, design.Bridge);
        Assert.Equal(SensorSide.Low, design.VoltageDivider.SensorSide);
        var again = DesignLoader.Parse(DesignWriter.ToToml(design), "normal.toml", Path.GetTempPath());
        Assert.Equal(design.Bridge, again.Bridge);
        Assert.Equal(design.Divider, again.Divider);

        void Refused(string key, string text, params (string, string?)[] overrides)
        {
            var e = Assert.Throws<DesignException>(() => BridgeDesigns.Pt1000(overrides));
            Assert.Equal(key, e.KeyPath);
            Assert.True(e.Line > 1, $"{key}: a line of the file ({e.Line})");
            Assert.Contains(text, e.Message);
        }
        Refused("bridge.opposite_hi", "Did you mean \"opposite_high\"?", ("bridge.opposite_hi", "\"1 kohm\""));
        Refused("bridge.opposite_low", "opposite_low", ("bridge.opposite_low", null));
        Refused("bridge.opposite_high", "ohm", ("bridge.opposite_high", "\"1 kV\""));
        Refused("bridge.opposite_low", "", ("bridge.opposite_low", "\"-1 kohm\""));
        // A switched excitation is a divider's: a bridge does not take it (not modelled for a bridge).
        Refused("bridge.switch_on_lead", "unknown key", ("bridge.switch_on_lead", "\"1 ms\""));
        Refused("buffer", "a buffer behind a bridge is not modelled", ("buffer.gain_bandwidth", "\"1 MHz\""), ("buffer.supply", "\"0 V .. 3.3 V\""));
        var both = Assert.Throws<DesignException>(() => BridgeDesigns.Pt1000(("divider.excitation", "\"3.3 V\"")));
        Assert.Equal("bridge", both.KeyPath);
        Assert.Contains("both [bridge] and [divider]", both.Message);
    }

    [Fact]
    public void The_closed_form_is_the_quarter_bridge_equation()
    {
        var design = BridgeDesigns.Pt1000();
        foreach (var celsius in new[] { 0.0, 37.5, 100, 150 })
        {
            var rs = CurrentDesigns.Ohms(celsius, 1000);
            var x = rs / 1000 - 1;
            // The textbook quarter bridge: V/E = x/(4 + 2x).
            var expected = BridgeDesigns.Excitation * x / (4 + 2 * x);
            Tolerance.AssertClose(expected, SensorTransfer.OutputVolts(design, rs), 1e-12, 1e-15, $"V_d at {celsius} °C");
            Tolerance.AssertClose(rs, SensorTransfer.SensorOhms(design, expected), 1e-12, 1e-12, $"its inverse at {celsius} °C");
        }
        // The sensor high: its half reads E·R_f/(R_s + R_f), falling as the sensor warms, so the bridge is negative above balance.
        var high = BridgeDesigns.Pt1000(("bridge.sensor_side", "\"high\""));
        var r100 = CurrentDesigns.Ohms(100, 1000);
        Tolerance.AssertClose(2.5 * (1000 / (r100 + 1000) - 0.5), SensorTransfer.OutputVolts(high, r100), 1e-12, 1e-15, "sensor high");
    }

    [Fact]
    public void Simulated_bridge_meets_the_closed_form_and_the_opposite_halfs_drift_is_both()
    {
        // Nothing loads the bridge: v(div) − v(opp) from the engine is the bridge equation at every point.
        var plain = FrontEndCheck.Run(BridgeDesigns.Pt1000(), Options);
        foreach (var p in plain.Points)
        {
            Tolerance.AssertClose(p.IdealVolts, p.DcPinVolts, 1e-9, 1e-12, $"v(div) − v(opp) at {p.Celsius} °C");
            Tolerance.AssertClose(0, p.Simulated.DcLoadingVolts, 0, 1e-12, $"no loading at {p.Celsius} °C");
        }
        Assert.True(plain.Passed);

        // The opposite low arm +200 ppm/K at a 65 °C board: V− rises by E·(r(65) − ½), r = R_l(1 + α·40 K)/(R_h + R_l(1 + α·40 K)),
        // and the converter reads it with the opposite sign, simulated and in closed form alike.
        var drifting = FrontEndCheck.Run(BridgeDesigns.Pt1000(("bridge.opposite_low_tempco", "\"+200 ppm/K\""), ("check.board_temperature", "\"65 degC\"")), Options);
        var low = 1000 * (1 + 200e-6 * 40);
        var expected = -2.5 * (low / (1000 + low) - 0.5);
        foreach (var p in drifting.Points)
        {
            Tolerance.AssertClose(expected, p.Simulated.DcLoadingVolts, 1e-9, 1e-12, $"simulated at {p.Celsius} °C");
            Tolerance.AssertClose(expected, p.Estimates.LoadingVolts, 1e-9, 1e-12, $"closed form at {p.Celsius} °C");
        }
        var finding = Assert.Single(drifting.Findings, f => f.Id == "dc-loading");
        Assert.Contains("the bridge's tempcos", finding.Cause);
        Tolerance.AssertClose(finding.EstimateVolts!.Value, finding.SimulatedVolts!.Value, 1e-6, 1e-12, "closed form beside the simulated value");
    }

    [Fact]
    public void A_ratiometric_bridge_cancels_its_excitation()
    {
        // The code is 2^16·V_d/E, and V_d is proportional to E: 10 % more excitation moves no code.
        var nominal = FrontEndCheck.Run(BridgeDesigns.Pt1000(), Options);
        var high = FrontEndCheck.Run(BridgeDesigns.Pt1000(("bridge.excitation", "\"2.75 V\"")), Options);
        Assert.Equal(nominal.Points.Select(p => p.Code), high.Points.Select(p => p.Code));
        foreach (var p in nominal.Points)
        {
            var x = CurrentDesigns.Ohms(p.Celsius, 1000) / 1000 - 1;
            Assert.Equal((int)Math.Round(65536 * x / (4 + 2 * x)), p.Code);
        }
    }

    [Fact]
    public void The_worst_case_spreads_the_opposite_half()
    {
        // The opposite low arm 0.1 %: V− moves by E·R_l·R_h/(R_h + R_l)²·0.001 = 625 µV, read as −625 µV; over the
        // bridge's slope dV_d/dT = E·R_f/(R_s + R_f)²·dR_s/dT that is the sensitivity at every point.
        var result = WorstCase.Run(BridgeDesigns.Pt1000(("bridge.opposite_low_tolerance", "\"0.1 %\""), ("bridge.opposite_high_tolerance", "\"0.1 %\"")),
            new WorstCaseOptions { Threads = 1 });
        var low = Assert.Single(result.Sensitivities, s => s.Parameter.Kind == ToleranceKind.BridgeLowResistance);
        var high = Assert.Single(result.Sensitivities, s => s.Parameter.Kind == ToleranceKind.BridgeHighResistance);
        for (var k = 0; k < result.Points.Count; k++)
        {
            var t = result.Points[k].Celsius;
            var rs = CurrentDesigns.Ohms(t, 1000);
            var slope = 2.5 * 1000 / ((rs + 1000) * (rs + 1000)) * CurrentDesigns.OhmsPerKelvin(t, 1000);
            Tolerance.AssertClose(-2.5 * 0.25 / slope, low.KelvinPerUnit[k], 2e-3, 1e-6, $"dT/dx of the low arm at {t} °C");
            Tolerance.AssertClose(2.5 * 0.25 / slope, high.KelvinPerUnit[k], 2e-3, 1e-6, $"dT/dx of the high arm at {t} °C");
        }
    }

    [Fact]
    public void A_bridge_tempco_remedy_names_the_bridges_key_and_passes_when_applied()
    {
        // 300 ppm/K on the opposite low arm at a 70 °C board: E·Δr = 2.5 V·(r(70) − ½) ≈ 1.7 mV, about 0.7 K on the
        // bridge's slope, over the 0.5 K budget: a failing DC-loading finding whose remedy is that arm's tempco.
        var design = BridgeDesigns.Pt1000(("bridge.opposite_low_tempco", "\"300 ppm/K\""), ("check.board_temperature", "\"70 degC\""), ("adc.noise", "\"0 LSB\""));
        var result = FrontEndCheck.Run(design, new CheckOptions { MaximumSamplingPoints = 3 });
        var finding = Assert.Single(result.Findings, f => f.Id == "dc-loading");
        Assert.Equal(Severity.Fail, finding.Severity);
        var remedy = Assert.Single(finding.Remedies, r => r.Key == "bridge.opposite_low_tempco");
        Assert.InRange(remedy.Value!.Value, 0, 300e-6);
        var applied = FrontEndCheck.Run(design with { Bridge = design.Bridge! with { LowTempcoPerKelvin = remedy.Value.Value } }, Options);
        Assert.DoesNotContain(applied.Findings, f => f.Id == "dc-loading" && f.Severity == Severity.Fail);
        Assert.True(applied.Passed);
    }

    [Fact]
    public void Choose_fixed_and_table_take_a_bridge()
    {
        var path = Path.Combine(Repository.Netlists, "fermenter-pt1000-bridge.toml");
        var table = CliRunner.Run("table", path);
        Assert.Equal(ExitCodes.Success, table.ExitCode);
        // The sensor half's fixed resistor, with the opposite low resistor re-balanced (BridgeFixedChoiceTests holds the figures).
        var chosen = CliRunner.Run("choose-fixed", path, "--series", "E12");
        Assert.Equal(ExitCodes.Success, chosen.ExitCode);
        Assert.Contains("R_low (opposite)", chosen.Output);
    }

    /// <summary>ngspice, the trade's reference engine, on the bridge the check sweeps: every node within 1 µV.</summary>
    [NgspiceFact]
    public void Sweep_agrees_with_ngspice_within_a_microvolt()
    {
        var design = BridgeDesigns.Pt1000(("bridge.fixed_tempco", "\"25 ppm/K\""), ("bridge.opposite_high_tempco", "\"-40 ppm/K\""),
            ("bridge.opposite_low", "\"953 ohm\""), ("bridge.opposite_low_tempco", "\"60 ppm/K\""), ("adc.pin_leakage", "\"2 nA\""),
            ("filter.series_resistor", "\"1 kohm\""), ("filter.reservoir_capacitor", "\"100 nF\""), ("check.step", "\"5 K\""));
        string[] nodes = [FrontEndNodes.Excitation, FrontEndNodes.Divider, FrontEndNodes.BridgeNegative, FrontEndNodes.Pin];
        var worst = SweepCrossCheck.AssertAgrees(design, nodes);
        Console.WriteLine($"bridge sweep: largest difference from ngspice {worst:G3} V");
    }
}
