using ThermVerify.Circuits;
using ThermVerify.Simulation;

namespace ThermVerify.Tests.Simulation;

/// <summary>
/// A diode held forward by a voltage-defined branch (distilled from differential seed 223; seeds 237 and
/// 141 hold a diode the same way, see <c>Differential/SeedRegressionTests</c>): its voltage is
/// the branch's, so nothing in the circuit limits its current, Is·e^(V/Vt), which at volts is astronomical (1e58 A,
/// 1e121 A) and whose conductance swallows in rounding every other term of its nodes' equations. The engine refuses
/// such a circuit with the nodes and elements named rather than returning noise; a few hundred millivolts are solved.
/// </summary>
public class ForwardDiodeAcrossSourceTests
{
    /// <summary>
    /// E1 holds D1 at gain·1 V; the island {a, b} is tied to ground only by R1 and R2 (1 kΩ each), so by Kirchhoff's
    /// current law on the island (a − 0)/R1 + (b − 0)/R2 = 0 and a − b = gain·1 V: a = gain/2 V, b = −gain/2 V, whatever
    /// the diode carries (the diode's and E1's currents stay inside the island).
    /// </summary>
    private static Circuit Held(double gain) => new(
    [
        new VoltageSource("V1", "in", "0", new DcWaveform(1)),
        new Resistor("Rload", "in", "0", 1e3),
        new Vcvs("E1", "a", "b", "in", "0", gain),
        new Diode("D1", "a", "b"),
        new Resistor("R1", "a", "0", 1e3),
        new Resistor("R2", "b", "0", 1e3),
    ]);

    [Fact]
    public void Held_at_a_few_hundred_millivolts_it_is_solved_to_the_closed_form()
    {
        var op = OperatingPoint.Solve(Held(0.3));
        Tolerance.AssertClose(0.15, op.Voltage("a"), 1e-12, 1e-15);
        Tolerance.AssertClose(-0.15, op.Voltage("b"), 1e-12, 1e-15);
    }

    [Fact]
    public void Held_at_8_V_it_is_refused_as_having_lost_its_digits_naming_the_island()
    {
        // D1 would carry 1e-14·e^(8/0.0257) ≈ 1e121 A; its conductance (1e122 S) absorbs R1 and R2 (1e-3 S) in the sums
        // of the rows of a and b, so the island's current law, the only equation for its common voltage, is lost to
        // rounding: the factorisation meets an exactly vanishing pivot. Before the fix this was reported as a singular
        // matrix at I(E1), which points at the wrong element; ngspice 39 returns an answer whose island current law is
        // off by amperes (differential seed 223: 0.15 A through a 29 Ω resistor into a supernode that has no other path).
        var e = Assert.Throws<IllConditionedMatrixException>(() => OperatingPoint.Solve(Held(8)));
        Assert.Contains("a", e.Unknowns);
        Assert.Contains("b", e.Unknowns);
        Assert.Contains("D1", e.Elements);
        Assert.Contains("E1", e.Elements);
    }

    /// <summary>
    /// Differential seed 473, distilled: V1 and V2 in series hold D1 forward at 4.459 V (1.7e28 A, 3.7e29 S), and two
    /// capacitors hang on the same nodes. By Kirchhoff's voltage law n1 = −1.087 V and n2 = −4.459 V at every instant,
    /// and no current flows in R3 and R4 (n3 = n2). The operating point was solved, but the transient's first step collapsed at
    /// t = 0: the capacitors' C/h changed the pivot order, the diode's row became the pivot of n2's column and absorbed
    /// the ±1 of V2's branch current, the two sources' rows became equal in rounding, and the solve returned noise
    /// (n1 off by 3 mV). ngspice 39 completes it at the same voltages.
    /// </summary>
    [Fact]
    public void Held_forward_by_two_stacked_sources_its_nodes_keep_the_sources_voltages_in_a_transient()
    {
        var circuit = new Circuit(
        [
            new Resistor("R1", "n1", "0", 4637.6),
            new Resistor("R2", "n2", "n1", 132.2),
            new Resistor("R3", "n3", "n2", 1361),
            new VoltageSource("V1", "n1", "0", new DcWaveform(-1.087)),
            new Diode("D1", "0", "n2", 3.86e-14, 1.82),
            new Capacitor("C1", "n1", "n2", 8.45e-12),
            new VoltageSource("V2", "n2", "n1", new DcWaveform(-3.372)),
            new Capacitor("C2", "n2", "0", 1.34e-12),
            new Resistor("R4", "n3", "n2", 14.5),
        ], temperatureCelsius: 23);
        var result = Transient.Run(circuit, new TransientOptions { StopTimeSeconds = 1e-6, MaxStepSeconds = 1e-8 });
        Assert.Equal(1e-6, result.EndTimeSeconds, 12);
        foreach (var t in new[] { 0, 1e-15, 1e-9, 3.3e-7, 1e-6 })
        {
            Tolerance.AssertClose(-1.087, result.VoltageAt("n1", t), 1e-12, 1e-15);
            Tolerance.AssertClose(-4.459, result.VoltageAt("n2", t), 1e-12, 1e-15);
            Tolerance.AssertClose(-4.459, result.VoltageAt("n3", t), 1e-12, 1e-15);
        }
    }
}
