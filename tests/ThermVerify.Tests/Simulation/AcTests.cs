using System.Numerics;
using ThermVerify.Simulation;
using ThermVerify.Circuits;

namespace ThermVerify.Tests.Simulation;

public class AcTests
{
    [Fact]
    public void Rc_low_pass_is_minus_3_dB_and_minus_45_degrees_at_its_corner()
    {
        const double r = 1e3, c = 1e-6;
        var fc = 1 / (2 * Math.PI * r * c);
        var circuit = new CircuitBuilder()
            .VoltageSource("V1", "in", "0", 0, 1)
            .Resistor("R1", "in", "out", r)
            .Capacitor("C1", "out", "0", c)
            .Build();
        var sweep = FrequencySweep.Logarithmic(1, 1e6, 10);
        var ac = AcAnalysis.Run(circuit, FrequencySweep.At(fc));
        var h = ac.Transfer("out", "in")[0];
        // H = 1/(1 + jωRC): at ω = 1/RC, 20·log10(1/√2) = −3.0103 dB and −45°.
        Tolerance.AssertClose(-3.010299956639812, 20 * Math.Log10(h.Magnitude), 1e-12);
        Tolerance.AssertClose(-45, h.Phase * 180 / Math.PI, 1e-12);

        var wide = AcAnalysis.Run(circuit, sweep);
        var v = wide.Voltage("out");
        var db = wide.MagnitudeDb("out", "in");
        var degrees = wide.PhaseDegrees("out", "in");
        for (var k = 0; k < v.Length; k++)
        {
            var expected = 1 / (1 + new Complex(0, 2 * Math.PI * sweep.FrequenciesHertz[k] * r * c));
            Tolerance.AssertClose(expected.Real, v[k].Real, 1e-12, 1e-15);
            Tolerance.AssertClose(expected.Imaginary, v[k].Imaginary, 1e-12, 1e-15);
            // |H| = 1/√(1 + (f/fc)²) and ∠H = −atan(f/fc) for the same low-pass.
            var x = sweep.FrequenciesHertz[k] / fc;
            Tolerance.AssertClose(-10 * Math.Log10(1 + x * x), db[k], 1e-9, 1e-12);
            Tolerance.AssertClose(-Math.Atan(x) * 180 / Math.PI, degrees[k], 1e-9, 1e-12);
        }
    }

    [Fact]
    public void Transfer_between_two_inner_nodes_of_an_rc_ladder()
    {
        const double r1 = 1e3, c1 = 1e-9, r2 = 4.7e3, c2 = 220e-12;
        var circuit = new CircuitBuilder()
            .VoltageSource("V1", "in", "0", 1.2, 1)
            .Resistor("R1", "in", "a", r1).Capacitor("C1", "a", "0", c1)
            .Resistor("R2", "a", "b", r2).Capacitor("C2", "b", "0", c2)
            .Build();
        var f = 123e3;
        var h = AcAnalysis.Run(circuit, FrequencySweep.At(f)).Transfer("b", "a")[0];
        // Second stage seen from node a: V(b)/V(a) = 1/(1 + jωR2C2) (voltage divider of R2 and C2).
        var expected = 1 / (1 + new Complex(0, 2 * Math.PI * f * r2 * c2));
        Tolerance.AssertClose(expected.Magnitude, h.Magnitude, 1e-12);
        Tolerance.AssertClose(expected.Phase, h.Phase, 1e-12);
    }

    [Fact]
    public void Inductor_and_capacitor_resonate_at_one_over_two_pi_root_lc()
    {
        const double l = 10e-6, c = 100e-9, r = 1;
        var f0 = 1 / (2 * Math.PI * Math.Sqrt(l * c));
        var circuit = new CircuitBuilder()
            .VoltageSource("V1", "in", "0", 0, 1)
            .Resistor("R1", "in", "x", r)
            .Inductor("L1", "x", "y", l)
            .Capacitor("C1", "y", "0", c)
            .Build();
        var h = AcAnalysis.Run(circuit, FrequencySweep.At(f0)).Voltage("y")[0];
        // Series RLC at resonance: the current is V/R, so V(C) = −j·Q with Q = √(L/C)/R.
        Tolerance.AssertClose(0, h.Real, 0, 1e-9);
        Tolerance.AssertClose(-Math.Sqrt(l / c) / r, h.Imaginary, 1e-9);
    }
}
