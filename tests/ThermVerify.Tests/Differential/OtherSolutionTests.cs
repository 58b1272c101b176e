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
    }
}
