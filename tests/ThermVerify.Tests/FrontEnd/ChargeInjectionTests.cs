using ThermVerify.Check;
using ThermVerify.Design;
using ThermVerify.Ngspice;
using ThermVerify.Tests.Check;
using ThermVerify.Tests.Ngspice;
using ThermVerify.Tolerances;

namespace ThermVerify.Tests.FrontEnd;

/// <summary>
/// The multiplexer's charge injection, Q at each window opening, simulated as a step on the sampling capacitor's
/// bottom plate. References: charge conservation (ΔV = Q/ΣC, textbook), Ohm's law for the average current Q·f_s, and
/// ngspice running the same deck.
/// </summary>
public class ChargeInjectionTests
{
    private static readonly CheckOptions Options = new() { ComputeRemedies = false, MaximumSamplingPoints = 3 };

    /// <summary>
    /// 1 MΩ / 1 MΩ (500 kΩ Thévenin at 25 °C... the NTC varies) into a 10 nF reservoir: τ = R·C ≈ 5 ms, far longer than the
    /// 2 µs window, so the charge stays where it was put during the window; 10 pF sampling capacitor behind 1 kΩ.
    /// </summary>
    private static FrontEndDesign Injected(string charge, params (string Path, string? Value)[] more) => TestDesign.Make([
        ("sensor.r25", "\"1 Mohm\""), ("divider.fixed_resistor", "\"1 Mohm\""), ("filter.reservoir_capacitor", "\"10 nF\""),
        ("adc.charge_injection", charge), ("check.range", "\"0 degC .. 50 degC\""), ("check.step", "\"25 K\""), .. more]);

    [Fact]
    public void The_first_sample_moves_by_the_charge_over_every_capacitance_at_the_pin()
    {
        var result = FrontEndCheck.Run(Injected("\"10 pC\""), Options);
        foreach (var p in result.Points.Where(p => p.SamplingSimulated))
        {
            // Charge conservation: ΔV = Q/(C_s + C_res), then the source's slow decay over t_acq (τ = R_th·ΣC).
            var thevenin = 1 / (1 / p.SensorOhms + 1 / 1e6);
            var expected = 10e-12 / (10e-12 + 10e-9) * Math.Exp(-2e-6 / (thevenin * 10.01e-9));
            Tolerance.AssertClose(expected, p.FirstSampleVolts - p.StaticPinVolts, 2e-3, 0, $"first sample at {p.Celsius} °C");
        }
    }

    [Fact]
    public void The_steady_sample_shifts_by_the_average_current_through_the_source()
    {
        var result = FrontEndCheck.Run(Injected("\"-1 pC\""), Options);
        foreach (var p in result.Points.Where(p => p.SamplingSimulated))
        {
            // Q·f_s into the pin through R_th (Ohm's law), plus about half the step ΔV: the sample comes right after each
            // step and the pin decays nearly linearly (τ ≫ T) to the step's level below it over the period.
            var thevenin = 1 / (1 / p.SensorOhms + 1 / 1e6);
            var step = -1e-12 / 10.01e-9;
            var expected = -1e-12 * 1e4 * thevenin + step / 2;
            Tolerance.AssertClose(expected, p.SteadySampleVolts - p.StaticPinVolts, 0.03, 0, $"steady sample at {p.Celsius} °C");
        }
    }

    [Fact]
    public void The_check_names_the_injection_with_its_closed_form_and_fails_over_the_budget()
    {
        var result = FrontEndCheck.Run(Injected("\"-1 pC\"", ("check.budget", "\"0.1 K\"")), Options);
        var finding = Assert.Single(result.Findings, f => f.Id == ChargeInjectionRule.Id);
        Assert.Equal(Severity.Fail, finding.Severity);
        Assert.Contains("Q·f_s·R", finding.Cause);
        Assert.NotNull(finding.EstimateVolts);
        // The simulated share and the closed form agree within the ripple ΔV (about 100 µV here).
        Tolerance.AssertClose(finding.EstimateVolts!.Value, finding.SimulatedVolts!.Value, 0, 1e-12 / 10.01e-9, "estimate against simulated");
        Assert.False(result.Passed);
        Assert.DoesNotContain(FrontEndCheck.Run(Injected("\"0.001 pC\""), Options).Findings, f => f.Id == ChargeInjectionRule.Id);
    }

    [Fact]
    public void Worst_case_units_carry_the_injection()
    {
        var with = WorstCase.Run(Injected("\"-1 pC\"", ("divider.fixed_tolerance", "\"1 %\"")), new WorstCaseOptions { Threads = 1 });
        var without = WorstCase.Run(Injected("\"0 pC\"", ("divider.fixed_tolerance", "\"1 %\"")), new WorstCaseOptions { Threads = 1 });
        // The steady shift, −7.5 mV at 0 °C on a 1 MΩ divider, is about 0.27 K there.
        Assert.True(Math.Abs(with.Points[0].NominalKelvin - without.Points[0].NominalKelvin) > 0.2,
            $"{with.Points[0].NominalKelvin} against {without.Points[0].NominalKelvin}");
    }

    [NgspiceFact]
    public void Ngspice_gives_the_same_samples()
    {
        var design = Injected("\"10 pC\"", ("check.step", "\"50 K\""));
        var ours = FrontEndCheck.Run(design, Options);
        using var engine = new NgspiceEngine();
        var theirs = FrontEndCheck.Run(design, Options with { Engine = engine });
        for (var i = 0; i < ours.Points.Count; i++)
        {
            Tolerance.AssertClose(ours.Points[i].FirstSampleVolts, theirs.Points[i].FirstSampleVolts, 0, 0.01 * ours.Adc.LsbVolts, "first sample");
            Tolerance.AssertClose(ours.Points[i].SteadySampleVolts, theirs.Points[i].SteadySampleVolts, 0, 0.01 * ours.Adc.LsbVolts, "steady sample");
        }
    }

    [Fact]
    public void The_key_is_read_written_back_and_refused_where_it_does_not_apply()
    {
        var design = Injected("\"-1.5 pC\"");
        Tolerance.AssertClose(-1.5e-12, design.Adc.ChargeInjectionCoulombs, 1e-12);
        var normal = DesignWriter.ToToml(design);
        Assert.Equal(design.Adc, DesignLoader.Parse(normal, "normal.toml", Path.GetTempPath()).Adc);
        var unit = Assert.Throws<DesignException>(() => Injected("\"2 pF\""));
        Assert.Equal("adc.charge_injection", unit.KeyPath);
        Assert.True(unit.Line > 1);
        Assert.Contains("charge", unit.Message);
        var withGain = Assert.Throws<DesignException>(() => Injected("\"2 pC\"", ("adc.gain", "4")));
        Assert.Equal("adc.charge_injection", withGain.KeyPath);
        var deltaSigma = Assert.Throws<DesignException>(() => Tests.Design.DeltaSigmaDesigns.Make(("adc.charge_injection", "\"2 pC\"")));
        Assert.Equal("adc.charge_injection", deltaSigma.KeyPath);
    }
}
