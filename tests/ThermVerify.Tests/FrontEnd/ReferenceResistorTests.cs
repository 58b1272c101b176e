using ThermVerify.Check;
using ThermVerify.FrontEnd;
using ThermVerify.Ngspice;
using ThermVerify.Sensors;
using ThermVerify.Tests.Ngspice;
using ThermVerify.Tolerances;

namespace ThermVerify.Tests.FrontEnd;

/// <summary>
/// The ratiometric reference resistor: the current flows through R_ref and the sensor, the converter's reference is
/// I·R_ref, so the code is 2^N·R_s/R_ref and the current cancels (Ohm's law twice; common practice for RTDs). Its
/// tolerance and tempco count, and so does the reference input across it (the code then reads R_s/(R_ref ∥ R_in)).
/// </summary>
public class ReferenceResistorTests
{
    private static readonly CheckOptions Options = new() { ComputeRemedies = false, MaximumSamplingPoints = 3 };

    [Fact]
    public void Code_is_the_resistance_ratio()
    {
        // code = round(2^16·R_s/R_ref) with R_s from IEC 60751 by hand, R_ref = 2 kΩ; the current is 7 % off and does not show.
        var result = FrontEndCheck.Run(CurrentDesigns.Ratiometric(("current_source.current", "\"1.07 mA\"")), Options);
        foreach (var p in result.Points)
            Assert.Equal((int)Math.Round(65536 * CurrentDesigns.Ohms(p.Celsius) / 2000), p.Code);
        Assert.True(result.Passed);
    }

    [Fact]
    public void A_ten_percent_current_error_moves_the_reading_less_than_the_reference_resistors_tolerance()
    {
        // The test: ±10 % on the current against ±0.1 % on R_ref. A 2 nA pin leakage (with the board at 35 °C;
        // it does not scale with the current) keeps the current from cancelling exactly; it must still move the reading
        // less than R_ref alone.
        var result = WorstCase.Run(CurrentDesigns.Ratiometric(("current_source.current_tolerance", "\"10 %\""),
            ("current_source.reference_resistor_tolerance", "\"0.1 %\""), ("adc.pin_leakage", "\"+2 nA\""), ("check.board_temperature", "\"35 degC\"")),
            new WorstCaseOptions { Threads = 1 });
        var current = Assert.Single(result.Sensitivities, s => s.Parameter.Kind == ToleranceKind.Current);
        var resistor = Assert.Single(result.Sensitivities, s => s.Parameter.Kind == ToleranceKind.ReferenceResistance);
        for (var k = 0; k < result.Points.Count; k++)
        {
            var t = result.Points[k].Celsius;
            var byCurrent = Math.Abs(current.KelvinPerUnit[k] * 0.1);
            var byResistor = Math.Abs(resistor.KelvinPerUnit[k] * 0.001);
            Assert.True(byCurrent > 0, $"at {t} °C the leakage should leave the current a trace");
            Assert.True(byCurrent < byResistor, $"at {t} °C the current's ±10 % moves {byCurrent:G3} K, R_ref's ±0.1 % {byResistor:G3} K");
            // R_ref off by δ reads R_s/(1 + δ): dT/dδ = −R_s/(dR_s/dt) (IEC 60751 derivative by hand; ±0.1 % central differences).
            Tolerance.AssertClose(-CurrentDesigns.Ohms(t) / CurrentDesigns.OhmsPerKelvin(t), resistor.KelvinPerUnit[k], 1e-3, 1e-9, $"dT/dδ at {t} °C");
        }
    }

    [Fact]
    public void Monte_carlo_of_the_current_alone_spreads_nothing()
    {
        // Without leakage the current cancels exactly in R_s/R_ref: every unit reads as the nominal one.
        var result = MonteCarlo.Run(CurrentDesigns.Ratiometric(("current_source.current_tolerance", "\"10 %\"")),
            new MonteCarloOptions { Units = 50, Seed = 3, Threads = 1, SimulateSettling = false });
        Assert.All(result.Envelope, p => Assert.True(p.StandardDeviationKelvin < 1e-9, $"σ {p.StandardDeviationKelvin} K at {p.Celsius} °C"));
    }

    [Fact]
    public void Reference_input_loading_reads_the_parallel_resistance()
    {
        // A 1 MΩ reference input across R_ref: the code reads R_s/(R_ref ∥ R_in), on the nominal reference's scale a pin
        // I·R_s·R_ref/R_in high (Ohm's law, exact).
        var result = FrontEndCheck.Run(CurrentDesigns.Ratiometric(("current_source.reference_input_resistance", "\"1 Mohm\"")), Options);
        foreach (var p in result.Points)
        {
            var expected = 1e-3 * CurrentDesigns.Ohms(p.Celsius) * 2000 / 1e6;
            Tolerance.AssertClose(expected, p.Simulated.DcLoadingVolts, 1e-6, 1e-12, $"simulated at {p.Celsius} °C");
            Tolerance.AssertClose(expected, p.Estimates.LoadingVolts, 1e-6, 1e-12, $"closed form at {p.Celsius} °C");
        }
    }

    [Fact]
    public void Reference_resistor_tempco_at_the_board_reads_the_drifted_ratio()
    {
        // +25 ppm/K at 65 °C: R_ref is 0.1 % high and the reading R_s/1.001: the pin on the nominal scale is I·R_s·(1/1.001 − 1).
        var result = FrontEndCheck.Run(CurrentDesigns.Ratiometric(("current_source.reference_resistor_tempco", "\"+25 ppm/K\""),
            ("check.board_temperature", "\"65 degC\"")), Options);
        foreach (var p in result.Points)
        {
            var expected = 1e-3 * CurrentDesigns.Ohms(p.Celsius) * (1 / 1.001 - 1);
            Tolerance.AssertClose(expected, p.Simulated.DcLoadingVolts, 1e-6, 1e-12, $"simulated at {p.Celsius} °C");
            Tolerance.AssertClose(expected, p.Estimates.ExcitationVolts, 1e-6, 1e-12, $"closed form at {p.Celsius} °C");
        }
    }

    [Fact]
    public void Reference_resistor_tempco_as_a_bound_takes_the_worse_sign()
    {
        // 25 ppm/K without a sign: at the board's 65 °C the corner that reads worse has R_ref 0.1 % low or high; the DC
        // error's size is I·R_s·|1/(1 ± 0.001) − 1| at the corner chosen.
        var result = FrontEndCheck.Run(CurrentDesigns.Ratiometric(("current_source.reference_resistor_tempco", "\"25 ppm/K\""),
            ("check.board_temperature", "\"65 degC\"")), Options);
        foreach (var p in result.Points)
        {
            var r = 1e-3 * CurrentDesigns.Ohms(p.Celsius);
            var expected = p.Corner == "bounds up" ? r * (1 / 0.999 - 1) : r * (1 / 1.001 - 1);
            Tolerance.AssertClose(expected, p.Simulated.DcLoadingVolts, 1e-6, 1e-12, $"{p.Corner} at {p.Celsius} °C");
        }
    }

    /// <summary>ngspice, the trade's reference engine, on the circuit the check sweeps: the current source's tempco stage, R_ref and its input.</summary>
    [NgspiceFact]
    public void Sweep_agrees_with_ngspice_within_a_microvolt()
    {
        var design = CurrentDesigns.Ratiometric(("current_source.current_tempco", "\"-30 ppm/K\""), ("current_source.output_resistance", "\"2 Mohm\""),
            ("current_source.reference_resistor_tempco", "\"+10 ppm/K\""), ("current_source.reference_input_resistance", "\"5 Mohm\""),
            ("adc.pin_leakage", "\"1 nA\""), ("filter.series_resistor", "\"1 kohm\""));
        SweepCrossCheck.AssertAgrees(design, [FrontEndNodes.Excitation, FrontEndNodes.Divider, FrontEndCircuit.PinNode(design)]);
        // The deck writer's own deck runs in ngspice and prints the same pin voltage.
        var deck = FrontEndDecks.Write(design, DeckAnalysis.Dc);
        Assert.Contains("Iexc", deck);
        Assert.Contains("Rref", deck);
    }
}
