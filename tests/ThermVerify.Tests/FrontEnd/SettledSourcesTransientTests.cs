using ThermVerify.Circuits;
using ThermVerify.FrontEnd;
using ThermVerify.Simulation;
using ThermVerify.Tests.Ngspice;

namespace ThermVerify.Tests.FrontEnd;

/// <summary>
/// A transient whose source switches on once (a PULSE's delay and rise, then held): stepped up to the source's last
/// corner, exact propagation after it (<see cref="SettledSourcesTransient"/>). Held to a hand-solved ramp response and
/// to the time-stepping engine alone.
/// </summary>
public class SettledSourcesTransientTests
{
    private const double Ohms = 1e3, Farads = 1e-6, Volts = 1, RiseSeconds = 10e-6;

    private static Circuit RampIntoRc(double widthSeconds) => new(
    [
        new VoltageSource("V1", "in", "0", new PulseWaveform(0, Volts, 0, RiseSeconds, 0, widthSeconds, 0)),
        new Resistor("R1", "in", "out", Ohms),
        new Capacitor("C1", "out", "0", Farads),
        // Exact propagation needs a period: a switch on a node of its own, closed once, that the lag never sees.
        new Resistor("Rx", "x", "0", 1e3),
        new TimedSwitch("S1", "x", "0", 1, 1e12, new PeriodicSchedule(1e-3, 5e-3, 1e-3, 1)),
    ]);

    /// <summary>
    /// A ramp of height V over t_r into a first-order lag of time constant τ (the convolution of the ramp with the lag's
    /// impulse response; textbook, from memory): v(t) = (V/t_r)·(t − τ·(1 − e^(−t/τ))) during the ramp and
    /// v(t) = V·(1 − (τ/t_r)·(e^(t_r/τ) − 1)·e^(−t/τ)) after it.
    /// </summary>
    private static double RampResponse(double t)
    {
        const double tau = Ohms * Farads;
        return t <= RiseSeconds
            ? Volts / RiseSeconds * (t - tau * (1 - Math.Exp(-t / tau)))
            : Volts * (1 - tau / RiseSeconds * (Math.Exp(RiseSeconds / tau) - 1) * Math.Exp(-t / tau));
    }

    [Fact]
    public void A_ramp_into_an_rc_lag_follows_the_hand_solved_response()
    {
        var options = new TransientOptions { StopTimeSeconds = 5e-3, MaxStepSeconds = 1e-6, RelativeTolerance = 1e-10, VoltageToleranceVolts = 1e-12 };
        var run = BuiltInEngine.Instance.StartTransient(RampIntoRc(1), options);
        Assert.IsType<SettledSourcesTransient>(run);
        // One read in the ramp (stepped), the rest after it (exact from the ramp's end).
        foreach (var t in new[] { 5e-6, 20e-6, 0.5e-3, 2e-3, 5e-3 })
            Tolerance.AssertClose(RampResponse(t), run.VoltageAt(t, "out"), 0, 1e-9, $"t = {t} s");
    }

    [Fact]
    public void A_source_still_changing_at_the_end_is_stepped_as_before()
    {
        // The pulse falls 1 ms into a 5 ms run: its last corner before the end is the fall's end, and it holds after it,
        // so that run qualifies; a run that ends within the rise does not.
        var options = new TransientOptions { StopTimeSeconds = 5e-6, MaxStepSeconds = 1e-6 };
        Assert.Null(SettledSourcesTransient.TryStart(RampIntoRc(1), options, null));
        var falling = new TransientOptions { StopTimeSeconds = 5e-3, MaxStepSeconds = 1e-6, RelativeTolerance = 1e-10, VoltageToleranceVolts = 1e-12 };
        var run = SettledSourcesTransient.TryStart(RampIntoRc(1e-3), falling, null);
        Assert.NotNull(run);
        // After the ideal fall at t_f = t_r + 1 ms the lag discharges from where the ramp response left it: v(t_f)·e^(−(t − t_f)/τ).
        var fall = RiseSeconds + 1e-3;
        var expected = RampResponse(fall) * Math.Exp(-(5e-3 - fall) / (Ohms * Farads));
        Tolerance.AssertClose(expected, run.VoltageAt(5e-3, "out"), 0, 1e-9, "after the pulse's fall");
        // The time-stepping engine alone, within its own integration error (a few nV here).
        var stepping = new TransientSimulation(RampIntoRc(1e-3), falling);
        stepping.AdvanceTo(5e-3);
        Tolerance.AssertClose(expected, stepping.Voltage("out"), 0, 1e-8, "time stepping after the pulse's fall");
    }

    /// <summary>
    /// The netlist soil probe's first sample after its GPIO's PULSE switches on (10 ns rise, 10 ms lead, 2 µs window),
    /// against the time-stepping engine alone at relative tolerance 1e-10, within 0.01 LSB (8 µV at 12 bits on 3.3 V).
    /// </summary>
    [Theory]
    [InlineData(-10.0)]
    [InlineData(40.0)]
    public void The_netlist_soil_probe_switch_on_agrees_with_time_stepping(double celsius)
    {
        var design = ExampleDesigns.Load("soil-probe-switched-netlist.toml");
        var (circuit, options) = SwitchOnSettling.Setup(design, celsius, null, 1e-6);
        Assert.IsType<SettledSourcesTransient>(BuiltInEngine.Instance.StartTransient(circuit, options));
        var ours = SwitchOnSettling.FirstSampleVolts(design, celsius, null, 1e-6);
        var stepping = new TransientSimulation(circuit, options with { RelativeTolerance = 1e-10, VoltageToleranceVolts = 1e-12 });
        stepping.AdvanceTo(options.StopTimeSeconds);
        Tolerance.AssertClose(stepping.Voltage(FrontEndNodes.Hold), ours, 0, 0.01 * 3.3 / 4096, $"{celsius} °C");
    }
}
