using ThermVerify.Components;
using ThermVerify.Design;
using ThermVerify.Tolerances;

namespace ThermVerify.Tests.Tolerances;

/// <summary>
/// choose-fixed on a netlist replaces the resistor [netlist] names as `fixed` with E-series values: the attic fan
/// redrawn as a netlist ranks the candidates as the built-in shape does, and the kiln vent's slope objective picks the
/// value the network worked by hand picks.
/// </summary>
public class NetlistFixedResistorTests
{
    private static FrontEndDesign Example(string file) => DesignLoader.Load(Path.Combine(Repository.Netlists, file));

    [Theory]
    [InlineData(FixedResistorObjective.WorstError)]
    [InlineData(FixedResistorObjective.SlopeAt)]
    public void The_attic_fan_as_a_netlist_ranks_the_candidates_as_the_built_in_shape(FixedResistorObjective objective)
    {
        var options = new FixedResistorSearchOptions { MinimumOhms = 800e3, MaximumOhms = 1.3e6, Objective = objective, Threads = 2 };
        var shape = FixedResistorSearch.Run(Example("attic-fan-leaky-pin.toml"), options);
        var netlist = FixedResistorSearch.Run(Example("attic-fan-leaky-pin-netlist.toml"), options);
        Assert.Equal(shape.Select(c => (c.Ohms, c.IsPresent, c.WithinBudget)), netlist.Select(c => (c.Ohms, c.IsPresent, c.WithinBudget)));
        Assert.Contains(netlist, c => c.IsPresent && c.Ohms == 1e6);
        for (var i = 0; i < shape.Count; i++)
        {
            var at = $"{shape[i].Ohms} Ω";
            Tolerance.AssertClose(shape[i].SlopeVoltsPerKelvin, netlist[i].SlopeVoltsPerKelvin, 1e-9, 0, $"slope, {at}");
            if (objective == FixedResistorObjective.WorstError)
            {
                Tolerance.AssertClose(shape[i].WorstErrorKelvin, netlist[i].WorstErrorKelvin, 0, 1e-6, $"worst error, {at}");
                Tolerance.AssertClose(shape[i].WorstKelvinPerLsb, netlist[i].WorstKelvinPerLsb, 1e-9, 0, $"resolution, {at}");
            }
        }
    }

    [Fact]
    public void The_kiln_vents_steepest_top_resistor_is_the_one_worked_by_hand()
    {
        // v = E·R_p/(R_p + R_t) with R_p = R_ntc ∥ R_lin (Ohm's law); dv/dT = E·R_t/(R_p + R_t)²·dR_p/dT, and dR_p/dT does
        // not depend on R_t, so the candidates rank by R_t/(R_p + R_t)², largest at R_t = R_p (common practice: match
        // the fixed resistor to the sensor's side at mid-range). At 50 °C, R_ntc = 10k·exp(3435·(1/323.15 − 1/298.15)).
        var design = Example("kiln-vent-two-stage.toml");
        design = design with { Netlist = design.Netlist! with { FixedElement = "Rtop" } };
        var rntc = 10e3 * Math.Exp(3435 * (1 / 323.15 - 1 / 298.15));
        var rp = rntc * 22e3 / (rntc + 22e3);
        var ranked = FixedResistorSearch.Run(design, new FixedResistorSearchOptions { Objective = FixedResistorObjective.SlopeAt, SlopeCelsius = 50, Threads = 2 });
        var expected = ranked.Select(c => c.Ohms).MaxBy(rt => rt / Math.Pow(rp + rt, 2));
        Assert.Equal(expected, ranked[0].Ohms);
        Assert.Equal(ESeries.E96.Nearest(rp), ranked[0].Ohms);
        Assert.Equal(3480, ranked[0].Ohms, 6);
        // The present 6.8 kΩ is ranked and marked.
        Assert.Contains(ranked, c => c.IsPresent && Math.Abs(c.Ohms - 6800) < 1e-6);
    }

    [Fact]
    public void A_netlist_that_names_no_fixed_resistor_is_refused_with_the_key_to_add()
    {
        var e = Assert.Throws<DesignException>(() => FixedResistorSearch.Run(Example("kiln-vent-two-stage.toml")));
        Assert.Equal("netlist.fixed", e.KeyPath);
        Assert.Contains("fixed = \"Rtop\"", e.Message);
    }
}
