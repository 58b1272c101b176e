using ThermVerify.Circuits;
using ThermVerify.Simulation;
using ThermVerify.Simulation.Switched;

namespace ThermVerify.Tests.Simulation.Switched;

/// <summary>The op-amp macro-model linearised in its linear region, and the signal when it leaves it.</summary>
public class OpAmpLinearRegionTests
{
    private const double Gbw = 1e6, A0 = 1e5, Slew = 1e6, Close = 5e-6;

    /// <summary>
    /// A follower whose input steps when a switch to ground closes at 5 µs: the input is a 1 kΩ/1 kΩ divider from 2 V,
    /// and the switch (R_on) loads its lower leg, so the step is 2·(1k ∥ R_on)/(1k + 1k ∥ R_on) − 1 V.
    /// </summary>
    private static Circuit SteppedFollower(double switchOhms, double? secondPoleHertz = null) => new CircuitBuilder()
        .VoltageSource("V1", "src", "0", 2.0)
        .Resistor("R1", "src", "in", 1e3)
        .Resistor("R2", "in", "0", 1e3)
        .Switch("S1", "in", "0", switchOhms, 1e15, new PeriodicSchedule(Close, 1, 0.5, 1))
        .Add(new OpAmp("U1", "in", "out", "out")
        {
            OpenLoopGain = A0,
            GainBandwidthHertz = Gbw,
            OutputResistanceOhms = 50,
            SlewRateVoltsPerSecond = Slew,
            OutputLowVolts = 0,
            OutputHighVolts = 3.3,
            SecondPoleHertz = secondPoleHertz,
        })
        .Resistor("Rload", "out", "0", 1e6)
        .Build();

    private static double Step(double switchOhms)
    {
        var lower = 1e3 * switchOhms / (1e3 + switchOhms);
        return 2 * lower / (1e3 + lower) - 1;
    }

    [Fact]
    public void Small_step_settles_with_time_constant_one_over_two_pi_gbw_and_agrees_with_time_stepping()
    {
        const double ron = 10e6;
        var step = Step(ron); // −50 µV: far inside the slew limit (about 4 mV at 1 µV tolerance)
        var tau = 1 / (2 * Math.PI * Gbw);
        double[] multiples = [0.5, 1, 2, 4, 8];
        var times = multiples.Select(m => Close + m * tau).ToArray();
        var circuit = SteppedFollower(ron);
        var exact = ExactSwitchedTransient.Start(circuit).VoltagesAt([0, .. times], "out");
        var stepping = Transient.Run(circuit, new TransientOptions { StopTimeSeconds = 2 * Close, RelativeTolerance = 1e-10, VoltageToleranceVolts = 1e-13, OutputTimesSeconds = times });
        for (var i = 0; i < multiples.Length; i++)
        {
            // Single-pole follower: v(t) = v0 + ΔV·(1 − e^(−t/τ)), τ = 1/(2π·GBW) (op-amp textbook result, from memory);
            // 2e-4 of the step covers A0 = 1e5 and r_o into 1 MΩ.
            Tolerance.AssertClose(exact[0] + step * (1 - Math.Exp(-multiples[i])), exact[i + 1], 0, 2e-4 * Math.Abs(step), $"v at {multiples[i]} τ");
            // The time-stepping engine on the same nonlinear model at relative tolerance 1e-10, whose own global error on
            // a 1 V node is about 1e-9 V: 3e-9 V.
            Tolerance.AssertClose(stepping.VoltageAt("out", times[i]), exact[i + 1], 0, 3e-9, $"against time stepping at {multiples[i]} τ");
        }
    }

    [Fact]
    public void Second_pole_follower_rings_as_the_time_stepping_engine_has_it()
    {
        // A second pole at 2 MHz against 1 MHz GBW: about 50° of phase margin, so the 50 µV step overshoots and rings.
        var circuit = SteppedFollower(10e6, secondPoleHertz: 2e6);
        var times = Enumerable.Range(1, 40).Select(i => Close + i * 25e-9).ToArray();
        var run = ExactSwitchedTransient.Start(circuit);
        var exact = run.VoltagesAt(times, "out");
        var stepping = Transient.Run(circuit, new TransientOptions { StopTimeSeconds = 2 * Close, RelativeTolerance = 1e-10, VoltageToleranceVolts = 1e-13, OutputTimesSeconds = times });
        var final = run.VoltagesAt([0], "out")[0] + Step(10e6);
        Assert.True(exact.Min() < final - 1e-6, "the step overshoots (the output falls below its final value)");
        for (var i = 0; i < times.Length; i++)
            // The time-stepping engine on the same nonlinear model at relative tolerance 1e-10: 3e-9 V, as above.
            Tolerance.AssertClose(stepping.VoltageAt("out", times[i]), exact[i], 0, 3e-9, $"v at {times[i]:G4} s");
    }

    [Fact]
    public void Large_step_is_reported_as_leaving_the_linear_region_where_the_amplifier_slews()
    {
        var circuit = SteppedFollower(1e3); // a −0.33 V step: the input stage saturates
        var run = ExactSwitchedTransient.Start(circuit);
        var e = Assert.Throws<NotLinearException>(() => run.VoltagesAt([2 * Close], "out"));
        var v = e.Violation!;
        Assert.Equal("U1", v.Element);
        Assert.Contains("slew", v.Condition);
        // The interval is the one starting at the edge; the worst instant is right after it, where v_d ≈ the step.
        Tolerance.AssertClose(Close, v.FromSeconds, 1e-12, 0, "interval start");
        Assert.InRange(v.AtSeconds, Close, Close + 1e-7);
        Tolerance.AssertClose(Step(1e3), v.Value, 0.01, 0, "input difference at the edge");
        Assert.Contains("TransientSimulation", e.Message);
        // Before the edge all is linear and readable.
        Assert.Single(run.VoltagesAt([Close], "out"));
    }
}
