using ThermVerify.Components;
using ThermVerify.Design;
using ThermVerify.Tolerances;

namespace ThermVerify.Tests.Tolerances;

/// <summary>
/// choose-fixed on a bridge (netlists/fermenter-pt1000-bridge.toml: a Pt1000 low in a 4.99 kΩ half at 2.5 V, the
/// opposite half 4.99 kΩ over 953 Ω) chooses the sensor half's fixed resistor and keeps the balance. By hand: the
/// bridge nulls where R_s/R_f = R_low/R_high (the bridge equation, Kirchhoff's laws on two dividers), so R_low′ =
/// R_high·R_b/R_f′ with R_b = 953 Ω; the quarter bridge's sensitivity |dV_d/dT| = E·R_f/(R_s + R_f)²·dR_s/dT (V− does not
/// move) is largest at R_f = R_s (common practice, from memory: d/dR_f of R_f/(R_s + R_f)² vanishes there). R_s(t) is
/// IEC 60751's Callendar–Van Dusen equation for t ≥ 0 °C (from memory: A = 3.9083e-3, B = −5.775e-7).
/// </summary>
public class BridgeFixedChoiceTests
{
    private const double A = 3.9083e-3, B = -5.775e-7, E = 2.5, High = 4990, Balance = 953;

    private static double Pt1000(double t) => 1000 * (1 + A * t + B * t * t);

    private static double Slope(double t) => 1000 * (A + 2 * B * t);

    private static FrontEndDesign Fermenter() => DesignLoader.Load(Path.Combine(Repository.Netlists, "fermenter-pt1000-bridge.toml"));

    [Fact]
    public void The_slope_objective_ranks_by_the_quarter_bridge_sensitivity_whose_maximum_is_at_R_f_equal_R_s()
    {
        var ranked = FixedResistorSearch.Run(Fermenter(), new FixedResistorSearchOptions
        {
            Objective = FixedResistorObjective.SlopeAt, SlopeCelsius = 75, Series = ESeries.E96, Threads = 1,
        });
        double Hand(double rf) => E * rf / Math.Pow(Pt1000(75) + rf, 2) * Slope(75);
        foreach (var c in ranked)
            Tolerance.AssertClose(Hand(c.Ohms), c.SlopeVoltsPerKelvin, 1e-9, what: $"|dV_d/dT| at {c.Ohms} Ω");
        // The best candidate is the series value nearest R_s(75 °C) = 1289.9 Ω: 1.30 kΩ (E96: 1.27k, 1.30k, 1.33k).
        Assert.Equal(ranked.Where(c => !c.IsPresent).MaxBy(c => Hand(c.Ohms))!.Ohms, ranked[0].Ohms);
        Assert.InRange(ranked[0].Ohms / Pt1000(75), 1 / 1.025, 1.025);
    }

    [Fact]
    public void Every_candidate_keeps_the_balance_by_re_balancing_the_opposite_low_resistor()
    {
        var ranked = FixedResistorSearch.Run(Fermenter(), new FixedResistorSearchOptions { Series = ESeries.E24, Threads = 1 });
        Assert.Contains(ranked, c => c.IsPresent && c.Ohms == 4990 && Math.Abs(c.OppositeLowOhms!.Value - 953) < 1e-9);
        foreach (var c in ranked)
            Tolerance.AssertClose(High * Balance / c.Ohms, c.OppositeLowOhms!.Value, 1e-12, what: $"R_low for R_f = {c.Ohms} Ω");
        // A smaller fixed resistor drives more current through the Pt1000 (self-heating ∝ (E/(R_s + R_f))²·R_s): every
        // E24 value of the default range (R_s over 0 °C .. 150 °C) reads worse than the design's own 4.99 kΩ.
        Assert.True(ranked[0].IsPresent);
        Assert.All(ranked.Skip(1), c => Assert.True(c.MaximumSelfHeatingKelvin > ranked[0].MaximumSelfHeatingKelvin));
    }
}
