using ThermVerify.Check;
using ThermVerify.Design;
using ThermVerify.FrontEnd;
using ThermVerify.Ngspice;
using ThermVerify.Tests.Ngspice;
using ThermVerify.Tolerances;

namespace ThermVerify.Tests.FrontEnd;

/// <summary>
/// A bridge read by a converter with two sampled inputs. References: the quarter-bridge equation V/E = x/(4 + 2x)
/// (bridge-circuit texts, from memory) for the signed code 2^N·V_d/E, and the charging of a capacitor through a
/// resistance, v(t) = V·(1 − e^(−t/RC)) from 0 V (any circuits textbook, from memory), for each input's first sample
/// after a discharge, its source being the half's Thevenin resistance (R_a ∥ R_b) plus the switch.
/// </summary>
public class DifferentialInputTests
{
    private static readonly CheckOptions Options = new() { ComputeRemedies = false, MaximumSamplingPoints = 3 };

    /// <summary>The bridge of <see cref="BridgeDesigns"/> on −50 °C .. 100 °C (balanced at 0 °C), read differentially.</summary>
    private static FrontEndDesign Differential(params (string, string?)[] more) =>
        BridgeDesigns.Pt1000([("adc.input", "\"differential\""), ("check.range", "\"-50 degC .. 100 degC\""), .. more]);

    [Fact]
    public void Keys_are_read_written_back_and_refused_with_their_position()
    {
        var design = Differential(("adc.negative_sampling_capacitance", "\"4 pF\""), ("adc.negative_pin_leakage", "\"-2 nA\""),
            ("adc.common_mode_range", "\"0.2 V .. 3 V\""), ("adc.negative_precharge_voltage", "\"1.65 V\""));
        Assert.Equal(AdcInput.Differential, design.Adc.Input);
        // The switch resistance and pin capacitance default to the positive input's.
        Assert.Equal(new NegativeInputSpec { SamplingCapacitanceFarads = 4e-12, SwitchResistanceOhms = 1000, PinLeakageAmperes = -2e-9, PinLeakageSigned = true, PrechargeVolts = 1.65 },
            design.Adc.NegativeInput);
        Assert.Equal(new VoltageRange(0.2, 3), design.Adc.CommonModeRange);
        var again = DesignLoader.Parse(DesignWriter.ToToml(design), "normal.toml", Path.GetTempPath());
        Assert.Equal(design.Adc, again.Adc);

        void Refused(string key, string text, Func<FrontEndDesign> make)
        {
            var e = Assert.Throws<DesignException>(make);
            Assert.Equal(key, e.KeyPath);
            Assert.True(e.Line > 1, $"{key}: a line of the file ({e.Line})");
            Assert.Contains(text, e.Message);
        }
        Refused("adc.input", "\"diff\"", () => Differential(("adc.input", "\"diff\"")));
        Refused("adc.negative_sampling_capacitance", "applies only to a differential or pseudo-differential input",
            () => BridgeDesigns.Pt1000(("adc.negative_sampling_capacitance", "\"4 pF\"")));
        Refused("adc.common_mode_range", "applies only to a differential", () => BridgeDesigns.Pt1000(("adc.common_mode_range", "\"0 V .. 3 V\"")));
        Refused("adc.common_mode_range", "", () => Differential(("adc.common_mode_range", "\"3 V .. 1 V\"")));
        Refused("adc.negative_switch_resistance", "", () => Differential(("adc.negative_switch_resistance", "\"1 uF\"")));
        Refused("adc.input", "this design has no bridge", () => Check.TestDesign.Make(("adc.input", "\"pseudo-differential\"")));
    }

    [Fact]
    public void Codes_are_signed_and_follow_the_quarter_bridge_equation()
    {
        var result = FrontEndCheck.Run(Differential(), Options);
        Assert.Contains(result.Points, p => p.Code < 0);
        foreach (var p in result.Points)
        {
            var x = CurrentDesigns.Ohms(p.Celsius, 1000) / 1000 - 1;
            Assert.Equal((int)Math.Round(65536 * x / (4 + 2 * x)), p.Code);
        }
        Assert.True(result.Passed);
        // The same bridge on a pseudo-differential (unsigned) converter cannot read below balance: the bottom code.
        var unsigned = FrontEndCheck.Run(Differential(("adc.input", "\"pseudo-differential\"")), Options);
        Assert.All(unsigned.Points.Where(p => p.Celsius < 0), p => Assert.Equal(0, p.Code));
        Assert.False(unsigned.Passed);
    }

    [Fact]
    public void Each_input_charges_its_own_capacitor_from_zero()
    {
        // Discharged before each acquisition, no reservoir: each input charges through R_th + R_on for t_acq.
        // Positive: R_s ∥ 1 kΩ + 20 kΩ onto 10 pF; negative: 500 Ω + 5 kΩ onto 40 pF. 0.5 µs leaves each visibly short.
        var design = Differential(("adc.precharge", "\"discharged\""), ("adc.acquisition_time", "\"0.5 us\""), ("adc.switch_resistance", "\"20 kohm\""),
            ("adc.negative_switch_resistance", "\"5 kohm\""), ("adc.negative_sampling_capacitance", "\"40 pF\""));
        foreach (var celsius in new[] { -50.0, 25, 100 })
        {
            var rs = CurrentDesigns.Ohms(celsius, 1000);
            var positive = 2.5 * rs / (rs + 1000);
            const double negative = 1.25;
            var tauPositive = (rs * 1000 / (rs + 1000) + 20e3) * 10e-12;
            var tauNegative = (500 + 5e3) * 40e-12;
            var expected = positive * (1 - Math.Exp(-0.5e-6 / tauPositive)) - negative * (1 - Math.Exp(-0.5e-6 / tauNegative));
            var sample = SamplingRun.FirstSampleVolts(design, celsius, 0, 1e-7);
            Tolerance.AssertClose(expected, sample, 0, 0.01 * 2.5 / 65536, $"first differential sample at {celsius} °C");
            // The negative capacitor held at its own 2 V instead: it falls from there towards V−, v = V− + (2 V − V−)·e^(−t/RC).
            var own = SamplingRun.FirstSampleVolts(design with { Adc = design.Adc with { NegativeInput = design.Adc.NegativeInput! with { PrechargeVolts = 2 } } },
                celsius, 0, 1e-7);
            var fromTwo = positive * (1 - Math.Exp(-0.5e-6 / tauPositive)) - (negative + (2 - negative) * Math.Exp(-0.5e-6 / tauNegative));
            Tolerance.AssertClose(fromTwo, own, 0, 0.01 * 2.5 / 65536, $"first differential sample at {celsius} °C, negative precharged to 2 V");
        }
    }

    [Fact]
    public void The_common_mode_leaving_the_range_fails_with_its_closed_form()
    {
        // The outputs sit near 1.25 V; a range of 1.3 V .. 3 V leaves them below it at every temperature up to where
        // (V+ + 1.25 V)/2 reaches 1.3 V, i.e. V+ = 1.35 V, R_s = 1174 Ω (about 45 °C).
        var result = FrontEndCheck.Run(Differential(("adc.common_mode_range", "\"1.3 V .. 3 V\"")), Options);
        Assert.False(result.Passed);
        var finding = Assert.Single(result.Findings, f => f.Id == CommonModeRule.Id);
        Assert.Equal(Severity.Fail, finding.Severity);
        Assert.Equal(-50, finding.FromCelsius);
        Assert.Equal(-50, finding.WorstCelsius);
        var rs = CurrentDesigns.Ohms(-50, 1000);
        var closedForm = (2.5 * rs / (rs + 1000) + 1.25) / 2;
        Tolerance.AssertClose(closedForm, finding.EstimateVolts!.Value, 1e-12, 0, "closed form (V+ + V−)/2");
        Tolerance.AssertClose(closedForm, finding.SimulatedVolts!.Value, 1e-9, 1e-12, "simulated beside it");
        Assert.Contains("closed form", finding.Cause);
        Assert.DoesNotContain(FrontEndCheck.Run(Differential(("adc.common_mode_range", "\"0.5 V .. 3 V\"")), Options).Findings, f => f.Id == CommonModeRule.Id);
    }

    [Fact]
    public void Both_sampling_capacitors_keep_their_kT_over_C()
    {
        // Every resistor at one temperature (the board's 25 °C, the point checked), no pin capacitance: each capacitor
        // keeps kT/C of whatever resistive network charges it (the equipartition result for a capacitor in thermal
        // equilibrium, from memory), and the two networks are independent, so v(hold) − v(holdn) carries kT/C₊ + kT/C₋.
        var design = Differential(("adc.sampling_capacitance", "\"10 pF\""), ("adc.negative_sampling_capacitance", "\"4 pF\""),
            ("check.board_temperature", "\"25 degC\""), ("check.range", "\"0 degC .. 50 degC\""));
        var result = FrontEndCheck.Run(design, Options);
        var noise = Assert.Single(result.Points, p => p.Celsius == 25).Noise!;
        var kT = 1.380649e-23 * 298.15;
        var expected = Math.Sqrt(kT / 10e-12 + kT / 4e-12);
        Tolerance.AssertClose(expected, noise.KtcRmsVolts, 1e-9, 0, "closed form printed beside the analysis");
        // 0.5 %, as for one input (ReadingNoiseTests): the band ends at 1000× the fastest pole.
        Tolerance.AssertClose(expected, noise.AnalogRmsVolts, 0.005, 0, "the noise analysis at v(hold) − v(holdn)");
    }

    [Fact]
    public void Monte_carlo_units_read_on_both_sides_of_the_balance()
    {
        // The opposite low arm spread by 1 %: a unit's V− is E·(1 + δ)/(2 + δ), ΔV− = E·δ/(2·(2 + δ)) (the divider formula),
        // read with the opposite sign. The firmware takes V+ = V_d + E/2, R_s = R_f·V+/(E − V+), and the temperature from
        // the inverse of the IEC 60751 equation above 0 °C, t = (−A + √(A² − 4B(1 − R/R0)))/(2B): exact at 100 °C, where
        // the slope is smallest and so the error in kelvin largest.
        var result = MonteCarlo.Run(Differential(("bridge.opposite_low_tolerance", "\"1 %\"")), new MonteCarloOptions { Units = 40, Seed = 5, Threads = 1 });
        var index = result.Parameters.ToList().FindIndex(p => p.Kind == ToleranceKind.BridgeLowResistance);
        var rs = CurrentDesigns.Ohms(100, 1000);
        var slope = 2.5 * 1000 / ((rs + 1000) * (rs + 1000)) * CurrentDesigns.OhmsPerKelvin(100, 1000);
        var lsbKelvin = 2.5 / 65536 / slope;
        const double a = 3.9083e-3, b = -5.775e-7;
        var checkedUnits = 0;
        for (var u = 0; u < result.Units; u++)
        {
            Assert.True(double.IsFinite(result.WorstErrorKelvin[u]), $"unit {u} reads every temperature");
            var deviation = result.Deviations[u][index];
            if (Math.Abs(deviation) < 3e-3) continue;
            checkedUnits++;
            var positive = 2.5 * rs / (rs + 1000) - 2.5 * deviation / (2 * (2 + deviation));
            var read = 1000 * positive / (2.5 - positive);
            var reported = (-a + Math.Sqrt(a * a - 4 * b * (1 - read / 1000))) / (2 * b);
            Assert.Equal(100, result.WorstCelsius[u]);
            Tolerance.AssertClose(reported - 100, result.WorstErrorKelvin[u], 0, 0.5 * lsbKelvin, $"unit {u}, δ = {deviation:G3}");
        }
        Assert.True(checkedUnits > 10, $"{checkedUnits} units with a deviation above 0.3 %");
    }

    /// <summary>ngspice, the trade's reference engine, on both inputs' sampling transient: every conversion within 0.01 LSB.</summary>
    [NgspiceFact]
    public void Samples_agree_with_ngspice_within_a_hundredth_of_an_lsb()
    {
        var design = Differential(("adc.precharge", "\"other-channel\""), ("adc.precharge_voltage", "\"2 V\""), ("adc.switch_resistance", "\"5 kohm\""),
            ("adc.negative_sampling_capacitance", "\"25 pF\""), ("adc.pin_leakage", "\"3 nA\""), ("adc.negative_pin_leakage", "\"-1 nA\""),
            ("filter.series_resistor", "\"2 kohm\""), ("filter.reservoir_capacitor", "\"1 nF\""), ("adc.sample_rate", "\"20 kHz\""));
        var lsb = 2.5 / 65536;
        var worst = 0.0;
        foreach (var celsius in new[] { -50.0, 100 })
        {
            var ours = SamplingRun.Run(design, celsius, 2, 1e-3 * lsb, maximumConversions: 40, engine: BuiltInEngine.Instance);
            var theirs = SamplingRun.Run(design, celsius, 2, 1e-3 * lsb, maximumConversions: 40, engine: new NgspiceEngine());
            var n = Math.Min(ours.SampledVolts.Count, theirs.SampledVolts.Count);
            for (var k = 0; k < n; k++)
            {
                worst = Math.Max(worst, Math.Abs(ours.SampledVolts[k] - theirs.SampledVolts[k]) / lsb);
                Tolerance.AssertClose(theirs.SampledVolts[k], ours.SampledVolts[k], 0, 0.01 * lsb, $"conversion {k} at {celsius} °C");
            }
            Tolerance.AssertClose(theirs.SteadyVolts, ours.SteadyVolts, 0, 0.01 * lsb, $"steady sample at {celsius} °C");
        }
        Console.WriteLine($"differential samples: largest difference from ngspice {worst:G3} LSB");
    }
}
