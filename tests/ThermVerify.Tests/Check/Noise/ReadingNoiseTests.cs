using ThermVerify.Check;
using ThermVerify.Check.Noise;
using ThermVerify.FrontEnd;

namespace ThermVerify.Tests.Check.Noise;

public class ReadingNoiseTests
{
    // Boltzmann constant, exact since the 2019 SI redefinition (CODATA 2018; SI Brochure, 9th ed.), written here rather
    // than taken from the library.
    private const double K = 1.380649e-23;

    private static ReadingNoise At(ThermVerify.Design.FrontEndDesign design, double celsius) =>
        ReadingNoiseAnalysis.At(design, new ClosedFormModel(design), celsius, BuiltInEngine.Instance);

    [Theory]
    [InlineData("1 kohm", "0 ohm", "0 F")]
    [InlineData("100 kohm", "0 ohm", "0 F")]
    [InlineData("10 Mohm", "0 ohm", "0 F")]
    [InlineData("10 kohm", "47 kohm", "0 F")]
    [InlineData("10 kohm", "10 kohm", "100 nF")]
    public void A_resistor_network_into_the_sampling_capacitor_leaves_kT_over_C_whatever_the_resistance(string fixedOhms, string seriesOhms, string reservoir)
    {
        // Equipartition: a capacitor in a network of resistors at one temperature holds ½·C·v² = ½·kT on average, so the
        // sampled noise is √(kT/C_sh) whatever the resistances and the other capacitors (kT/C; any noise textbook).
        var design = TestDesign.Make(("divider.fixed_resistor", $"\"{fixedOhms}\""), ("sensor.r25", $"\"{fixedOhms}\""),
            ("filter.series_resistor", $"\"{seriesOhms}\""), ("filter.reservoir_capacitor", $"\"{reservoir}\""), ("adc.noise", "\"0 LSB\""));
        const double celsius = 40;
        var n = At(design, celsius);
        var expected = Math.Sqrt(K * (celsius + 273.15) / 10e-12);
        Tolerance.AssertClose(expected, n.AnalogRmsVolts, 0.005, 0, $"sampled noise with R_fixed {fixedOhms}, R_series {seriesOhms}, C_res {reservoir}");
        Tolerance.AssertClose(expected, n.KtcRmsVolts, 1e-12, 0, "kT/C closed form");
        Assert.Equal(0, n.ConverterRmsVolts);
    }

    [Fact]
    public void Resistors_on_the_board_take_the_board_temperature_and_the_sensor_its_own()
    {
        // Board at 85 °C, sensor at -20 °C: the switch's own kT/C (no reservoir) is then at the board's temperature, and
        // the total lies between kT/C at the two temperatures (Johnson–Nyquist, 4kTR at each resistor's own T).
        var design = TestDesign.Make(("check.board_temperature", "\"85 degC\""), ("adc.noise", "\"0 LSB\""));
        var n = At(design, -20);
        Tolerance.AssertClose(Math.Sqrt(K * (85 + 273.15) / 10e-12), n.KtcRmsVolts, 1e-12);
        Assert.InRange(n.AnalogRmsVolts, Math.Sqrt(K * (-20 + 273.15) / 10e-12), Math.Sqrt(K * (85 + 273.15) / 10e-12));
    }

    [Theory]
    [InlineData(1)]
    [InlineData(4)]
    [InlineData(16)]
    [InlineData(64)]
    public void N_averaged_independent_readings_fall_by_root_N(int n)
    {
        // No reservoir and no pin capacitance: nothing carries noise from one conversion to the next (ρ = 0), so the mean
        // of N has σ/√N (variance of a mean of independent samples, elementary statistics).
        var single = At(TestDesign.Make(("adc.noise", "\"1 LSB\"")), 25);
        var averaged = At(TestDesign.Make(("adc.noise", "\"1 LSB\""), ("noise.readings_averaged", n.ToString(System.Globalization.CultureInfo.InvariantCulture))), 25);
        Assert.Equal(0, averaged.Correlation);
        Tolerance.AssertClose(single.AveragedRmsVolts / Math.Sqrt(n), averaged.AveragedRmsVolts, 1e-12);
        Tolerance.AssertClose(3 * averaged.AveragedRmsVolts, averaged.CoveredVolts, 1e-12, 0, "±3σ by default");
    }

    [Fact]
    public void A_filter_slower_than_the_readings_keeps_its_noise_however_many_are_averaged()
    {
        // 1 MΩ into 1 µF (τ = 1 s) read at 10 kHz: neighbours correlate as e^(−T_s/τ) ≈ 0.9999, so the filter's share of
        // the mean of 16 stays at its single-conversion value (AR(1) variance of a mean, from memory), while kT/C of the
        // switch and the converter's noise fall as 1/√16.
        var design = TestDesign.Make(("filter.series_resistor", "\"1 Mohm\""), ("filter.reservoir_capacitor", "\"1 uF\""), ("adc.noise", "\"1 LSB\""),
            ("noise.readings_averaged", "16"));
        var p = At(design, 25);
        Assert.InRange(p.Correlation, 0.9998, 1);
        var expected = Math.Sqrt((p.FastRmsVolts * p.FastRmsVolts + p.ConverterRmsVolts * p.ConverterRmsVolts) / 16 + p.SlowRmsVolts * p.SlowRmsVolts);
        Tolerance.AssertClose(expected, p.AveragedRmsVolts, 1e-4);
        Tolerance.AssertClose(1.0 / 16, ReadingNoiseAnalysis.CorrelatedFactor(16, 0), 1e-15);
        Tolerance.AssertClose(1.0, ReadingNoiseAnalysis.CorrelatedFactor(16, 1), 1e-15);
    }

    [Fact]
    public void The_ramp_lag_is_the_age_of_the_mean_plus_the_filters_time_constant()
    {
        // A mean of N samples T_s apart is (N − 1)·T_s/2 old; a first-order filter follows a ramp τ behind (its steady
        // ramp response, any control textbook). 10 kΩ ∥ 10 kΩ at 25 °C plus 10 kΩ, into 100 nF: τ = 15 kΩ·100 nF.
        var design = TestDesign.Make(("filter.series_resistor", "\"10 kohm\""), ("filter.reservoir_capacitor", "\"100 nF\""),
            ("noise.readings_averaged", "9"), ("noise.ramp_rate", "\"0.5 K/s\""));
        var p = At(design, 25);
        var lag = (9 - 1) / 2.0 / 10e3 + 15e3 * 100e-9;
        Tolerance.AssertClose(0.5 * lag, p.RampLagKelvin, 1e-9);
    }

    [Fact]
    public void Noise_can_fail_the_budget_and_the_proven_remedy_averages_it_away()
    {
        // A converter with 3 LSB rms of noise read one conversion at a time: ±9 LSB at ±3σ is more than the 0.5 K budget
        // at the cold end, where one LSB is largest in K. The remedy is more averaging, proven by a check with it applied.
        var design = TestDesign.Make(("adc.noise", "\"3 LSB\""), ("check.step", "\"20 K\""));
        var result = FrontEndCheck.Run(design, new CheckOptions { MaximumSamplingPoints = 2 });
        Assert.False(result.Passed);
        var noise = Assert.Single(result.Findings, f => f.Id == NoiseFindingRules.NoiseId);
        Assert.Equal(Severity.Fail, noise.Severity);
        var remedy = Assert.Single(noise.Remedies, r => r.Key == "noise.readings_averaged");
        Assert.Contains("PASS", remedy.Proof);
        // The proof, made again here: the design with that many conversions averaged passes, one fewer still has the finding.
        var fixedDesign = design with { Noise = design.Noise with { ReadingsAveraged = (int)remedy.Value!.Value } };
        var again = FrontEndCheck.Run(fixedDesign, new CheckOptions { MaximumSamplingPoints = 2, ComputeRemedies = false });
        Assert.DoesNotContain(again.Findings, f => f.Id == NoiseFindingRules.NoiseId);
        var fewer = design with { Noise = design.Noise with { ReadingsAveraged = (int)remedy.Value!.Value - 1 } };
        Assert.Contains(FrontEndCheck.Run(fewer, new CheckOptions { MaximumSamplingPoints = 2, ComputeRemedies = false }).Findings,
            f => f.Id == NoiseFindingRules.NoiseId);
    }

    [Fact]
    public void Noise_counts_in_the_budget_beside_the_static_error()
    {
        // The same design, the budget just above the static error: the noise at ±3σ pushes the points over it.
        var quiet = FrontEndCheck.Run(TestDesign.Make(("adc.noise", "\"0 LSB\""), ("check.step", "\"20 K\"")), new CheckOptions { ComputeRemedies = false, MaximumSamplingPoints = 2 });
        var worst = quiet.Points.Max(p => Math.Abs(p.ErrorKelvin));
        var budget = (worst * 1.01).ToString("R", System.Globalization.CultureInfo.InvariantCulture);
        var noisy = FrontEndCheck.Run(TestDesign.Make(("adc.noise", "\"2 LSB\""), ("check.step", "\"20 K\""), ("check.budget", $"\"{budget} K\"")),
            new CheckOptions { ComputeRemedies = false, MaximumSamplingPoints = 2 });
        Assert.All(noisy.Points, p => Assert.Equal(Math.Abs(p.ErrorKelvin) + p.NoiseKelvin <= p.BudgetKelvin, p.WithinBudget));
        Assert.Contains(noisy.Points, p => !p.WithinBudget && Math.Abs(p.ErrorKelvin) <= p.BudgetKelvin);
        Assert.Contains(noisy.Findings, f => f.Id == FindingRules.OverBudgetId && f.Cause.Contains("noise adds"));
    }
}
