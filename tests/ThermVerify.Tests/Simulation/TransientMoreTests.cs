using MathNet.Numerics.LinearAlgebra;
using MathNet.Numerics.OdeSolvers;
using ThermVerify.Circuits;
using ThermVerify.Simulation;

namespace ThermVerify.Tests.Simulation;

public class TransientMoreTests
{
    [Fact]
    public void Two_stage_rc_ladder_agrees_with_mathnet_runge_kutta()
    {
        const double r1 = 1e3, c1 = 1e-9, r2 = 2e3, c2 = 0.5e-9, ramp = 2e-6, stop = 10e-6;
        var circuit = new CircuitBuilder()
            .VoltageSource("V1", "in", "0", new PiecewiseLinearWaveform((0, 0), (ramp, 1)))
            .Resistor("R1", "in", "a", r1).Capacitor("C1", "a", "0", c1)
            .Resistor("R2", "a", "b", r2).Capacitor("C2", "b", "0", c2)
            .Build();
        var result = Transient.Run(circuit, new TransientOptions { StopTimeSeconds = stop });

        // Independent integrator: MathNet.Numerics RungeKutta.FourthOrder on the nodal ODEs
        // C1·v1' = (vs − v1)/R1 − (v1 − v2)/R2, C2·v2' = (v1 − v2)/R2, with the ramp corner on a grid point.
        const int n = 100_001;
        double Vs(double t) => Math.Min(t / ramp, 1);
        var rk = RungeKutta.FourthOrder(Vector<double>.Build.Dense(2), 0, stop, n, (t, y) => Vector<double>.Build.Dense(
        [
            ((Vs(t) - y[0]) / r1 - (y[0] - y[1]) / r2) / c1,
            (y[0] - y[1]) / r2 / c2,
        ]));
        var h = stop / (n - 1);
        for (var i = 0; i < n; i += 500)
        {
            // Tolerance: the engine's global error at default reltol 1e-6 (about 15× the step tolerance), 3e-5 V.
            Tolerance.AssertClose(rk[i][0], result.VoltageAt("a", i * h), 0, 3e-5, $"V(a) at {i * h:G4} s");
            Tolerance.AssertClose(rk[i][1], result.VoltageAt("b", i * h), 0, 3e-5, $"V(b) at {i * h:G4} s");
        }
    }

    [Fact]
    public void Series_rlc_step_overshoot_matches_damping_ratio()
    {
        const double l = 1e-3, c = 1e-6, zeta = 0.2;
        var r = 2 * zeta * Math.Sqrt(l / c);
        var w0 = 1 / Math.Sqrt(l * c);
        // Peak of a second-order step response at t_p = π/(ω0·√(1 − ζ²)), overshoot exp(−πζ/√(1 − ζ²))
        // (second-order system step response; any control-engineering text, from memory).
        var tPeak = Math.PI / (w0 * Math.Sqrt(1 - zeta * zeta));
        var circuit = new CircuitBuilder()
            .VoltageSource("V1", "in", "0", new PulseWaveform(0, 1, 0, 0, 0, 1, 0))
            .Resistor("R1", "in", "x", r)
            .Inductor("L1", "x", "out", l)
            .Capacitor("C1", "out", "0", c)
            .Build();
        var result = Transient.Run(circuit, new TransientOptions { StopTimeSeconds = 3 * tPeak, OutputTimesSeconds = [tPeak] });
        var overshoot = result.VoltageAt("out", tPeak) - 1;
        Tolerance.AssertClose(Math.Exp(-Math.PI * zeta / Math.Sqrt(1 - zeta * zeta)), overshoot, 1e-4);
        // The peak is the maximum of the recorded waveform as well.
        Tolerance.AssertClose(1 + overshoot, result.Voltage("out").Max(), 1e-6);
    }

    [Fact]
    public void A_run_continued_from_a_captured_state_matches_one_run()
    {
        const double ron = 2e3, cs = 8e-12, period = 10e-6, acquisition = 1e-6;
        var circuit = new CircuitBuilder()
            .VoltageSource("V1", "top", "0", 3.3)
            .Resistor("R1", "top", "pin", 10e3)
            .Resistor("R2", "pin", "0", 10e3)
            .Capacitor("Cext", "pin", "0", 1e-9)
            .Switch("S1", "pin", "cap", ron, 1e12, new PeriodicSchedule(0, period, acquisition))
            .Capacitor("Cs", "cap", "0", cs)
            .Build();
        var whole = Transient.Run(circuit, new TransientOptions { StopTimeSeconds = 8 * period, MaxStepSeconds = period / 4 });

        var options = new TransientOptions { StopTimeSeconds = 4 * period, MaxStepSeconds = period / 4 };
        var simulation = new TransientSimulation(circuit, options);
        simulation.AdvanceTo(4 * period);
        var state = simulation.CaptureState();
        var rest = Transient.Run(circuit, options with { StopTimeSeconds = 8 * period }, state);
        Assert.Equal(4 * period, rest.StartTimeSeconds);
        // Same circuit, same physics: agreement within the transient tolerance (3e-5 of 3.3 V).
        Tolerance.AssertClose(whole.FinalVoltage("cap"), rest.FinalVoltage("cap"), 0, 1e-4);
        Tolerance.AssertClose(whole.VoltageAt("pin", 7.5 * period), rest.VoltageAt("pin", 7.5 * period), 0, 1e-4);
    }

    [Fact]
    public void Pulse_through_a_resistive_divider_is_exact_at_every_point()
    {
        var pulse = new PulseWaveform(0, 2, 1e-6, 1e-7, 2e-7, 1e-6, 4e-6);
        var circuit = new CircuitBuilder()
            .VoltageSource("V1", "in", "0", pulse)
            .Resistor("R1", "in", "out", 1e3)
            .Resistor("R2", "out", "0", 3e3)
            .Build();
        var result = Transient.Run(circuit, new TransientOptions { StopTimeSeconds = 10e-6 });
        var t = result.TimesSeconds;
        var v = result.Voltage("out");
        for (var i = 0; i < t.Length; i++)
            // Ohm's law on the pulse definition (SPICE PULSE, from memory).
            Tolerance.AssertClose(0.75 * pulse.ValueAt(t[i]), v[i], 1e-12, 1e-15);
        // Corners are breakpoints: 1 µs + 0.1 µs rise is a solution point.
        Assert.Contains(1.1e-6, t);
    }

    [Fact]
    public void Continuing_another_circuit_is_refused()
    {
        var a = new CircuitBuilder().Capacitor("C1", "x", "0", 1e-9, 1).Resistor("R1", "x", "0", 1e3).Build();
        var b = new CircuitBuilder().Capacitor("C1", "x", "0", 1e-9, 1).Resistor("R1", "x", "0", 2e3).Build();
        var simulation = new TransientSimulation(a, new TransientOptions { StopTimeSeconds = 1e-6, UseInitialConditions = true });
        simulation.AdvanceTo(1e-6);
        Assert.Throws<CircuitException>(() => Transient.Run(b, new TransientOptions { StopTimeSeconds = 2e-6 }, simulation.CaptureState()));
    }

    [Fact]
    public void A_step_that_cannot_meet_its_tolerance_above_the_minimum_step_names_time_and_analysis()
    {
        var circuit = new CircuitBuilder()
            .VoltageSource("V1", "in", "0", new PulseWaveform(0, 1, 1e-6, 1e-9, 1e-9, 1, 0))
            .Resistor("R1", "in", "out", 1e3)
            .Capacitor("C1", "out", "0", 1e-12)
            .Build();
        // τ = 1 ns cannot be followed to reltol 1e-6 with steps of at least 0.1 µs.
        var e = Assert.Throws<ConvergenceException>(() => Transient.Run(circuit,
            new TransientOptions { StopTimeSeconds = 5e-6, MinStepSeconds = 1e-7 }));
        Assert.Equal(TransientSimulation.AnalysisName, e.Analysis);
        Assert.NotNull(e.TimeSeconds);
        Assert.True(e.TimeSeconds >= 1e-6, "fails once the pulse rises");
    }

    [Fact]
    public void Chunks_with_forgotten_history_reach_the_same_settled_sample()
    {
        var circuit = new CircuitBuilder()
            .VoltageSource("V1", "top", "0", 3.3)
            .Resistor("R1", "top", "pin", 10e3)
            .Resistor("R2", "pin", "0", 10e3)
            .Capacitor("Cext", "pin", "0", 10e-9)
            .Switch("S1", "pin", "hold", 2e3, 1e12, new PeriodicSchedule(5e-6, 20e-6, 1e-6))
            .Capacitor("Cs", "hold", "0", 8e-12)
            .Switch("Sr", "hold", "0", 100, 1e12, new PeriodicSchedule(10e-6, 20e-6, 1e-6))
            .Build();
        var options = new TransientOptions { StopTimeSeconds = 400e-6, MaxStepSeconds = 5e-6 };
        var whole = Transient.Run(circuit, options);

        var simulation = new TransientSimulation(circuit, options);
        var samples = new List<double>();
        TransientResult? first = null;
        for (var k = 0; k < 20; k++)
        {
            var end = 5e-6 + k * 20e-6 + 1e-6;
            simulation.AdvanceTo(end);
            samples.Add(simulation.Voltage("hold"));
            first ??= simulation.Result;
            simulation.ForgetRecordedPoints();
        }
        simulation.AdvanceTo(400e-6);
        // Same circuit, same physics: the last sample and the end agree within the transient tolerance.
        Tolerance.AssertClose(whole.VoltageAt("hold", 5e-6 + 19 * 20e-6 + 1e-6), samples[^1], 0, 1e-5);
        Tolerance.AssertClose(whole.FinalVoltage("pin"), simulation.Voltage("pin"), 0, 1e-5);
        // A result taken before forgetting still reads its own points.
        Assert.Equal(6e-6, first!.EndTimeSeconds);
        // Each sample approaches the divider's 1.65 V as the reservoir recovers (successive differences shrink).
        Assert.True(Math.Abs(samples[^1] - samples[^2]) < Math.Abs(samples[1] - samples[0]));
    }

    [Fact]
    public void Lc_tank_started_from_an_inductor_current_swings_to_i0_times_root_l_over_c()
    {
        const double l = 1e-3, c = 1e-6, i0 = 1e-3;
        var w = 1 / Math.Sqrt(l * c);
        var quarter = Math.PI / (2 * w);
        var circuit = new CircuitBuilder()
            .Add(new Inductor("L1", "x", "0", l, i0))
            .Capacitor("C1", "x", "0", c, 0)
            .Build();
        var result = Transient.Run(circuit, new TransientOptions
        {
            StopTimeSeconds = 4 * quarter,
            UseInitialConditions = true,
            OutputTimesSeconds = [quarter, 2 * quarter, 3 * quarter],
        });
        // Lossless LC: C·dv/dt = −i_L, v(t) = −I0·√(L/C)·sin(ωt), ω = 1/√(LC) (energy exchange, textbook).
        var peak = i0 * Math.Sqrt(l / c);
        Tolerance.AssertClose(-peak, result.VoltageAt("x", quarter), 1e-4);
        Tolerance.AssertClose(0, result.VoltageAt("x", 2 * quarter), 0, 1e-4 * peak);
        Tolerance.AssertClose(peak, result.VoltageAt("x", 3 * quarter), 1e-4);
        // After a full period the current is back to I0: i_L(t) = I0·cos(ωt).
        Tolerance.AssertClose(i0, result.Current("L1")[^1], 1e-4);
    }
}
