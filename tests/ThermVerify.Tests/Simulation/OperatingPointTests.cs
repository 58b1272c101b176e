using ThermVerify.Circuits;
using ThermVerify.Simulation;

namespace ThermVerify.Tests.Simulation;

public class OperatingPointTests
{
    // DC accuracy target of the engine: 1e-9 relative against closed forms.
    private const double Rel = 1e-9;

    [Fact]
    public void Divider_follows_ohms_law()
    {
        var circuit = new CircuitBuilder()
            .VoltageSource("V1", "in", "0", 3.3)
            .Resistor("R1", "in", "out", 10e3)
            .Resistor("R2", "out", "0", 4.7e3)
            .Build();
        var op = OperatingPoint.Solve(circuit);
        // Ohm's law: Vout = Vin·R2/(R1 + R2); source current (SPICE sign: + → − inside) is −Vin/(R1 + R2).
        Tolerance.AssertClose(3.3 * 4.7e3 / 14.7e3, op.Voltage("out"), Rel);
        Tolerance.AssertClose(-3.3 / 14.7e3, op.Current("V1"), Rel);
        Tolerance.AssertClose(3.3 / 14.7e3, op.Current("R1"), Rel);
    }

    [Fact]
    public void Wheatstone_bridge_output_matches_kirchhoff()
    {
        const double v = 5, r1 = 1e3, r2 = 1.2e3, r3 = 2.2e3, r4 = 1.8e3, rm = 3.3e3;
        var circuit = new CircuitBuilder()
            .VoltageSource("V1", "top", "0", v)
            .Resistor("R1", "top", "a", r1).Resistor("R2", "a", "0", r2)
            .Resistor("R3", "top", "b", r3).Resistor("R4", "b", "0", r4)
            .Resistor("Rm", "a", "b", rm)
            .Build();
        var op = OperatingPoint.Solve(circuit);
        // Kirchhoff's current law at a and b, solved by Cramer's rule by hand:
        // (1/r1 + 1/r2 + 1/rm)·Va − Vb/rm = v/r1;  −Va/rm + (1/r3 + 1/r4 + 1/rm)·Vb = v/r3.
        double a11 = 1 / r1 + 1 / r2 + 1 / rm, a12 = -1 / rm, a22 = 1 / r3 + 1 / r4 + 1 / rm;
        double b1 = v / r1, b2 = v / r3, det = a11 * a22 - a12 * a12;
        Tolerance.AssertClose((b1 * a22 - a12 * b2) / det, op.Voltage("a"), Rel);
        Tolerance.AssertClose((a11 * b2 - a12 * b1) / det, op.Voltage("b"), Rel);
    }

    [Fact]
    public void Two_sources_superpose()
    {
        Circuit Build(double v1, double i2) => new CircuitBuilder()
            .VoltageSource("V1", "in", "0", v1)
            .Resistor("R1", "in", "x", 2e3)
            .Resistor("R2", "x", "0", 3e3)
            .CurrentSource("I2", "0", "x", i2)
            .Build();
        var both = OperatingPoint.Solve(Build(2.5, 1e-3)).Voltage("x");
        var onlyV = OperatingPoint.Solve(Build(2.5, 0)).Voltage("x");
        var onlyI = OperatingPoint.Solve(Build(0, 1e-3)).Voltage("x");
        // Superposition theorem; each part by Ohm's law: V·R2/(R1+R2) and I·(R1‖R2).
        Tolerance.AssertClose(2.5 * 3e3 / 5e3, onlyV, Rel);
        Tolerance.AssertClose(1e-3 * (2e3 * 3e3 / 5e3), onlyI, Rel);
        Tolerance.AssertClose(onlyV + onlyI, both, Rel);
    }

    [Fact]
    public void Controlled_sources_give_their_gains()
    {
        var circuit = new CircuitBuilder()
            .VoltageSource("V1", "in", "0", 0.2)
            .Resistor("Rin", "in", "0", 1e3)
            .Add(new Vcvs("E1", "e", "0", "in", "0", 12.5))
            .Resistor("Re", "e", "0", 1e3)
            .Add(new Vccs("G1", "0", "g", "in", "0", 2e-3))
            .Resistor("Rg", "g", "0", 5e3)
            .Build();
        var op = OperatingPoint.Solve(circuit);
        // Definitions of VCVS (E = A·Vc) and VCCS (I = gm·Vc into g, through Rg: V = gm·Vc·Rg).
        Tolerance.AssertClose(12.5 * 0.2, op.Voltage("e"), Rel);
        Tolerance.AssertClose(2e-3 * 0.2 * 5e3, op.Voltage("g"), Rel);
    }

    [Fact]
    public void Inductor_is_a_short_in_dc()
    {
        var circuit = new CircuitBuilder()
            .VoltageSource("V1", "in", "0", 1)
            .Resistor("R1", "in", "x", 1e3)
            .Inductor("L1", "x", "y", 1e-3)
            .Resistor("R2", "y", "0", 1e3)
            .Build();
        var op = OperatingPoint.Solve(circuit);
        // Ohm's law with the inductor as a short (its DC impedance jωL = 0).
        Tolerance.AssertClose(0.5, op.Voltage("x"), Rel);
        Tolerance.AssertClose(0.5e-3, op.Current("L1"), Rel);
    }

    [Fact]
    public void Operating_point_uses_source_value_at_time_zero()
    {
        var circuit = new CircuitBuilder()
            .VoltageSource("V1", "in", "0", new PulseWaveform(0.5, 2, 1e-6, 1e-9, 1e-9, 1e-6, 0))
            .Resistor("R1", "in", "0", 1e3)
            .Build();
        // SPICE convention (Nagel 1975, from memory): the DC point uses the waveform's value at t = 0.
        Tolerance.AssertClose(0.5, OperatingPoint.Solve(circuit).Voltage("in"), Rel);
    }
}
