using ThermVerify.Circuits;
using ThermVerify.Simulation.Switched;

namespace ThermVerify.Tests.Simulation.Switched;

/// <summary>Exact propagation against the closed forms of switched RC circuits.</summary>
public class SwitchedClosedFormTests
{
    /// <summary>Off resistance so high that an open switch leaks nothing measurable in these microsecond runs.</summary>
    private const double OpenOhms = 1e18;

    [Fact]
    public void Rc_charging_through_a_closing_switch_follows_the_exponential()
    {
        const double v0 = 2.5, ron = 2e3, c = 8e-12, close = 1e-6, period = 1e-3;
        var tau = ron * c;
        var circuit = new CircuitBuilder()
            .VoltageSource("V1", "src", "0", v0)
            .Switch("S1", "src", "cap", ron, OpenOhms, new PeriodicSchedule(close, period, 20 * tau, 1))
            .Capacitor("Cs", "cap", "0", c)
            .Switch("Sreset", "cap", "0", 10, OpenOhms, new PeriodicSchedule(0, period, close / 2, 1))
            .Build();
        double[] multiples = [0, 0.01, 0.5, 1, 2, 5, 7.62, 9.01, 13, 19.99];
        var run = ExactSwitchedTransient.Start(circuit);
        var v = run.VoltagesAt([.. multiples.Select(m => close + m * tau)], "cap");
        for (var i = 0; i < multiples.Length; i++)
            // Single RC charging from 0 V: v(t) = V0·(1 − e^(−t/τ)), τ = R_on·C (first-order ODE solution). Exact
            // propagation has no truncation error: tolerance 1e-12 of the step for rounding (the open switches leak
            // about 1e-13 V in the microsecond between the reset and the close).
            Tolerance.AssertClose(v0 * (1 - Math.Exp(-multiples[i])), v[i], 0, 1e-12 * v0, $"v at {multiples[i]} τ");
    }

    [Fact]
    public void Charge_sharing_through_a_switch_resistance_ends_at_the_charge_conserving_voltage()
    {
        // The reservoir is charged from V through a switch that opens at t1, the sampling capacitor is emptied by a
        // reset switch until t1; at t2 the sharing switch joins them through R_sw.
        const double v = 3.3, cExt = 100e-12, cSh = 8e-12, rsw = 1.5e3, t1 = 1e-6, t2 = 2e-6, period = 1e-3;
        var tau = rsw * cExt * cSh / (cExt + cSh);
        var circuit = new CircuitBuilder()
            .VoltageSource("V1", "src", "0", v)
            .Switch("Scharge", "src", "ext", 10, OpenOhms, new PeriodicSchedule(0, period, t1, 1))
            .Capacitor("Cext", "ext", "0", cExt)
            .Switch("Sreset", "sh", "0", 10, OpenOhms, new PeriodicSchedule(0, period, t1, 1))
            .Capacitor("Csh", "sh", "0", cSh)
            .Switch("Sshare", "ext", "sh", rsw, OpenOhms, new PeriodicSchedule(t2, period, 50 * tau, 1))
            .Build();
        var run = ExactSwitchedTransient.Start(circuit);
        double[] multiples = [0.5, 1, 3, 40];
        var times = multiples.Select(m => t2 + m * tau).ToArray();
        var ext = run.VoltagesAt(times, "ext");
        var sh = run.VoltagesAt(times, "sh");
        // Charge conservation: both end at V·C_ext/(C_ext + C_sh); the reservoir drops by the kickback
        // ΔV·C_sh/(C_sh + C_ext) (common practice, no source). The difference decays with τ = R_sw·C_ext·C_sh/(C_ext + C_sh),
        // the series capacitance (first-order ODE solution). Before t1 the charging and reset switches (10 Ω) settle
        // both capacitors to far below 1e-12 V (t1 is 1000 and 80 time constants).
        var final = v * cExt / (cExt + cSh);
        Tolerance.AssertClose(v * cSh / (cSh + cExt), v - final, 1e-12, 0, "kickback step");
        for (var i = 0; i < multiples.Length; i++)
        {
            var gap = v * Math.Exp(-multiples[i]);
            Tolerance.AssertClose(final + gap * cSh / (cExt + cSh), ext[i], 0, 1e-12 * v, $"reservoir at {multiples[i]} τ");
            Tolerance.AssertClose(final - gap * cExt / (cExt + cSh), sh[i], 0, 1e-12 * v, $"sampling capacitor at {multiples[i]} τ");
            Tolerance.AssertClose(v * cExt, cExt * ext[i] + cSh * sh[i], 1e-13, 0, $"charge at {multiples[i]} τ");
        }
    }

    [Fact]
    public void Steady_deficit_of_a_large_reservoir_follows_the_switched_capacitor_resistance()
    {
        // A source V behind R_s charges a large reservoir; every period the sampling switch takes C_sh, emptied before
        // each acquisition, from it. Johns & Martin (Analog Integrated Circuit Design, 1997, switched-capacitor chapter):
        // the switched capacitor acts as R_eq = 1/(f_s·C_sh), so the reservoir settles at V·R_eq/(R_s + R_eq), a
        // deficit of V·R_s/(R_s + R_eq).
        const double v = 1, rs = 1e6, cExt = 1e-6, cSh = 10e-12, fs = 10e3, ron = 1e3, acquisition = 1e-6;
        var period = 1 / fs;
        var circuit = new CircuitBuilder()
            .VoltageSource("V1", "src", "0", v)
            .Resistor("Rs", "src", "pin", rs)
            .Capacitor("Cext", "pin", "0", cExt)
            .Switch("Ssample", "pin", "hold", ron, OpenOhms, new PeriodicSchedule(period - acquisition, period, acquisition))
            .Capacitor("Csh", "hold", "0", cSh)
            .Switch("Sreset", "hold", "0", ron, OpenOhms, new PeriodicSchedule(0, period, period / 2))
            .Build();
        var run = ExactSwitchedTransient.Start(circuit);
        var rEq = 1 / (fs * cSh);
        var deficit = v - run.SteadyStateSampleVoltage("Ssample", "hold");
        // The formula treats the charge drawn each period as a steady current: the reservoir's ripple C_sh/C_ext = 1e-5
        // of V and the source's current during the 1 µs acquisition move the exact result by a few 1e-5 of the deficit
        // (measured 4.5e-5); tolerance 2e-4.
        Tolerance.AssertClose(v * rs / (rs + rEq), deficit, 2e-4, 0, "steady deficit");
        // Stepped period by period, the same run approaches that steady state: after 40 reservoir time constants
        // (R_s ∥ R_eq)·C_ext the remaining gap is e^−40 of the start.
        var tauSeconds = rs * rEq / (rs + rEq) * cExt;
        var periods = (long)Math.Ceiling(40 * tauSeconds / period);
        Tolerance.AssertClose(v - deficit, run.SampleVoltage("Ssample", periods, "hold"), 0, 1e-12, "conversion after 40 τ");
    }
}
