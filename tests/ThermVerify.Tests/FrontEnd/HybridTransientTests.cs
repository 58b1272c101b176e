using ThermVerify.FrontEnd;
using ThermVerify.Simulation;
using ThermVerify.Simulation.Switched;
using ThermVerify.Tests.Check;
using ThermVerify.Tests.Ngspice;

namespace ThermVerify.Tests.FrontEnd;

/// <summary>
/// The built-in engine's transients where an op-amp leaves its linear region: exact propagation where it holds, time
/// stepping across the stretches where it does not, exact again after them. Each is held to 0.01 LSB (8 µV at 12 bits
/// on 3.3 V) against the time-stepping engine alone at relative tolerance 1e-10, whose own error on these circuits is
/// below 1e-7 V (ExampleSamplingAgreementTests).
/// </summary>
public class HybridTransientTests
{
    private const double HundredthLsbVolts = 0.01 * 3.3 / 4096;

    /// <summary>
    /// The buffered logger's follower is kicked about 5.6 mV (v_d) by every acquisition of its other-channel precharge:
    /// past what an instantaneous bound on tanh's residual allows at 1 µV, but the residual's effect, carried to first
    /// order, has died out long before the sample, so exact propagation alone takes every period.
    /// </summary>
    [Fact]
    public void Kicked_follower_is_propagated_exactly_and_agrees_with_time_stepping()
    {
        var design = ExampleDesigns.Load("cold-storage-logger-buffered.toml");
        const int conversions = 6;
        var (circuit, options) = SamplingRun.Setup(design, -30, 0.0, 1e-6, conversions);
        var exact = ExactSwitchedTransient.Start(circuit).SampleVoltages(FrontEndNodes.SamplingSwitch, conversions, FrontEndNodes.Hold);
        var stepping = new TransientSimulation(circuit, options with { RelativeTolerance = 1e-10, VoltageToleranceVolts = 1e-12 });
        for (var k = 0; k < conversions; k++)
        {
            stepping.AdvanceTo(FrontEndCircuit.SampleTimeSeconds(design, k));
            Tolerance.AssertClose(stepping.Voltage(FrontEndNodes.Hold), exact[k], 0, HundredthLsbVolts, $"conversion {k}");
        }
    }

    /// <summary>
    /// A follower slewing at 1 mV/µs (s = 80 µV) into the bare op-amp logger's 100 nF: it slews on every kick, for
    /// microseconds, so the hybrid steps those stretches, restarting the time-stepping run from the exact state at the
    /// start of each (not stepping the linear stretches in between again). The carried residual keeps exact propagation
    /// honest here: an instantaneous bound let a deviation of 13 µV build up, which restarted stepping turned into a
    /// four-period cycle of the samples.
    /// </summary>
    [Fact]
    public void Slow_follower_that_slews_on_each_kick_agrees_with_time_stepping()
    {
        var design = ExampleDesigns.Load("cold-storage-logger-bare-opamp.toml");
        design = design with { Buffer = design.Buffer! with { SlewRateVoltsPerSecond = 1e3 } };
        const int conversions = 8;
        var (circuit, options) = SamplingRun.Setup(design, -29.5, 0.0, 1e-6, conversions);
        Assert.True(ExactSwitchedTransient.TryStart(circuit, out var exact, out _));
        Assert.Throws<NotLinearException>(() => exact.SampleVoltages(FrontEndNodes.SamplingSwitch, conversions, FrontEndNodes.Hold));

        var hybrid = BuiltInEngine.Instance.StartTransient(circuit, options);
        var stepping = new TransientSimulation(circuit, options with { RelativeTolerance = 1e-10, VoltageToleranceVolts = 1e-12 });
        for (var k = 0; k < conversions; k++)
        {
            var t = FrontEndCircuit.SampleTimeSeconds(design, k);
            stepping.AdvanceTo(t);
            Tolerance.AssertClose(stepping.Voltage(FrontEndNodes.Hold), hybrid.VoltageAt(t, FrontEndNodes.Hold), 0, HundredthLsbVolts, $"conversion {k}");
        }
    }

    /// <summary>
    /// Switching on a buffered divider: the follower starts at its lower rail with the excitation off and slews up, then
    /// settles into its linear region for the rest of the lead; the first sample is read exactly after that.
    /// </summary>
    [Fact]
    public void Switch_on_of_a_buffered_divider_agrees_with_time_stepping()
    {
        var design = TestDesign.Make(("filter.reservoir_capacitor", "\"100 nF\""), ("divider.switch_on_lead", "\"2 ms\""),
            ("divider.reading_interval", "\"1 s\""), ("buffer.topology", "\"follower\""), ("buffer.gain_bandwidth", "\"2 MHz\""),
            ("buffer.dc_gain", "\"110 dB\""), ("buffer.output_resistance", "\"50 ohm\""), ("buffer.supply", "\"0 V .. 3.3 V\""),
            ("buffer.output_swing", "\"10 mV\""), ("buffer.slew_rate", "\"1 V/us\""), ("buffer.isolation_resistor", "\"100 ohm\""));
        var (circuit, options) = SwitchOnSettling.Setup(design, 25, null, 1e-6);
        Assert.True(ExactSwitchedTransient.TryStart(circuit, out var exact, out _));
        var thrown = Assert.Throws<NotLinearException>(() => exact.Reader()(options.StopTimeSeconds, FrontEndNodes.Hold));
        // The hybrid's own reader reports the same violation instead of raising it.
        var (_, reported) = exact.TryReader()(options.StopTimeSeconds, FrontEndNodes.Hold);
        Assert.Equal(thrown.Violation, reported);

        var hybrid = SwitchOnSettling.FirstSampleVolts(design, 25, null, 1e-6);
        var stepping = new TransientSimulation(circuit, options with { RelativeTolerance = 1e-10, VoltageToleranceVolts = 1e-12 });
        stepping.AdvanceTo(options.StopTimeSeconds);
        Tolerance.AssertClose(stepping.Voltage(FrontEndNodes.Hold), hybrid, 0, HundredthLsbVolts, "first sample after switch-on");
    }

    /// <summary>
    /// The time-stepping engine's tolerance follows the accuracy a check needs, scaled from the 2 µV measured at 1e-8 as
    /// the tolerance to the power 3/2 (the error goes as its 2/3 power): 0.005 LSB wanted, 2.86·1e-8 for 12 bits on
    /// 3.3 V, 8 times that for 10 bits (4× the LSB), an eighth for 14 bits.
    /// </summary>
    [Fact]
    public void Tolerance_follows_the_converter_resolution()
    {
        var twelve = SamplingRun.RelativeToleranceFor(new AdcTransfer(12, 3.3));
        Tolerance.AssertClose(1e-8 * Math.Pow(0.005 * 3.3 / 4096 / 2e-6, 1.5), twelve, 1e-12);
        Tolerance.AssertClose(8 * twelve, SamplingRun.RelativeToleranceFor(new AdcTransfer(10, 3.3)), 1e-12);
        Tolerance.AssertClose(twelve / 8, SamplingRun.RelativeToleranceFor(new AdcTransfer(14, 3.3)), 1e-12);
    }
}
