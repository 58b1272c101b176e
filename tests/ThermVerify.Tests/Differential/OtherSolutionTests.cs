using ThermVerify.Circuits;
using ThermVerify.Tests.Ngspice;

namespace ThermVerify.Tests.Differential;

/// <summary>
/// The "another DC solution" check of the differential run (<see cref="OtherSolution"/>): Newton is started at
/// ngspice's point, which must be put there whole — a diode's internal node derived from its terminals, each stamp's
/// step limiting walked to the seeded voltages — or Newton leaves it whether or not it is a solution.
/// </summary>
public class OtherSolutionTests
{
    /// <summary>Shockley's law with a series resistance, forwards: a junction at v_j carries I = I_s·(e^(v_j/V_t) − 1)
    /// + gmin·v_j, so the anode sits at v_j + R_s·I; the derived internal node must come back to v_j.</summary>
    [Theory]
    [InlineData(0.65, 10)]
    [InlineData(0.3, 1e3)]
    [InlineData(-2, 5)]
    public void A_diodes_internal_node_is_derived_from_its_terminals(double junction, double seriesOhms)
    {
        var diode = new Diode("D1", "a", "k", 1e-14, 1.3, seriesOhms);
        const double cathode = 0.1, gmin = 1e-12;
        var vt = 1.3 * ThermVerify.Quantities.PhysicalConstants.ThermalVolts(25);
        var current = 1e-14 * (Math.Exp((junction - cathode) / vt) - 1) + gmin * (junction - cathode);
        var anode = junction + seriesOhms * current;
        Assert.Equal(junction, OtherSolution.JunctionVolts(diode, anode, cathode, 25, gmin), 12);
    }

    /// <summary>
    /// Seed 1001 (11 nodes, an op-amp, four diodes, one with a series resistance): the engines' operating points are
    /// 0.39 of the scale apart. Started at ngspice's point as it was seeded before (the diode's internal node at 0 V, the
    /// limiting from 0 V), Newton went to the engine's own point; seeded whole, it stays at ngspice's, so both points
    /// solve the engine's equations: two DC solutions.
    /// </summary>
    [NgspiceFact]
    public void Seed_1001_has_two_DC_solutions_and_both_engines_found_one()
    {
        var rc = RandomCircuitGenerator.Generate(1001, CircuitClass.Nonlinear, 15)!;
        var result = DifferentialCase.Run(rc, new HashSet<DifferentialAnalysis> { DifferentialAnalysis.OperatingPoint });
        var op = result.Comparisons.Single();
        Assert.True(op.Difference > 0.1, $"the engines agree ({op.Difference}): nothing to explain");
        Assert.StartsWith("multiple DC solutions", op.Explanation);
        // Its AC, linearised about ngspice's point, agrees; the slew-tanh view, whose slope underflows to zero on the
        // saturated U1 there, once threw and was counted as the engine's failure. An explanation never fails an analysis.
        var ac = DifferentialCase.Run(rc, new HashSet<DifferentialAnalysis> { DifferentialAnalysis.Ac }).Comparisons.Single();
        Assert.Null(ac.OursFailure);
        Assert.StartsWith("linearised about another DC solution", ac.Explanation);
    }

    /// <summary>
    /// The current-law check on a divider (V1 = 3 V, R1 = 1 kΩ over R2 = 2 kΩ; Ohm's law: mid = 2 V, 1 mA): at the right
    /// voltages the residual is rounding; with mid at 1.9 V, 0.15 mA is missing at mid — 1.1 mA in through R1, 0.95 mA out through R2.
    /// </summary>
    [Theory]
    [InlineData(2.0, 0)]
    [InlineData(1.9, 1.5e-4)]
    public void The_current_law_residual_of_a_point_is_the_current_missing_at_its_worst_node(double mid, double missing)
    {
        var circuit = new Circuit(
        [
            new VoltageSource("V1", "in", "0", new DcWaveform(3)),
            new Resistor("R1", "in", "mid", 1e3),
            new Resistor("R2", "mid", "0", 2e3),
        ]);
        var plot = new ThermVerify.Ngspice.NgspicePlot("op1", "divider", new Dictionary<string, ThermVerify.Ngspice.NgspiceVector>
        {
            ["in"] = new("in", [3.0], null),
            ["mid"] = new("mid", [mid], null),
            ["v1#branch"] = new("v1#branch", [-(3 - mid) / 1e3], null),
        });
        var (amperes, _, node) = OtherSolution.CurrentLawResidual(circuit, plot, 0, _ => { });
        Assert.Equal(missing, amperes, 1e-15);
        if (missing > 0)
            Assert.Equal("mid", node);
    }

    /// <summary>
    /// Seed 1087: ngspice's gmin and source stepping fail, its transient op returns a point where 0.2 mA still flows into
    /// the capacitors on n3; that is no DC solution (the engines are 0.87 of the scale apart), and its AC is linearised
    /// there. Seed 1083: every node is at 0 V in the engine and 4e-25 V in ngspice, so the relative measure says 1.
    /// </summary>
    [NgspiceFact]
    public void Seeds_1083_and_1087_disagreements_are_explained_by_a_check()
    {
        var wrong = DifferentialCase.Run(RandomCircuitGenerator.Generate(1087, CircuitClass.Nonlinear, 15)!,
            new HashSet<DifferentialAnalysis> { DifferentialAnalysis.OperatingPoint, DifferentialAnalysis.Ac });
        Assert.StartsWith("ngspice's answer is not a DC solution: at n3", wrong.Comparisons[0].Explanation);
        Assert.Contains("transient op", wrong.Comparisons[0].Explanation);
        Assert.StartsWith("linearised about ngspice's operating point, which is not a DC solution", wrong.Comparisons[1].Explanation);
        var zero = DifferentialCase.Run(RandomCircuitGenerator.Generate(1083, CircuitClass.Nonlinear, 15)!,
            new HashSet<DifferentialAnalysis> { DifferentialAnalysis.OperatingPoint });
        Assert.StartsWith("nothing to compare", zero.Comparisons[0].Explanation);
    }
}
