using ThermVerify.Circuits;
using ThermVerify.Simulation;
using ThermVerify.Simulation.Switched;

namespace ThermVerify.Tests.Simulation.Switched;

/// <summary>
/// The slewing stage's residual carried to first order (SlewResidual, ResidualCarrier): the linear model's value plus
/// the carried deviation must match the macro-model's own trajectory, computed independently by the time-stepping
/// engine at a tight tolerance.
/// </summary>
public class SlewResidualTests
{
    private const double Gbw = 1e6, A0 = 1e5, Slew = 1e6, Close = 5e-6;

    /// <summary>
    /// A follower (s = SR/(2π·GBW) = 0.159 V) whose input steps by about −20 mV when a 24.5 kΩ switch closes across the lower
    /// leg of a 1 kΩ/1 kΩ divider from 2 V: an eighth of s, inside the cap (a quarter), where tanh's residual is a few
    /// tenths of a percent of the stage's current.
    /// </summary>
    private static Circuit KickedFollower() => new CircuitBuilder()
        .VoltageSource("V1", "src", "0", 2.0)
        .Resistor("R1", "src", "in", 1e3)
        .Resistor("R2", "in", "0", 1e3)
        .Switch("S1", "in", "0", 24.5e3, 1e15, new PeriodicSchedule(Close, 1, 0.5, 1))
        .Add(new OpAmp("U1", "in", "out", "out")
        {
            OpenLoopGain = A0,
            GainBandwidthHertz = Gbw,
            OutputResistanceOhms = 50,
            SlewRateVoltsPerSecond = Slew,
            OutputLowVolts = 0,
            OutputHighVolts = 3.3,
        })
        .Resistor("Rload", "out", "0", 1e6)
        .Build();

    [Fact]
    public void Linear_value_plus_carried_deviation_matches_the_macro_model_stepped_finely()
    {
        var circuit = KickedFollower();
        var tau = 1 / (2 * Math.PI * Gbw);
        double[] multiples = [0.25, 0.5, 1, 2, 4, 8];
        var times = multiples.Select(m => Close + m * tau).ToArray();
        // A wide tolerance, so that the kick is propagated and its deviation reported rather than refused.
        var run = ExactSwitchedTransient.Start(circuit, new ExactSwitchedOptions { LinearityToleranceVolts = 1e-2 });
        var (exact, deviations) = run.VoltagesAndDeviationsAt(times, "out");
        var stepping = Transient.Run(circuit, new TransientOptions
        {
            StopTimeSeconds = 2 * Close, RelativeTolerance = 1e-11, VoltageToleranceVolts = 1e-14, OutputTimesSeconds = times,
        });
        var largest = 0.0;
        for (var i = 0; i < times.Length; i++)
        {
            var truth = stepping.VoltageAt("out", times[i]);
            var missing = truth - exact[i];
            largest = Math.Max(largest, Math.Abs(missing));
            // First order: what is left is the second-order term (about (v_d/s)² = 1.6 % of it here) and the residual's
            // departure from linear between check points; 5 % of the deviation plus the stepping engine's own 1e-9 V.
            Tolerance.AssertClose(missing, deviations[i], 0, 0.05 * Math.Abs(deviations[i]) + 1e-9, $"deviation at {multiples[i]} τ");
        }
        // The residual is visible: the linear model alone is microvolts off while the kick lasts.
        Assert.True(largest > 1e-6, $"largest deviation {largest:G3} V");
        // And it decays with the loop: by 8 τ it is a few hundredths of its peak.
        Assert.True(Math.Abs(deviations[^1]) < 0.05 * deviations.Max(Math.Abs));
    }

    [Fact]
    public void An_interval_whose_carried_deviation_exceeds_the_tolerance_is_reported()
    {
        var circuit = KickedFollower();
        var read = Close + 1 / (2 * Math.PI * Gbw);
        // At 1 µV the kick's deviation (microvolts at one τ) is too large, though the input difference stays under the cap.
        var run = ExactSwitchedTransient.Start(circuit, new ExactSwitchedOptions { LinearityToleranceVolts = 1e-6 });
        var thrown = Assert.Throws<NotLinearException>(() => run.VoltagesAt([read], "out"));
        Assert.Contains("carried", thrown.Violation!.Condition);
        Assert.Equal("U1", thrown.Violation.Element);
    }

    [Fact]
    public void The_residual_current_is_the_tanh_stage_less_its_linear_part()
    {
        // g_m·(s·tanh(v/s) − v) ≈ −g_m·v³/(3s²) for small v (Taylor series of tanh, from memory).
        var residual = new SlewResidual("U1", 0, 0, 100, 0.159);
        var v = 1e-3;
        Tolerance.AssertClose(-100 * v * v * v / (3 * 0.159 * 0.159), residual.Current(v), 1e-4);
        Assert.Equal(-residual.Current(v), residual.Current(-v));
    }
}
