using ThermVerify.Circuits;
using ThermVerify.Simulation;

namespace ThermVerify.Tests.Simulation;

/// <summary>Timed switches: their state at t = 0, their edges as breakpoints, and a wide on/off ratio.</summary>
public class SwitchTests
{
    private static Circuit Divider(SwitchSchedule schedule) => new CircuitBuilder()
        .VoltageSource("V1", "top", "0", 2.0)
        .Resistor("R1", "top", "mid", 1e3)
        .Switch("S1", "mid", "bottom", 10, 1e9, schedule)
        .Resistor("R2", "bottom", "0", 1e3)
        .Build();

    [Fact]
    public void The_state_at_time_zero_sets_the_operating_point()
    {
        // Ohm's law on the divider with the switch's resistance in series: closed 10 Ω, open 1 GΩ.
        var closed = OperatingPoint.Solve(Divider(new PeriodicSchedule(0, 1e-3, 0.5e-3)));
        Tolerance.AssertClose(2.0 * 1010 / 2010, closed.Voltage("mid"), 1e-12);
        var open = OperatingPoint.Solve(Divider(new PeriodicSchedule(0.2e-3, 1e-3, 0.5e-3)));
        Tolerance.AssertClose(2.0 * (1e9 + 1e3) / (1e9 + 2e3), open.Voltage("mid"), 1e-12);
    }

    [Fact]
    public void Every_edge_is_a_solution_point_and_the_run_restarts_there_with_a_small_first_order_step()
    {
        var circuit = new CircuitBuilder()
            .VoltageSource("V1", "src", "0", 1.0)
            .Switch("S1", "src", "cap", 100, 1e12, new PeriodicSchedule(1e-6, 4e-6, 1.5e-6, 3))
            .Capacitor("C1", "cap", "0", 1e-9)
            .Resistor("R1", "cap", "0", 1e5)
            .Build();
        var result = Transient.Run(circuit, new TransientOptions { StopTimeSeconds = 14e-6 });
        var t = result.TimesSeconds;
        double[] edges = [1e-6, 2.5e-6, 5e-6, 6.5e-6, 9e-6, 10.5e-6];
        foreach (var edge in edges)
        {
            // The schedule computes its edges (1e-6 + 1.5e-6 may round to 2.5000000000000004e-6): to a few ulps.
            var i = Array.FindIndex(t, x => Math.Abs(x - edge) <= 1e-14 * edge);
            Assert.True(i > 0, $"edge {edge} s is a solution point");
            // After a breakpoint: a tiny backward-Euler probe, a checked backward-Euler step, then order 2 (Nagel 1975:
            // a first-order restart does not excite the trapezoidal rule's undamped modes). The probe is 1e-9 of the
            // time to the next stop, but no shorter than a thousand times the time resolution at t (about 1e-12 s
            // here), so at most 1e-6 of the 1.5 µs to the next edge.
            Assert.True(result.IsProbeStepEndingAt(i + 1), $"probe after {edge}");
            Assert.True(t[i + 1] - t[i] <= 1e-6 * 1.5e-6, $"probe after {edge} is tiny ({t[i + 1] - t[i]:G3} s)");
            Assert.Equal(StepFormula.BackwardEuler, result.FormulaOfStepEndingAt(i + 1));
            Assert.Equal(StepFormula.BackwardEuler, result.FormulaOfStepEndingAt(i + 2));
            Assert.NotEqual(StepFormula.BackwardEuler, result.FormulaOfStepEndingAt(i + 3));
        }
    }

    [Fact]
    public void An_on_off_ratio_of_1e15_keeps_every_digit()
    {
        const double ron = 1, roff = 1e15, c = 1e-6, rBleed = 1e6, close = 1e-6, open = 11e-6, v = 1;
        var circuit = new CircuitBuilder()
            .VoltageSource("V1", "src", "0", v)
            .Switch("S1", "src", "hold", ron, roff, new IntervalSchedule((close, open)))
            .Capacitor("C1", "hold", "0", c, 0)
            .Resistor("Rb", "hold", "0", rBleed)
            .Build();
        double[] times = [3e-6, 6e-6, 11e-6, 15e-6, 20e-6];
        var result = Transient.Run(circuit, new TransientOptions
        {
            StopTimeSeconds = 20e-6, UseInitialConditions = true, RelativeTolerance = 1e-9, VoltageToleranceVolts = 1e-12,
            OutputTimesSeconds = times,
        });
        // Closed: C charges through Ron ∥ Rb from V: v_c = V·k·(1 − e^(−t/τ)), k = Rb/(Rb + Ron), τ = C·(Ron ∥ Rb)
        // (RC charging). Open: it holds, leaking through Rb ∥ Roff towards V·Rb/(Rb + Roff) with τ_h = C·(Rb ∥ Roff) ≈ 1 s,
        // so over 9 µs it droops by 9e-6 of its value; the switch's 1e-15 S stays beside 1 S in the same rows throughout.
        var k = rBleed / (rBleed + ron);
        var tau = c * ron * rBleed / (ron + rBleed);
        double Charged(double t) => v * k * (1 - Math.Exp(-(t - close) / tau));
        var vOpen = Charged(open);
        var tauHold = c * rBleed * roff / (rBleed + roff);
        var vInf = v * rBleed / (rBleed + roff);
        double Held(double t) => vInf + (vOpen - vInf) * Math.Exp(-(t - open) / tauHold);
        // Tolerance: the step control bounds each step's local error by reltol·|v|; on a decaying circuit the global
        // error is at most their sum (the local errors are carried forward without growth; Hairer, Nørsett & Wanner,
        // Solving ODEs I, §II.3, from memory), so at most the number of steps times reltol. Measured: 1.5e-7 at 3 µs.
        var bound = result.AcceptedSteps * 1e-9;
        foreach (var t in times)
            Tolerance.AssertClose(t <= open ? Charged(t) : Held(t), result.VoltageAt("hold", t), 0, bound, $"v at {t * 1e6} µs");
        // The droop itself, 9e-6 of the value, is resolved to 1 % of it.
        var droop = result.VoltageAt("hold", open) - result.VoltageAt("hold", 20e-6);
        Tolerance.AssertClose(vOpen - Held(20e-6), droop, 0.01, 0, "droop over the hold");
    }
}
