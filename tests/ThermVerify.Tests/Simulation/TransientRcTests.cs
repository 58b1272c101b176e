using ThermVerify.Circuits;
using ThermVerify.Simulation;

namespace ThermVerify.Tests.Simulation;

public class TransientRcTests
{
    private const double R = 10e3, C = 1e-9, Tau = R * C;

    /// <summary>12-bit, 0.01 LSB relative to the step: the engine's settling-accuracy target.</summary>
    private const double HundredthLsb12 = 0.01 / 4096;

    private static Circuit StepIntoRc(double v0, double v1) => new CircuitBuilder()
        .VoltageSource("V1", "in", "0", new PulseWaveform(v0, v1, 0, 0, 0, 1, 0))
        .Resistor("R1", "in", "out", R)
        .Capacitor("C1", "out", "0", C)
        .Build();

    [Fact]
    public void Rc_charging_follows_the_exponential()
    {
        var result = Transient.Run(StepIntoRc(0, 1), new TransientOptions { StopTimeSeconds = 10 * Tau });
        var t = result.TimesSeconds;
        var v = result.Voltage("out");
        for (var i = 0; i < t.Length; i++)
            // RC charging, first-order ODE solution: v(t) = V·(1 − e^(−t/τ)). Tolerance: the global error
            // measured at the default reltol 1e-6 is about 1.5e-5 of the step (15× the per-step tolerance).
            Tolerance.AssertClose(1 - Math.Exp(-t[i] / Tau), v[i], 0, 3e-5, $"v at {t[i] / Tau:F3} τ");
    }

    [Fact]
    public void Rc_discharging_follows_the_exponential_between_points_too()
    {
        var result = Transient.Run(StepIntoRc(2, 0), new TransientOptions { StopTimeSeconds = 8 * Tau });
        for (var k = 1; k < 400; k++)
        {
            var time = k * 8 * Tau / 400;
            // RC discharge: v(t) = V0·e^(−t/τ); read between solution points through the method's polynomial.
            Tolerance.AssertClose(2 * Math.Exp(-time / Tau), result.VoltageAt("out", time), 0, 6e-5, $"v at {time / Tau:F3} τ");
        }
    }

    [Theory]
    [InlineData(1e-6, 9.0)] // default tolerance: the 12-bit settling point 9.01τ and later
    [InlineData(1e-8, 0.0)] // tighter tolerance: the whole settling curve
    public void Switched_rc_settles_as_the_exponential_at_many_time_constants(double reltol, double fromMultiple)
    {
        const double close = 2e-6, ron = 2e3, cs = 8e-12, tau = ron * cs;
        double[] multiples = [0.5, 1, 2, 3, 5, 7.62, 9.01, 10.40, 11.78];
        var circuit = new CircuitBuilder()
            .VoltageSource("V1", "src", "0", 1.0)
            .Switch("S1", "src", "cap", ron, 1e18, new IntervalSchedule((close, 1)))
            .Capacitor("Cs", "cap", "0", cs, 0)
            .Build();
        var options = new TransientOptions
        {
            StopTimeSeconds = close + 12 * tau,
            UseInitialConditions = true,
            RelativeTolerance = reltol,
            OutputTimesSeconds = [.. multiples.Select(m => close + m * tau)],
        };
        var result = Transient.Run(circuit, options);
        foreach (var m in multiples.Where(m => m >= fromMultiple))
        {
            var time = close + m * tau;
            Assert.Contains(time, result.TimesSeconds);
            // Single-pole settling V·(1 − e^(−t/τ)); ½ LSB at 12 bit needs (N+1)·ln2·τ = 9.01τ (elementary).
            // Target: within 0.01 LSB of 12 bits of the step.
            Tolerance.AssertClose(1 - Math.Exp(-m), result.VoltageAt("cap", time), 0, HundredthLsb12, $"v at {m} τ");
        }
        Tolerance.AssertClose(13 * Math.Log(2), 9.01, 0, 0.005, "(N+1)·ln2 for N = 12");
    }

    [Fact]
    public void Two_capacitors_joined_by_a_switch_conserve_charge()
    {
        const double c1 = 1e-9, c2 = 3e-9, v1 = 2.0, ron = 1e3;
        var tau = ron * c1 * c2 / (c1 + c2);
        var circuit = new CircuitBuilder()
            .Capacitor("C1", "a", "0", c1, v1)
            .Capacitor("C2", "b", "0", c2, 0)
            .Switch("S1", "a", "b", ron, 1e18, new IntervalSchedule((1e-6, 1)))
            .Build();
        var result = Transient.Run(circuit, new TransientOptions { StopTimeSeconds = 1e-6 + 30 * tau, UseInitialConditions = true });
        var a = result.Voltage("a");
        var b = result.Voltage("b");
        for (var i = 0; i < a.Length; i++)
            // Charge conservation: C1·Va + C2·Vb = C1·V1 at every instant (Kirchhoff's current law integrated).
            Tolerance.AssertClose(c1 * v1, c1 * a[i] + c2 * b[i], 1e-9, 0, "total charge");
        // Final shared voltage from charge conservation: V = C1·V1/(C1 + C2).
        Tolerance.AssertClose(c1 * v1 / (c1 + c2), a[^1], 1e-6);
        Tolerance.AssertClose(c1 * v1 / (c1 + c2), b[^1], 1e-6);
    }

    [Theory]
    [InlineData(IntegrationMethod.BackwardEuler, 1.0)]
    [InlineData(IntegrationMethod.Trapezoidal, 2.0)]
    [InlineData(IntegrationMethod.Gear2, 2.0)]
    public void Convergence_order_on_an_rc_discharge(IntegrationMethod method, double expectedOrder)
    {
        var circuit = new CircuitBuilder()
            .Capacitor("C1", "out", "0", C, 1.0)
            .Resistor("R1", "out", "0", R)
            .Build();
        double Error(double h)
        {
            var result = Transient.Run(circuit, new TransientOptions
            {
                StopTimeSeconds = 2 * Tau,
                FixedStepSeconds = h,
                Method = method,
                UseInitialConditions = true,
            });
            // Exact solution of the RC discharge: e^(−t/τ).
            return Math.Abs(result.FinalVoltage("out") - Math.Exp(-2));
        }
        var errors = new[] { Tau / 20, Tau / 40, Tau / 80, Tau / 160 }.Select(Error).ToArray();
        for (var i = 1; i < errors.Length; i++)
        {
            // Order of the method: halving the step divides the global error by 2^p (Euler p = 1, trapezoidal and
            // Gear-2/BDF2 p = 2; any numerical-analysis text, e.g. Hairer, Nørsett & Wanner, from memory).
            var order = Math.Log2(errors[i - 1] / errors[i]);
            Tolerance.AssertClose(expectedOrder, order, 0, 0.1, $"observed order between h/{20 << (i - 1)} and h/{20 << i}");
        }
    }

    [Fact]
    public void Requested_output_times_are_solution_points()
    {
        double[] wanted = [1.234e-6, 3.3e-5, 7.77e-5];
        var result = Transient.Run(StepIntoRc(0, 1), new TransientOptions { StopTimeSeconds = 1e-4, OutputTimesSeconds = wanted });
        foreach (var t in wanted)
        {
            Assert.Contains(t, result.TimesSeconds);
            // RC charging closed form at the forced point.
            Tolerance.AssertClose(1 - Math.Exp(-t / Tau), result.VoltageAt("out", t), 0, 3e-5);
        }
    }
}
