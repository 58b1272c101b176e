using ThermVerify.Check;
using ThermVerify.Check.Remedies;
using ThermVerify.Components;
using ThermVerify.Design;
using ThermVerify.FrontEnd;

namespace ThermVerify.Tests.Check;

public class FrontEndCheckTests
{
    [Fact]
    public void Ideal_front_end_matches_the_closed_form_and_errs_by_quantisation_only()
    {
        // No leakage, no pin capacitance, the sampling capacitor keeps the last sample: nothing loads the divider; a
        // converter without noise of its own (the sampled kT/C, about 20 µV, stays far below ½ LSB).
        var result = FrontEndCheck.Run(TestDesign.Make(("adc.noise", "\"0 LSB\"")));
        foreach (var p in result.Points)
        {
            // Ohm's law: the unloaded divider. Simulation and closed form within 1 µV.
            Tolerance.AssertClose(p.IdealVolts, p.DcPinVolts, rel: 0, abs: 1e-6, what: $"DC pin at {p.Celsius} °C");
            Tolerance.AssertClose(p.IdealVolts, p.SteadySampleVolts, rel: 0, abs: 1e-6, what: $"sample at {p.Celsius} °C");
            // IEEE Std 1241: an ideal converter errs by at most ±Q/2; mapped to K with the local slope (+1 % for curvature).
            Assert.True(Math.Abs(p.ErrorKelvin) <= 0.505 * p.KelvinPerLsb, $"{p.ErrorKelvin} K at {p.Celsius} °C exceeds ½ LSB = {p.KelvinPerLsb / 2} K");
            Tolerance.AssertClose(p.ErrorKelvin, p.Contributions.QuantisationKelvin, rel: 0, abs: 1e-4, what: "quantisation share");
        }
        Assert.True(result.Passed);
        Assert.Empty(result.Findings);
    }

    [Fact]
    public void Leakage_error_is_current_times_thevenin_resistance()
    {
        // Ohm's law: a constant leakage I into the pin moves it by −I·R_th, R_th = R_sensor ∥ R_fixed.
        const double leakage = 200e-9;
        var design = TestDesign.Make(("adc.pin_leakage", "\"+200 nA\""), ("check.board_temperature", "\"25 degC\""));
        var result = FrontEndCheck.Run(design);
        foreach (var p in result.Points)
        {
            var thevenin = p.SensorOhms * 10e3 / (p.SensorOhms + 10e3);
            Tolerance.AssertClose(-leakage * thevenin, p.Simulated.DcLoadingVolts, rel: 1e-3, what: $"leakage error at {p.Celsius} °C");
        }
    }

    [Theory]
    [InlineData(2.0)]
    [InlineData(4.0)]
    public void Single_pole_acquisition_leaves_step_times_exp_minus_t_over_tau(double timeConstants)
    {
        // Discharged sampling capacitor, no pin capacitance, no reservoir: one pole, τ = (R_th + R_on)·C_sh.
        // Error after t: ΔV·e^(−t/τ) (first-order RC charging, elementary circuit theory).
        var probe = TestDesign.Make(("adc.precharge", "\"discharged\""));
        var model = new ClosedFormModel(probe);
        var point = model.At(25);
        var tau = (point.TheveninOhms + 1e3) * 10e-12;
        var acquisition = timeConstants * tau;
        var design = TestDesign.Make(("adc.precharge", "\"discharged\""), ("check.range", "\"20 degC .. 30 degC\""),
            ("adc.acquisition_time", $"\"{acquisition * 1e9:R} ns\""));
        var p = FrontEndCheck.Run(design).Points.Single(q => q.Celsius == 25);
        var expected = (0 - point.IdealVolts) * Math.Exp(-acquisition / tau);
        Tolerance.AssertClose(expected, p.Simulated.FirstSettlingVolts, rel: 5e-3, what: "first-conversion error");
    }

    [Fact]
    public void Reservoir_takes_the_kick_of_a_discharged_sampling_capacitor()
    {
        // Charge conservation: a discharged C_sh meeting a reservoir at V moves it by −V·C_sh/(C_sh + C_ext).
        var design = TestDesign.Make(("adc.precharge", "\"discharged\""), ("filter.reservoir_capacitor", "\"10 nF\""),
            ("check.range", "\"20 degC .. 30 degC\""), ("adc.sample_rate", "\"20 kHz\""),
            // A short acquisition (the source barely refills the reservoir) through a fast switch (the sampling
            // capacitor settles fully onto the pin): the kick alone.
            ("adc.acquisition_time", "\"100 ns\""), ("adc.switch_resistance", "\"100 ohm\""));
        var p = FrontEndCheck.Run(design).Points.Single(q => q.Celsius == 25);
        Tolerance.AssertClose(-p.IdealVolts * 10e-12 / (10e-12 + 10e-9), p.FirstSampleVolts - p.StaticPinVolts, rel: 0.01, what: "kick");
    }

    [Fact]
    public void Reservoir_steady_deficit_follows_the_switched_capacitor_resistance()
    {
        // Johns & Martin: a capacitor switched at f_s draws like R_eq = 1/(f_s·C_sh); the source R_s refilling the
        // reservoir then leaves a steady deficit V·R_s/(R_s + R_eq). The reservoir is large, so the kick (which puts
        // the sample a further ~½·V·C_sh/C_ext below the reservoir's mean) is negligible beside it.
        var design = TestDesign.Make(("adc.precharge", "\"discharged\""), ("filter.reservoir_capacitor", "\"1 uF\""),
            ("check.range", "\"20 degC .. 30 degC\""), ("adc.sample_rate", "\"20 kHz\""),
            ("adc.acquisition_time", "\"100 ns\""), ("adc.switch_resistance", "\"100 ohm\""));
        var p = FrontEndCheck.Run(design).Points.Single(q => q.Celsius == 25);
        var source = p.SensorOhms * 10e3 / (p.SensorOhms + 10e3);
        var equivalent = 1 / (20e3 * 10e-12);
        Tolerance.AssertClose(-p.IdealVolts * source / (source + equivalent), p.SteadySampleVolts - p.IdealVolts, rel: 0.05, what: "steady deficit");
    }

    [Fact]
    public void Shortest_acquisition_time_remedy_round_trips()
    {
        var design = TestDesign.Make(("adc.precharge", "\"discharged\""), ("adc.acquisition_time", "\"100 ns\""),
            ("check.range", "\"20 degC .. 30 degC\""));
        var remedy = RemedyFor(design, "settling", "adc.acquisition_time");
        var halfLsb = 3.3 / 4096 / 2;
        // The proof: the check of the design with the remedy applied has no settling finding.
        Assert.DoesNotContain(FrontEndCheck.Run(Knobs.AcquisitionTime.Apply(design, remedy), new CheckOptions { ComputeRemedies = false }).Findings,
            f => f.Id == "settling");
        // The shortest: 90 % of it leaves more than ½ LSB at the worst point.
        var worst = FrontEndCheck.Run(design, new CheckOptions { ComputeRemedies = false }).Points.MaxBy(p => Math.Abs(p.Simulated.FirstSettlingVolts))!;
        var shorter = SettlingError.Volts(Knobs.AcquisitionTime.Apply(design, 0.9 * remedy), worst.Celsius, worst.PrechargeVolts, 1e-7);
        Assert.True(shorter > halfLsb, $"90 % of the remedy also settles ({shorter} V): not the shortest");
        // Common practice: ½ LSB of 12 bits needs (N+1)·ln2 = 9.01 time constants for a full-scale step; our step is
        // the pin voltage, so the remedy sits just below that.
        var tau = (worst.Estimates.SourceOhms + 1e3) * 10e-12;
        Assert.InRange(remedy / tau, 7.0, 9.02);
    }

    [Fact]
    public void Smallest_reservoir_remedy_round_trips()
    {
        var design = TestDesign.Make(("adc.precharge", "\"discharged\""), ("adc.acquisition_time", "\"100 ns\""),
            ("check.range", "\"20 degC .. 30 degC\""));
        var remedy = RemedyFor(design, "settling", "filter.reservoir_capacitor");
        // The proof, and the E12 value below it (IEC 60063) does not clear the finding.
        Assert.True(ESeries.E12.Contains(remedy));
        Assert.DoesNotContain(FrontEndCheck.Run(Knobs.Reservoir.Apply(design, remedy), new CheckOptions { ComputeRemedies = false }).Findings,
            f => f.Id == "settling");
        // The search is on the first conversion's step at the worst point: with the E12 value below, it exceeds ½ LSB.
        var worst = FrontEndCheck.Run(design, new CheckOptions { ComputeRemedies = false }).Points.MaxBy(p => Math.Abs(p.Simulated.FirstSettlingVolts))!;
        var probe = new FindingProbe("settling", worst.Celsius, worst.Precharge, first: true, new CheckOptions());
        var below = ESeries.E12.NextLower(remedy);
        Assert.True(probe.Measure(Knobs.Reservoir.Apply(design, below)) > 3.3 / 4096 / 2, $"{below} F also keeps the step within ½ LSB");
    }

    [Fact]
    public void Reservoir_rule_of_thumb_for_12_bits_and_10_pF()
    {
        // Common practice, no source: C_ext ≥ (2^(N+1) − 1)·C_sh keeps a full-scale kick under ½ LSB: 81.9 nF → 82 nF (E12).
        var closedForm = SamplingFormulas.MinimumReservoirFarads(3.3, 3.3 / 4096 / 2, 10e-12);
        Tolerance.AssertClose(8191 * 10e-12, closedForm, rel: 1e-12);
        Assert.Equal(82e-9, ThermVerify.Components.ESeries.E12.NextHigher(closedForm), 12);

        // The simulated search for a pin near full scale and a discharged capacitor agrees with the rule for that step.
        // A short acquisition through a fast switch, so the reservoir alone must hold the pin.
        var design = TestDesign.Make(("adc.precharge", "\"discharged\""), ("divider.sensor_side", "\"high\""),
            ("divider.fixed_resistor", "\"1 Mohm\""), ("check.range", "\"20 degC .. 30 degC\""),
            ("adc.acquisition_time", "\"100 ns\""), ("adc.switch_resistance", "\"100 ohm\""));
        var worst = FrontEndCheck.Run(design, new CheckOptions { ComputeRemedies = false }).Points.Single(p => p.Celsius == 25);
        var probe = new FindingProbe("settling", 25, worst.Precharge, worst.FirstConversion, new CheckOptions());
        var found = KnobSearch.Find(Knobs.Reservoir, design, d => probe.Measure(d) <= 3.3 / 4096 / 2)!.Value;
        var rule = SamplingFormulas.MinimumReservoirFarads(worst.StaticPinVolts, 3.3 / 4096 / 2, 10e-12);
        Tolerance.AssertClose(rule, found, rel: 0.01, what: "simulated smallest reservoir against the charge-sharing rule");
    }

    private static double RemedyFor(ThermVerify.Design.FrontEndDesign design, string finding, string key) =>
        FrontEndCheck.Run(design).Findings.Single(f => f.Id == finding).Remedies.First(r => r.Key == key).Value!.Value;
}
