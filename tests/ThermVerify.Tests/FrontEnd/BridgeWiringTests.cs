using ThermVerify.Check;
using ThermVerify.Design;
using ThermVerify.FrontEnd;
using ThermVerify.Tests.Ngspice;
using ThermVerify.Tolerances;

namespace ThermVerify.Tests.FrontEnd;

/// <summary>
/// 3 wires in a bridge with the leads in its arms (the usual compensation, common practice for RTD bridges): one lead
/// in the sensor's arm, one in the adjacent (fixed resistor's) arm, the third in the sense line to V+, which carries
/// no current. By hand (the divider formula, Kirchhoff's laws): V+ = E·(R_s + R_L·(1 + m))/(R_s + R_L·(1 + m) + R_f + R_L)
/// with the sensor low, so the leads cancel to first order where R_f = R_s and leave the mismatch term
/// E·m·R_L·R_f/(R_s + R_f)². Each lead is R_L·(1 + α·(T_L − 25 °C)), α copper's 0.393 %/K by default (IEC 60028, from
/// memory); the Pt1000 by IEC 60751 (<see cref="CurrentDesigns.Ohms"/>).
/// </summary>
public class BridgeWiringTests
{
    private static readonly CheckOptions Options = new() { ComputeRemedies = false, MaximumSamplingPoints = 3 };
    private const double E = BridgeDesigns.Excitation;

    private static double Lead(double ohms, double celsius) => ohms * (1 + 3.93e-3 * (celsius - 25));

    private static double Plus(double rs, double rf, double r1, double r2) => E * (rs + r1) / (rs + r1 + rf + r2);

    /// <summary>The Pt1000 bridge with 3 wires; its fixed resistor R(75 °C) = 1289.86 Ω and the opposite half 1 kΩ over 850 Ω (balance near 25 °C).</summary>
    private static FrontEndDesign ThreeWire(string lead, string mismatch, params (string, string?)[] more) => BridgeDesigns.Pt1000([
        ("bridge.fixed_resistor", "\"1289.86 ohm\""), ("bridge.opposite_low", "\"850 ohm\""),
        ("wiring.wires", "3"), ("wiring.lead_resistance", $"\"{lead}\""), ("wiring.lead_mismatch", $"\"{mismatch}\""), .. more]);

    [Fact]
    public void Keys_are_read_written_back_and_refused_where_they_cannot_be_meant()
    {
        var design = ThreeWire("5 ohm", "+2 %", ("wiring.lead_temperature", "\"60 degC\""));
        Assert.Equal(new WiringSpec { Wires = 3, LeadOhms = 5, LeadCelsius = 60, LeadMismatch = 0.02, LeadMismatchSigned = true }, design.Wiring);
        Assert.Equal(design.Wiring, DesignLoader.Parse(DesignWriter.ToToml(design), "normal.toml", Path.GetTempPath()).Wiring);
        var four = Assert.Throws<DesignException>(() => ThreeWire("5 ohm", "0 %", ("wiring.wires", "4"), ("wiring.lead_mismatch", null)));
        Assert.Equal("wiring.wires", four.KeyPath);
        Assert.Contains("a bridge's sensor is wired with 2 or 3 wires", four.Message);
        var current = Assert.Throws<DesignException>(() => ThreeWire("5 ohm", "0 %", ("wiring.current_mismatch", "\"1 %\"")));
        Assert.Equal("wiring.current_mismatch", current.KeyPath);
        var noBridge = Assert.Throws<DesignException>(() => CurrentDesigns.Pt100(("wiring.wires", "3"), ("wiring.lead_resistance", "\"1 ohm\""),
            ("wiring.lead_mismatch", "\"1 %\"")));
        Assert.Equal("wiring.lead_mismatch", noBridge.KeyPath);
        var twoWires = Assert.Throws<DesignException>(() => ThreeWire("5 ohm", "1 %", ("wiring.wires", "2")));
        Assert.Equal("wiring.lead_mismatch", twoWires.KeyPath);
    }

    [Fact]
    public void The_leads_in_the_arms_read_as_the_divider_formula_with_a_lead_in_each_arm()
    {
        // 10 Ω leads following the sweep, the sensor arm's 3 % longer: simulated, closed form and the hand formula agree.
        var result = FrontEndCheck.Run(ThreeWire("10 ohm", "+3 %"), Options);
        foreach (var p in result.Points)
        {
            var (rs, rl) = (CurrentDesigns.Ohms(p.Celsius, 1000), Lead(10, p.Celsius));
            var expected = Plus(rs, 1289.86, rl * 1.03, rl) - Plus(rs, 1289.86, 0, 0);
            Tolerance.AssertClose(expected, p.Estimates.LeadVolts, 1e-9, 1e-12, $"closed form at {p.Celsius} °C");
            // The converter's input with its switch open (1 TΩ) draws V+/1 TΩ through the half's ~700 Ω: about 1 nV.
            Tolerance.AssertClose(expected, p.Simulated.DcLoadingVolts, 1e-9, 2e-9, $"simulated at {p.Celsius} °C");
        }
        var finding = Assert.Single(result.Findings, f => f.Id == "dc-loading");
        Assert.Contains("the bridge's arms", finding.Cause);
        Tolerance.AssertClose(finding.EstimateVolts!.Value, finding.SimulatedVolts!.Value, 1e-6, 1e-12, "closed form beside the simulated value");
    }

    [Fact]
    public void At_R_f_equal_R_s_the_error_is_the_mismatch_term()
    {
        // At 75 °C R_f = R_s: the leads' own term E·R_L·(R_f − R_s)/S² vanishes and the error is E·m·R_L·R_f/(R_s + R_f)²
        // (second order in R_L/S beside it: 1 Ω in 2.6 kΩ). Matched leads there leave only the second order, far below
        // the 2-wire error 2·R_L·∂V+/∂R_s.
        var at75 = (Func<FrontEndDesign, CheckPoint>)(d => FrontEndCheck.Run(d, Options).Points.Single(p => p.Celsius == 75));
        var rs = CurrentDesigns.Ohms(75, 1000);
        var term = BridgeArmLeads.MismatchTermVolts(SensorSide.Low, E, rs, 1289.86, Lead(1, 75), 0.1);
        Tolerance.AssertClose(E * 0.1 * Lead(1, 75) * 1289.86 / Math.Pow(rs + 1289.86, 2), term, 1e-12);
        Tolerance.AssertClose(term, at75(ThreeWire("1 ohm", "+10 %")).Simulated.DcLoadingVolts, 2e-3, 0, "10 % mismatch at 75 °C");
        var matched = at75(ThreeWire("1 ohm", "0 %")).Simulated.DcLoadingVolts;
        var twoWire = 2 * Lead(1, 75) * E * 1289.86 / Math.Pow(rs + 1289.86, 2);
        Assert.True(Math.Abs(matched) < 1e-3 * twoWire, $"matched leads at balance: {matched} V against 2 wires' {twoWire} V");
    }

    [Fact]
    public void The_lead_mismatch_as_a_bound_is_a_tolerance_and_a_remedy()
    {
        // ±5 % without a sign: the worst case's sensitivity is the mismatch term per unit over the half's slope,
        // dT/dm = R_L·R_f/S²·(R_s + R_f)²/R_f/(dR_s/dt) ≈ R_L/(dR_s/dt) (R_L at the swept temperature).
        var design = ThreeWire("10 ohm", "5 %");
        var result = WorstCase.Run(design, new WorstCaseOptions { Threads = 1 });
        var s = Assert.Single(result.Sensitivities, x => x.Parameter.Kind == ToleranceKind.LeadMismatch);
        for (var k = 0; k < result.Points.Count; k++)
        {
            var t = result.Points[k].Celsius;
            var (rs, rl) = (CurrentDesigns.Ohms(t, 1000), Lead(10, t));
            var total = rs + rl + 1289.86 + rl;
            var expected = rl * 1289.86 / (total * total) * Math.Pow(rs + 1289.86, 2) / 1289.86 / CurrentDesigns.OhmsPerKelvin(t, 1000);
            Tolerance.AssertClose(expected, s.KelvinPerUnit[k], 2e-2, 1e-9, $"dT/dm at {t} °C");
        }
    }

    [Fact]
    public void The_dc_loading_finding_names_the_lead_mismatch_the_half_LSB_allows()
    {
        // 1 Ω leads 20 % apart near R_f = R_s (70 °C .. 80 °C): at each point the error is E·R_L·((R_f − R_s) + m·R_f)/S²
        // to first order, held within ½ LSB = E/2^17 (ratiometric) at the worse sign of the bound:
        // |m| ≤ (½ LSB − |E·R_L·(R_f − R_s)/S²|)/(E·R_L·R_f/S²) at every point.
        var design = ThreeWire("1 ohm", "20 %", ("check.range", "\"70 degC .. 80 degC\""), ("check.step", "\"5 K\""));
        var finding = Assert.Single(FrontEndCheck.Run(design, new CheckOptions { MaximumSamplingPoints = 3 }).Findings, f => f.Id == "dc-loading");
        var remedy = Assert.Single(finding.Remedies, r => r.Key == "wiring.lead_mismatch");
        var half = E / 131072;
        var byHand = new[] { 70.0, 75, 80 }.Min(t =>
        {
            var (rs, rl) = (CurrentDesigns.Ohms(t, 1000), Lead(1, t));
            var s2 = Math.Pow(rs + 1289.86 + 2 * rl, 2);
            return (half - Math.Abs(E * rl * (1289.86 - rs) / s2)) / (E * rl * 1289.86 / s2);
        });
        Tolerance.AssertClose(byHand, remedy.Value!.Value, 0.05, what: "the lead mismatch the ½ LSB allows");
        var changed = design with { Wiring = design.Wiring! with { LeadMismatch = remedy.Value.Value } };
        Assert.DoesNotContain(FrontEndCheck.Run(changed, Options).Findings, f => f.Id == "dc-loading");
    }

    [Fact]
    public void Pin_leakage_crosses_the_sense_lead_and_the_half_in_parallel()
    {
        // +50 nA out of the pin (drawn from V+): Ohm's law through R_L3 + (R_s + R_L1) ∥ (R_f + R_L2), matched 20 Ω leads
        // at the board's 25 °C; the closed form of the check and the simulation both read it.
        var design = ThreeWire("20 ohm", "0 %", ("adc.pin_leakage", "\"+50 nA\""), ("check.board_temperature", "\"25 degC\""),
            ("adc.pin_leakage_temperature", "\"25 degC\""));
        foreach (var p in FrontEndCheck.Run(design, Options).Points)
        {
            var rs = CurrentDesigns.Ohms(p.Celsius, 1000);
            var thevenin = 20 + (rs + 20) * (1289.86 + 20) / (rs + 20 + 1289.86 + 20);
            Tolerance.AssertClose(thevenin, p.Estimates.SourceOhms, 1e-9, 0, $"R_th at {p.Celsius} °C");
            Tolerance.AssertClose(-50e-9 * thevenin, p.Estimates.LeakageVolts, 1e-6, 1e-12, $"leakage closed form at {p.Celsius} °C");
            // Superposition: the leads' own term (matched, R_f ≠ R_s) and the leakage's, simulated.
            var leads = Plus(rs, 1289.86, 20, 20) - Plus(rs, 1289.86, 0, 0);
            Tolerance.AssertClose(leads - 50e-9 * thevenin, p.Simulated.DcLoadingVolts, 1e-6, 2e-9, $"simulated at {p.Celsius} °C");
        }
    }

    /// <summary>ngspice, the trade's reference engine, on the 3-wire bridge the check sweeps, with the sensor on either side.</summary>
    [NgspiceTheory]
    [InlineData("low")]
    [InlineData("high")]
    public void Sweep_agrees_with_ngspice_within_a_microvolt(string side)
    {
        var design = ThreeWire("7 ohm", "+4 %", ("bridge.sensor_side", $"\"{side}\""), ("wiring.lead_temperature", "\"70 degC\""),
            ("bridge.fixed_tempco", "\"+25 ppm/K\""), ("adc.pin_leakage", "\"1 nA\""));
        SweepCrossCheck.AssertAgrees(design, [FrontEndNodes.Excitation, FrontEndNodes.Divider, FrontEndNodes.SensorTop, FrontEndNodes.SensorBottom,
            FrontEndNodes.AdjacentLead, FrontEndNodes.BridgeNegative], $"3 wires in the arms, sensor {side}");
    }
}
