using ThermVerify.Circuits;
using ThermVerify.Simulation;
using ThermVerify.Simulation.Switched;
using ThermVerify.Tests.Ngspice;
using ThermVerify.FrontEnd;

namespace ThermVerify.Tests.Simulation.Switched;

/// <summary>
/// Exact propagation against the time-stepping engine on the check's own sampling circuits (FrontEndCircuit.Sampling) of
/// every bundled example, for every precharge case at both ends of the check range. The time-stepping engine runs at
/// relative tolerance 1e-10 (the check uses 1e-8), where its own global error on these circuits is below 1e-7 V; the
/// two must agree within 2e-7 V, a 4,000th of an LSB at 12 bits on 3.3 V. Where an op-amp leaves its linear region, the
/// reported excursion must be a real one: the time-stepping engine sees the same input difference at the same instant.
/// </summary>
public class ExampleSamplingAgreementTests
{
    private const int Conversions = 16;
    private const double AgreementVolts = 2e-7;

    [Theory]
    [MemberData(nameof(ExampleDesigns.All), MemberType = typeof(ExampleDesigns))]
    public void Exact_samples_agree_with_the_time_stepping_engine(string file)
    {
        var design = ExampleDesigns.Load(file);
        var model = new ClosedFormModel(design);
        var settleVolts = design.Check.SettleLimitLsb * model.Adc.LsbVolts;
        var range = design.Check.Range;
        foreach (var pre in PrechargeCases.For(design, model.Adc.ReferenceVolts))
            foreach (var celsius in new[] { range.MinCelsius, range.MaxCelsius })
            {
                var at = $"{file} at {celsius} °C, {pre.Describe()}";
                var (circuit, options) = SamplingRun.Setup(design, celsius, pre.Volts, settleVolts, Conversions);
                if (circuit.Elements.OfType<ThermVerify.Circuits.Diode>().FirstOrDefault() is { } diode)
                {
                    // A diode (a clamp at the pin) is nonlinear: such a design is simulated by time stepping (the
                    // ngspice cross-check holds those samples); the exact method must refuse it by name, never guess.
                    Assert.False(ExactSwitchedTransient.TryStart(circuit, out _, out var why), $"{at}: exact propagation took a diode");
                    Assert.Contains(diode.Name, why!.Message);
                    continue;
                }
                Assert.True(ExactSwitchedTransient.TryStart(circuit, out var run, out var refused), $"{at}: {refused?.Message}");
                var tight = options with { RelativeTolerance = 1e-10, VoltageToleranceVolts = 1e-12 };
                double[] exact;
                try
                {
                    exact = run.SampleVoltages(FrontEndNodes.SamplingSwitch, Conversions, FrontEndNodes.Hold);
                }
                catch (NotLinearException e) when (e.Violation is { } violation)
                {
                    AssertExcursionIsReal(circuit, tight, violation, at);
                    continue;
                }
                var stepping = new TransientSimulation(circuit, tight);
                for (var k = 0; k < Conversions; k++)
                {
                    stepping.AdvanceTo(FrontEndCircuit.SampleTimeSeconds(design, k));
                    stepping.ForgetRecordedPoints();
                    Tolerance.AssertClose(stepping.Voltage(FrontEndNodes.Hold), exact[k], 0, AgreementVolts, $"conversion {k}, {at}");
                }
            }
    }

    [Fact]
    public void Time_stepping_converges_to_the_exact_samples_as_its_tolerance_tightens()
    {
        var design = ExampleDesigns.Load("cold-storage-logger.toml");
        const int conversions = 4;
        var (circuit, options) = SamplingRun.Setup(design, -30, 0.0, 1e-6, conversions);
        var exact = ExactSwitchedTransient.Start(circuit).SampleVoltages(FrontEndNodes.SamplingSwitch, conversions, FrontEndNodes.Hold);
        var errors = new[] { 1e-8, 1e-9, 1e-10 }.Select(reltol =>
        {
            var stepping = new TransientSimulation(circuit, options with { RelativeTolerance = reltol, VoltageToleranceVolts = 1e-12 });
            var worst = 0.0;
            for (var k = 0; k < conversions; k++)
            {
                stepping.AdvanceTo(FrontEndCircuit.SampleTimeSeconds(design, k));
                worst = Math.Max(worst, Math.Abs(stepping.Voltage(FrontEndNodes.Hold) - exact[k]));
            }
            return worst;
        }).ToArray();
        // A second-order method with local error control: the local tolerance bounds h³, the global error goes as h², so
        // it falls as the tolerance to the power 2/3, 10^(2/3) ≈ 4.6 per decade (numerical-analysis texts, from memory).
        // Measured 4.5–4.6 here; each decade must gain at least a factor 3, towards the exact value and not elsewhere.
        for (var i = 1; i < errors.Length; i++)
            Assert.True(errors[i - 1] / errors[i] > 3, $"error {errors[i - 1]:G3} V then {errors[i]:G3} V");
        Assert.True(errors[^1] < 2e-7, $"at 1e-10: {errors[^1]:G3} V");
    }

    private static void AssertExcursionIsReal(Circuit circuit, TransientOptions options, LinearityViolation violation, string at)
    {
        var amp = Assert.IsType<OpAmp>(circuit[violation.Element]);
        Assert.Contains("slew", violation.Condition); // the only excursion these examples make; the clamp's is internal
        var stepping = new TransientSimulation(circuit, options);
        stepping.AdvanceTo(violation.AtSeconds);
        var vd = stepping.Voltage(amp.NonInverting) - stepping.Voltage(amp.Inverting) + amp.InputOffsetVolts;
        Tolerance.AssertClose(vd, violation.Value, 1e-3, 1e-7, $"input difference at the reported instant, {at}");
        Assert.True(vd < violation.Low || vd > violation.High, $"{at}: the time-stepping engine has v_d = {vd:G4} V inside the limits");
    }
}
