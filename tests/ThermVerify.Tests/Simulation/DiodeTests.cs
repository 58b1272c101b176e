using MathNet.Numerics.RootFinding;
using ThermVerify.Circuits;
using ThermVerify.Quantities;
using ThermVerify.Simulation;

namespace ThermVerify.Tests.Simulation;

public class DiodeTests
{
    [Theory]
    [InlineData(5.0, 1e3, 1e-14, 1.0, 0.0, 25.0)]
    [InlineData(5.0, 1e3, 1e-14, 1.5, 2.0, 25.0)]
    [InlineData(3.3, 100, 1e-12, 1.8, 5.0, 80.0)]
    [InlineData(0.2, 10e3, 1e-9, 1.0, 0.0, -40.0)]
    public void Forward_drop_matches_shockley_solved_by_brent(double volts, double ohms, double isat, double n, double rs, double celsius)
    {
        var circuit = new CircuitBuilder()
            .VoltageSource("V1", "in", "0", volts)
            .Resistor("R1", "in", "a", ohms)
            .Add(new Diode("D1", "a", "0", isat, n, rs))
            .At(celsius)
            .Build();
        var op = OperatingPoint.Solve(circuit);

        // Shockley equation I = Is·(exp(Vj/(n·Vt)) − 1), Vt = kT/q (k, q exact, SI Brochure 9th ed.),
        // plus the 1e-12 S junction gmin the engine adds as SPICE does; loop: V = I·(R + Rs) + Vj.
        // Solved independently with MathNet.Numerics' Brent root finder.
        var nvt = n * PhysicalConstants.BoltzmannJoulesPerKelvin * PhysicalConstants.ToKelvin(celsius) / PhysicalConstants.ElementaryChargeCoulombs;
        double Current(double vj) => isat * (Math.Exp(vj / nvt) - 1) + 1e-12 * vj;
        var vj = Brent.FindRoot(vj => (volts - vj) / (ohms + rs) - Current(vj), 0, volts, 1e-15, 200);
        var anode = vj + Current(vj) * rs;
        Tolerance.AssertClose(anode, op.Voltage("a"), 1e-9);
        Tolerance.AssertClose(Current(vj), op.Current("D1"), 1e-8);
    }

    [Fact]
    public void Input_clamp_holds_an_overdriven_pin_one_drop_above_the_rail()
    {
        var circuit = new CircuitBuilder()
            .VoltageSource("Vdd", "vdd", "0", 3.3)
            .VoltageSource("Vin", "in", "0", 12)
            .Resistor("Rs", "in", "pin", 10e3)
            .Add(new Diode("Dhi", "pin", "vdd", 1e-14))
            .Add(new Diode("Dlo", "0", "pin", 1e-14))
            .Build();
        var op = OperatingPoint.Solve(circuit);
        // Diode equation inverted: Vj = n·Vt·ln(1 + I/Is) with I ≈ (12 − Vpin)/Rs (Shockley; one fixed-point pass
        // from the engine's pin voltage is enough at this accuracy).
        var vt = PhysicalConstants.BoltzmannJoulesPerKelvin * 298.15 / PhysicalConstants.ElementaryChargeCoulombs;
        var current = (12 - op.Voltage("pin")) / 10e3;
        Tolerance.AssertClose(3.3 + vt * Math.Log(1 + current / 1e-14), op.Voltage("pin"), 1e-6);
    }

    [Fact]
    public void Clamp_leakage_follows_the_saturation_current_temperature_law()
    {
        var circuit = new CircuitBuilder()
            .VoltageSource("Vdd", "vdd", "0", 3.3)
            .Resistor("Rs", "vdd", "pin", 10e3)
            .Resistor("Rl", "pin", "0", 10e3)
            .Add(new Diode("Dhi", "pin", "vdd", 1e-14) { SaturationReferenceCelsius = 25 })
            .Build();
        double[] temperatures = [-40, 25, 85, 125];
        var current = DcSweep.Temperature(circuit, temperatures).Current("Dhi");
        for (var i = 0; i < temperatures.Length; i++)
        {
            // Reverse-biased by 1.65 V: I ≈ −Is(T) − gmin·1.65 V, with Is(T) = Is·(T/T0)³·exp((T/T0 − 1)·EG/Vt(T)),
            // EG = 1.11 eV (SPICE2 diode temperature law, Nagel 1975, from memory).
            var t = temperatures[i] + 273.15;
            var vt = PhysicalConstants.BoltzmannJoulesPerKelvin * t / PhysicalConstants.ElementaryChargeCoulombs;
            var isat = 1e-14 * Math.Pow(t / 298.15, 3) * Math.Exp((t / 298.15 - 1) * 1.11 / vt);
            Tolerance.AssertClose(-isat - 1e-12 * 1.65, current[i], 1e-6);
        }
        // The law gives the familiar order of magnitude: about a doubling every 5–10 K near room temperature
        // (common practice, no source).
        double Junction(int i) => -current[i] - 1e-12 * 1.65;
        Assert.InRange(Math.Log2(Junction(2) / Junction(1)) / 60, 1 / 10.0, 1 / 5.0);
    }

    [Fact]
    public void A_vcvs_that_defines_its_own_control_is_a_singular_matrix_naming_it()
    {
        var circuit = new CircuitBuilder()
            .Add(new Vcvs("E1", "x", "0", "x", "0", 1))
            .Resistor("R1", "x", "0", 1e3)
            .Build();
        var e = Assert.Throws<SingularMatrixException>(() => OperatingPoint.Solve(circuit));
        Assert.Contains("E1", e.Elements);
    }
}
