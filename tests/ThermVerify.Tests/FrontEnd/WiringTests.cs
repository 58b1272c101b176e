using ThermVerify.Check;
using ThermVerify.Design;
using ThermVerify.FrontEnd;
using ThermVerify.Ngspice;
using ThermVerify.Sensors;
using ThermVerify.Tests.Ngspice;
using ThermVerify.Tolerances;

namespace ThermVerify.Tests.FrontEnd;

/// <summary>
/// 2, 3 and 4 wires against their closed forms (Ohm's law on the leads; common practice for RTD connections): 2 wires
/// read 2·I·R_L high, 3 wires leave the mismatch term −m·I·R_L, 4 wires the input current times the sense lead. Each
/// lead is R_L·(1 + α·(T_L − 25 °C)) at the leads' own temperature, α copper's 0.393 %/K by default (IEC 60028, from
/// memory). The sensor is a Pt100 at 1 mA by IEC 60751.
/// </summary>
public class WiringTests
{
    private static readonly CheckOptions Options = new() { ComputeRemedies = false, MaximumSamplingPoints = 3 };

    private static double Lead(double ohms, double celsius) => ohms * (1 + 3.93e-3 * (celsius - 25));

    [Fact]
    public void Keys_are_read_written_back_and_refused_where_they_cannot_be_meant()
    {
        var design = CurrentDesigns.Pt100(("wiring.wires", "3"), ("wiring.lead_resistance", "\"0.8 ohm\""), ("wiring.lead_temperature", "\"-10 degC\""),
            ("wiring.current_mismatch", "\"0.2 %\""));
        Assert.Equal(new WiringSpec { Wires = 3, LeadOhms = 0.8, LeadCelsius = -10, CurrentMismatch = 0.002 }, design.Wiring);
        Assert.Equal(design.Wiring, DesignLoader.Parse(DesignWriter.ToToml(design), "normal.toml", Path.GetTempPath()).Wiring);
        var five = Assert.Throws<DesignException>(() => CurrentDesigns.Pt100(("wiring.wires", "5"), ("wiring.lead_resistance", "\"1 ohm\"")));
        Assert.Equal("wiring.wires", five.KeyPath);
        var mismatch = Assert.Throws<DesignException>(() => CurrentDesigns.Pt100(("wiring.wires", "4"), ("wiring.lead_resistance", "\"1 ohm\""),
            ("wiring.current_mismatch", "\"1 %\"")));
        Assert.Equal("wiring.current_mismatch", mismatch.KeyPath);
        var divider = Assert.Throws<DesignException>(() => Check.TestDesign.Make(("wiring.wires", "3"), ("wiring.lead_resistance", "\"1 ohm\"")));
        Assert.Equal("wiring.wires", divider.KeyPath);
        Assert.Contains("a divider's sensor is wired with 2 wires", divider.Message);
    }

    [Fact]
    public void Two_wires_read_both_leads()
    {
        // 1 Ω leads at 60 °C (the board at 35 °C): the pin is I·2·R_L(60 °C) high at every temperature.
        var result = FrontEndCheck.Run(CurrentDesigns.Pt100(("wiring.wires", "2"), ("wiring.lead_resistance", "\"1 ohm\""),
            ("wiring.lead_temperature", "\"60 degC\""), ("check.board_temperature", "\"35 degC\"")), Options);
        var expected = 1e-3 * 2 * Lead(1, 60);
        foreach (var p in result.Points)
        {
            Tolerance.AssertClose(expected, p.Simulated.DcLoadingVolts, 1e-9, 1e-12, $"simulated at {p.Celsius} °C");
            Tolerance.AssertClose(expected, p.Estimates.LeadVolts, 1e-9, 1e-12, $"closed form at {p.Celsius} °C");
        }
        // 2·R_L = 2.27 Ω reads about 5.8 K high on a Pt100 (0.39 Ω/K): a failing DC-loading finding.
        Assert.Equal(Severity.Fail, Assert.Single(result.Findings, f => f.Id == "dc-loading").Severity);
    }

    [Fact]
    public void Three_wires_leave_the_mismatch_term()
    {
        // The second current 1 % high: the converter reads I·R_L − 1.01·I·R_L = −0.01·I·R_L, leads following the sweep.
        var result = FrontEndCheck.Run(CurrentDesigns.Pt100(("wiring.wires", "3"), ("wiring.lead_resistance", "\"2 ohm\""),
            ("wiring.current_mismatch", "\"+1 %\"")), Options);
        foreach (var p in result.Points)
        {
            var expected = -0.01 * 1e-3 * Lead(2, p.Celsius);
            Tolerance.AssertClose(expected, p.Simulated.DcLoadingVolts, 1e-9, 1e-12, $"simulated at {p.Celsius} °C");
            Tolerance.AssertClose(expected, p.Estimates.LeadVolts, 1e-9, 1e-12, $"closed form at {p.Celsius} °C");
        }
        // Matched currents cancel the leads exactly.
        var matched = FrontEndCheck.Run(CurrentDesigns.Pt100(("wiring.wires", "3"), ("wiring.lead_resistance", "\"2 ohm\"")), Options);
        Assert.All(matched.Points, p => Tolerance.AssertClose(0, p.Simulated.DcLoadingVolts, 0, 1e-12, $"matched at {p.Celsius} °C"));
    }

    [Fact]
    public void Three_wire_mismatch_as_a_bound_is_a_tolerance_in_the_worst_case()
    {
        // ±0.5 % without a sign: the worst case's sensitivity is dT/dm = −I·R_L/(I·dR_s/dt) (the reading's resistance
        // moves by −m·R_L), with R_L at the swept temperature.
        var result = WorstCase.Run(CurrentDesigns.Pt100(("wiring.wires", "3"), ("wiring.lead_resistance", "\"2 ohm\""),
            ("wiring.current_mismatch", "\"0.5 %\"")), new WorstCaseOptions { Threads = 1 });
        var s = Assert.Single(result.Sensitivities, x => x.Parameter.Kind == ToleranceKind.CurrentMismatch);
        for (var k = 0; k < result.Points.Count; k++)
        {
            var t = result.Points[k].Celsius;
            Tolerance.AssertClose(-Lead(2, t) / CurrentDesigns.OhmsPerKelvin(t), s.KelvinPerUnit[k], 2e-3, 1e-9, $"dT/dm at {t} °C");
        }
    }

    [Fact]
    public void Four_wires_read_only_the_input_current_through_the_sense_lead()
    {
        // 5 Ω leads, a +20 nA input current at the board's 35 °C (doubling every 10 K: 40 nA): the converter reads the
        // sensor less 40 nA through the sensor and through its sense lead; the leads' part is −I_in·R_L. (0.1 nV: the 1 TΩ
        // that gives each sense end a second connection draws tens of femtoamperes.)
        var design = CurrentDesigns.Pt100(("wiring.wires", "4"), ("wiring.lead_resistance", "\"5 ohm\""), ("adc.pin_leakage", "\"+20 nA\""),
            ("check.board_temperature", "\"35 degC\""));
        var result = FrontEndCheck.Run(design, Options);
        const double input = 40e-9;
        foreach (var p in result.Points)
        {
            var lead = Lead(5, 35);
            Tolerance.AssertClose(-input * lead, p.Estimates.LeadVolts, 1e-9, 1e-15, $"closed form at {p.Celsius} °C");
            Tolerance.AssertClose(-input * (CurrentDesigns.Ohms(p.Celsius) + lead), p.Simulated.DcLoadingVolts, 1e-6, 1e-10, $"simulated at {p.Celsius} °C");
            Tolerance.AssertClose(p.Estimates.LoadingVolts, p.Simulated.DcLoadingVolts, 1e-6, 1e-10, $"closed form beside it at {p.Celsius} °C");
        }
    }

    [Fact]
    public void Four_wires_with_a_reference_resistor_stay_ratiometric()
    {
        // The reference resistor sits on the force lead: its voltage is I·R_ref whatever the leads do, so the code is
        // 2^16·R_s/R_ref (IEC 60751 by hand) with 10 Ω leads and the current 8 % off.
        var result = FrontEndCheck.Run(CurrentDesigns.Ratiometric(("wiring.wires", "4"), ("wiring.lead_resistance", "\"10 ohm\""),
            ("current_source.current", "\"1.08 mA\"")), Options);
        foreach (var p in result.Points)
            Assert.Equal((int)Math.Round(65536 * CurrentDesigns.Ohms(p.Celsius) / 2000), p.Code);
    }

    [Fact]
    public void The_greenhouse_logger_passes_on_four_wires_and_would_fail_on_two()
    {
        // Its 6 Ω leads at 5 °C read 2·I·R_L = 2·200 µA·5.53 Ω = 2.2 mV high on 2 wires, about 2.9 K on a Pt1000
        // (3.85 Ω/K): the same design on 4 wires crosses the sense leads with the converter's input current alone.
        var design = ExampleDesigns.Load("greenhouse-pt1000-4wire.toml");
        var four = FrontEndCheck.Run(design, Options);
        Assert.True(four.Passed);
        var two = FrontEndCheck.Run(design with { Wiring = design.Wiring! with { Wires = 2 } }, Options);
        Assert.False(two.Passed);
        var loading = Assert.Single(two.Findings, f => f.Id == "dc-loading");
        Assert.Equal(Severity.Fail, loading.Severity);
        // 2e-4: the current is 20 ppm/K × 5 K = 1e-4 above 200 µA at the board, and the ±7 nA leakage bound crosses the leads too.
        foreach (var p in two.Points)
            Tolerance.AssertClose(200e-6 * 2 * Lead(6, 5), p.Estimates.LeadVolts, 2e-4, 0, $"2·I·R_L at {p.Celsius} °C");
        Tolerance.AssertClose(loading.EstimateVolts!.Value, loading.SimulatedVolts!.Value, 1e-3, 1e-7, "closed form beside the simulated value");
    }

    /// <summary>ngspice, the trade's reference engine, on the 3- and 4-wire circuits the check sweeps.</summary>
    [NgspiceTheory]
    [InlineData(3)]
    [InlineData(4)]
    public void Sweep_agrees_with_ngspice_within_a_microvolt(int wires)
    {
        var design = CurrentDesigns.Ratiometric(("wiring.wires", wires.ToString(System.Globalization.CultureInfo.InvariantCulture)),
            ("wiring.lead_resistance", "\"3 ohm\""), ("current_source.current_tempco", "\"-30 ppm/K\""), ("current_source.output_resistance", "\"2 Mohm\""),
            ("adc.pin_leakage", "\"1 nA\""));
        SweepCrossCheck.AssertAgrees(design, [FrontEndNodes.Excitation, FrontEndNodes.Divider, FrontEndNodes.SensorTop, FrontEndNodes.SensorBottom,
            wires == 3 ? FrontEndNodes.Compensation : FrontEndNodes.SenseNegative], $"{wires} wires");
    }

    /// <summary>
    /// 2 wires to a divider's sensor: the divider formula (Kirchhoff's laws) with R_s + 2·R_L(T_L) in the sensor's arm,
    /// on both sides, simulated and in closed form, exactly (the circuit is linear).
    /// </summary>
    [Theory]
    [InlineData("low")]
    [InlineData("high")]
    public void Two_wires_to_a_divider_put_both_leads_in_the_sensors_arm(string side)
    {
        var design = Check.TestDesign.Make(("divider.sensor_side", $"\"{side}\""), ("wiring.wires", "2"), ("wiring.lead_resistance", "\"20 ohm\""),
            ("wiring.lead_temperature", "\"-5 degC\""), ("adc.noise", "\"0 LSB\""));
        var sensor = design.Sensor.Build();
        var temperatures = SensorTabulation.Grid(design.Check.Range, design.Check.StepKelvin).ToArray();
        var pin = ((ICheckEngine)BuiltInEngine.Instance).TemperatureSweep(FrontEndCircuit.Dc(design, null), temperatures, [FrontEndNodes.Divider])[0];
        var result = FrontEndCheck.Run(design, Options);
        for (var i = 0; i < temperatures.Length; i++)
        {
            var rs = sensor.ResistanceOhms(temperatures[i]) + 2 * Lead(20, -5);
            var expected = side == "low" ? 3.3 * rs / (rs + 10e3) : 3.3 * 10e3 / (rs + 10e3);
            Tolerance.AssertClose(expected, pin[i], 1e-9, 1e-12, $"{side} side at {temperatures[i]} °C");
            var p = result.Points[i];
            Tolerance.AssertClose(expected - p.IdealVolts, p.Estimates.LeadVolts, 1e-9, 1e-12, $"closed form at {temperatures[i]} °C");
        }
        var loading = Assert.Single(result.Findings, f => f.Id == "dc-loading");
        Assert.Contains("the 2 leads of 20 Ω each at -5 °C in the sensor's arm", loading.Cause);
    }

    [Fact]
    public void A_divider_leads_remedy_is_the_largest_lead_the_budget_allows_and_passes_when_applied()
    {
        var design = Check.TestDesign.Make(("sensor.model", "\"rtd\""), ("sensor.r25", null), ("sensor.beta", null), ("sensor.r0", "\"1000 ohm\""),
            ("divider.fixed_resistor", "\"4.7 kohm\""), ("wiring.wires", "2"), ("wiring.lead_resistance", "\"2 ohm\""), ("adc.noise", "\"0 LSB\""));
        var result = FrontEndCheck.Run(design, new CheckOptions { MaximumSamplingPoints = 3 });
        var remedy = Assert.Single(Assert.Single(result.Findings, f => f.Id == "dc-loading").Remedies, r => r.Key == "wiring.lead_resistance");
        Assert.InRange(remedy.Value!.Value, 1e-3, 2);
        Assert.DoesNotContain(FrontEndCheck.Run(design with { Wiring = design.Wiring! with { LeadOhms = remedy.Value.Value } }, Options).Findings,
            f => f.Id == "dc-loading");
    }

    [Fact]
    public void Leads_of_zero_ohms_are_checked_not_refused_by_the_engine()
    {
        // Allowed by the loader (and where a remedy's search ends): a divider then has no leads, a current source's
        // 4 wires get 1 mΩ each, which moves a Pt100 at 1 mA by microvolts through the sense leads' input current.
        Assert.NotEmpty(FrontEndCheck.Run(Check.TestDesign.Make(("wiring.wires", "2"), ("wiring.lead_resistance", "\"0 ohm\"")), Options).Points);
        var four = FrontEndCheck.Run(CurrentDesigns.Pt100(("wiring.wires", "4"), ("wiring.lead_resistance", "\"0 ohm\"")), Options);
        Assert.All(four.Points, p => Assert.InRange(Math.Abs(p.Simulated.DcLoadingVolts), 0, 1e-6));
    }

    [NgspiceFact]
    public void A_divider_with_leads_agrees_with_ngspice_within_a_microvolt()
    {
        var design = Check.TestDesign.Make(("divider.sensor_side", "\"high\""), ("wiring.wires", "2"), ("wiring.lead_resistance", "\"15 ohm\""),
            ("divider.fixed_tempco", "\"+50 ppm/K\""));
        SweepCrossCheck.AssertAgrees(design, [FrontEndNodes.Divider, FrontEndNodes.SensorTop, FrontEndNodes.SensorBottom], "divider with leads");
    }
}
