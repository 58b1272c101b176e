using MathNet.Numerics.LinearAlgebra;
using MathNet.Numerics.OdeSolvers;
using ThermVerify.Circuits;
using ThermVerify.Simulation.Switched;

namespace ThermVerify.Tests.Simulation.Switched;

/// <summary>
/// The reduction of the MNA descriptor system to an ODE in the state: algebraic nodes, floating capacitors, inductor
/// currents, a rank-deficient C, and what it must refuse.
/// </summary>
public class DescriptorReductionTests
{
    private const double OpenOhms = 1e18;

    /// <summary>A switch that closes once at <paramref name="close"/> and stays closed for the rest of these runs.</summary>
    private static PeriodicSchedule ClosesAt(double close) => new(close, 1, 0.5, 1);

    [Fact]
    public void Ladder_with_floating_capacitor_and_inductor_agrees_with_mathnet_runge_kutta()
    {
        const double v = 1, r1 = 1e3, c1 = 1e-9, l = 100e-6, r3 = 5e3, c2 = 2e-9, c3 = 1e-9, r2 = 2e3, close = 1e-6, span = 20e-6;
        var circuit = new CircuitBuilder()
            .VoltageSource("V1", "src", "0", v)
            .Switch("S1", "src", "a", r1, OpenOhms, ClosesAt(close))
            .Capacitor("C1", "a", "0", c1)
            .Inductor("L1", "a", "b", l)
            .Resistor("R3", "b", "0", r3)
            .Capacitor("C2", "b", "c", c2)
            .Capacitor("C3", "c", "0", c3)
            .Resistor("R2", "c", "0", r2)
            .Build();
        var run = ExactSwitchedTransient.Start(circuit);
        Assert.Equal(4, run.StateCount);

        // Independent integrator: MathNet.Numerics RungeKutta.FourthOrder on the ODEs written from Kirchhoff's laws, in
        // the states v_a, i_L, w = v_b − v_c (the floating capacitor) and v_c, with v_b = w + v_c:
        //   C1·v_a' = (V − v_a)/R1 − i_L,  L·i_L' = v_a − v_b,  C2·w' = i_L − v_b/R3,  C3·v_c' = C2·w' − v_c/R2.
        // Everything starts discharged (the switch is open before it closes, leaking 1e-18 of V).
        const int n = 40_001;
        var rk = RungeKutta.FourthOrder(Vector<double>.Build.Dense(4), 0, span, n, (_, y) =>
        {
            var vb = y[2] + y[3];
            var dw = (y[1] - vb / r3) / c2;
            return Vector<double>.Build.Dense([((v - y[0]) / r1 - y[1]) / c1, (y[0] - vb) / l, dw, (c2 * dw - y[3] / r2) / c3]);
        });
        var h = span / (n - 1);
        var indices = Enumerable.Range(1, 40).Select(k => k * 1000).ToArray();
        var times = indices.Select(i => close + i * h).ToArray();
        var a = run.VoltagesAt(times, "a");
        var b = run.VoltagesAt(times, "b");
        var c = run.VoltagesAt(times, "c");
        for (var k = 0; k < indices.Length; k++)
        {
            var y = rk[indices[k]];
            // RK4 at h = 0.5 ns against time constants of 1 µs and a 2 µs ringing period: its error is below 1e-10 V;
            // tolerance 1e-9 V.
            Tolerance.AssertClose(y[0], a[k], 0, 1e-9, $"V(a) at {times[k]:G4} s");
            Tolerance.AssertClose(y[2] + y[3], b[k], 0, 1e-9, $"V(b) at {times[k]:G4} s");
            Tolerance.AssertClose(y[3], c[k], 0, 1e-9, $"V(c) at {times[k]:G4} s");
        }
    }

    [Fact]
    public void Lone_floating_capacitor_gives_the_high_pass_step_response()
    {
        // A coupling capacitor with no capacitance to ground at either end: C has rank 1 over its two nodes.
        const double v = 2, ron = 100, rx = 1e6, r1 = 900, cc = 10e-9, r2 = 4e3, close = 1e-6;
        var circuit = new CircuitBuilder()
            .VoltageSource("V1", "src", "0", v)
            .Switch("S1", "src", "x", ron, OpenOhms, ClosesAt(close))
            .Resistor("Rx", "x", "0", rx)
            .Resistor("R1", "x", "b", r1)
            .Capacitor("Cc", "b", "c", cc)
            .Resistor("R2", "c", "0", r2)
            .Build();
        var run = ExactSwitchedTransient.Start(circuit);
        Assert.Equal(1, run.StateCount);
        // Thevenin source behind the closed switch: V·Rx/(R_on + Rx) through R_on ∥ Rx (Thevenin's theorem).
        var vth = v * rx / (ron + rx);
        var total = ron * rx / (ron + rx) + r1 + r2;
        var tau = total * cc;
        double[] multiples = [0.001, 0.5, 1, 3, 10];
        var vc = run.VoltagesAt([.. multiples.Select(m => close + m * tau)], "c");
        for (var k = 0; k < multiples.Length; k++)
            // RC high-pass step response from a discharged capacitor: i(t) = V_th/R_total·e^(−t/τ), τ = R_total·C, so
            // V(c) = i·R2 (first-order ODE solution). Tolerance 1e-12 of the step, for rounding.
            Tolerance.AssertClose(vth / total * Math.Exp(-multiples[k]) * r2, vc[k], 0, 1e-12 * v, $"V(c) at {multiples[k]} τ");
    }

    [Fact]
    public void Capacitor_straight_across_a_voltage_source_is_refused_with_a_reason()
    {
        var circuit = new CircuitBuilder()
            .VoltageSource("V1", "src", "0", 1.0)
            .Capacitor("Cdecouple", "src", "0", 100e-9)
            .Switch("S1", "src", "cap", 1e3, OpenOhms, ClosesAt(1e-6))
            .Capacitor("C1", "cap", "0", 1e-9)
            .Build();
        Assert.False(ExactSwitchedTransient.TryStart(circuit, out _, out var reason));
        // The capacitor's voltage is fixed by the source: a differential-algebraic system of index 2, which the
        // elimination of the algebraic unknowns cannot handle; the message says so and points to the time-stepping engine.
        Assert.Null(reason.Violation);
        Assert.Contains("index above 1", reason.Message);
        Assert.Contains("TransientSimulation", reason.Message);
    }
}
