using ThermVerify.Api;
using ThermVerify.Design;
using ThermVerify.Tests.FrontEnd;
using ThermVerify.Tolerances;

namespace ThermVerify.Tests.Tolerances;

/// <summary>
/// The worst case of a ratiometric current source names the reference resistor's tolerance or tempco it needs. The code
/// is 2^N·R_s/R_ref: a reference resistor off by a fraction δ reads the sensor as R_s/(1 + δ) (Ohm's law twice), so its
/// share of the error at t is R_s(t)·δ/(1 + δ) over IEC 60751's slope dR/dt (the Callendar–Van Dusen equation written
/// out by hand in <see cref="CurrentDesigns"/>); a tempco α at the board's 40 °C is δ = α·15 K. Each remedy is checked
/// here again on the changed design, and a value a tenth larger must fail: the remedy is the largest that passes.
/// </summary>
public class ReferenceResistorRemedyTests
{
    private static readonly WorstCaseOptions Options = new() { Threads = 1 };

    /// <summary>A hostile design: the reference resistor of 1 % and 100 ppm/K, everything else ideal.</summary>
    private static FrontEndDesign Hostile(string tolerance, string tempco, string budget) => CurrentDesigns.Ratiometric(
        ("current_source.reference_resistor_tolerance", $"\"{tolerance}\""), ("current_source.reference_resistor_tempco", $"\"{tempco}\""),
        ("current_source.current_tolerance", "\"5 %\""), ("check.board_temperature", "\"40 degC\""), ("check.budget", $"\"{budget}\""));

    private static FrontEndDesign With(FrontEndDesign d, string key, double value) => key switch
    {
        "current_source.reference_resistor_tolerance" => d with { CurrentSource = d.CurrentSource! with { ReferenceResistorTolerance = value } },
        "current_source.reference_resistor_tempco" => d with { CurrentSource = d.CurrentSource! with { ReferenceResistorTempcoPerKelvin = value } },
        _ => throw new InvalidOperationException(key),
    };

    /// <summary>The error in K a reference resistor high by the fraction δ causes at t, first order in the slope: −R_s·δ/(1 + δ)/(dR/dt).</summary>
    private static double Kelvin(double celsius, double delta) => CurrentDesigns.Ohms(celsius) * delta / (1 + delta) / CurrentDesigns.OhmsPerKelvin(celsius);

    /// <summary>The share per unit δ at small δ: R_s/(dR/dt).</summary>
    private static double PerUnit(double celsius) => CurrentDesigns.Ohms(celsius) / CurrentDesigns.OhmsPerKelvin(celsius);

    [Fact]
    public void A_one_percent_reference_resistor_gets_the_tolerance_the_budget_allows()
    {
        var design = Hostile("1 %", "100 ppm/K", "1.5 K");
        var result = Verifier.WorstCase(design, Options);
        Assert.False(result.WithinBudget);
        // The tempco alone cannot clear it (the 1 % is 4.8 K at 200 °C by hand); the tolerance can.
        var remedy = Assert.Single(result.Remedies);
        Assert.Equal("current_source.reference_resistor_tolerance", remedy.Key);
        Assert.Empty(remedy.Together);
        var value = remedy.Value!.Value;

        // By hand at the worst point: room = budget − noise − |nominal| − the tempco's share; the tolerance takes the rest.
        var worst = result.Worst;
        var t = worst.Celsius;
        var room = worst.BudgetKelvin - worst.NoiseKelvin - Math.Abs(worst.NominalKelvin) - Kelvin(t, 100e-6 * 15);
        var byHand = room / PerUnit(t);
        Tolerance.AssertClose(byHand, value, 0.03, what: $"tolerance the budget allows at {t} °C");

        Assert.True(WorstCase.Run(With(design, remedy.Key, value), Options).WithinBudget, "the remedy's own worst case");
        Assert.False(WorstCase.Run(With(design, remedy.Key, value * 1.1), Options).WithinBudget, "a tenth more must fail");
        Assert.Contains("PASS", remedy.Proof);
        Assert.Contains("the design has 1 %", remedy.Method);
    }

    [Fact]
    public void A_tempco_that_dominates_gets_the_tempco_the_budget_allows()
    {
        var design = Hostile("0.01 %", "100 ppm/K", "0.5 K");
        var result = Verifier.WorstCase(design, Options);
        var remedy = Assert.Single(result.Remedies, r => r.Key == "current_source.reference_resistor_tempco");
        var value = remedy.Value!.Value;
        var worst = result.Worst;
        var t = worst.Celsius;
        var room = worst.BudgetKelvin - worst.NoiseKelvin - Math.Abs(worst.NominalKelvin) - Kelvin(t, 1e-4);
        var byHand = room / PerUnit(t) / 15;
        Tolerance.AssertClose(byHand, value, 0.03, what: $"tempco the budget allows at {t} °C");
        Assert.True(WorstCase.Run(With(design, remedy.Key, value), Options).WithinBudget);
        Assert.False(WorstCase.Run(With(design, remedy.Key, value * 1.1), Options).WithinBudget);
    }

    [Fact]
    public void Check_names_the_tempco_that_keeps_the_pin_within_half_an_LSB()
    {
        // In check the tempco is a bound: R_ref·(1 + α·15 K) reads the pin I·R_s·α·15/(1 + α·15) low against the reference
        // I·R_ref, which the dc-loading finding holds to ½ LSB = I·R_ref/2^17 (Ohm's law): α ≤ R_ref/(2^17·15·R_s(200 °C)).
        var design = Hostile("1 %", "100 ppm/K", "0.5 K");
        var finding = Assert.Single(ThermVerify.Check.FrontEndCheck.Run(design, new() { MaximumSamplingPoints = 3 }).Findings, f => f.Id == "dc-loading");
        var remedy = Assert.Single(finding.Remedies, r => r.Key == "current_source.reference_resistor_tempco");
        var x = 2000.0 / 131072 / CurrentDesigns.Ohms(200);
        var limit = x / (1 - x) / 15;
        Assert.InRange(remedy.Value!.Value, 0.98 * limit, limit * 1.0001);
    }

    [Fact]
    public void Neither_alone_is_combined_and_no_room_at_all_is_said()
    {
        // 0.1 % (0.48 K at 200 °C) and 100 ppm/K (0.72 K) against 0.7 K: each alone leaves the other over it.
        var both = Verifier.WorstCase(Hostile("0.1 %", "100 ppm/K", "0.7 K"), Options);
        var remedy = Assert.Single(both.Remedies);
        Assert.Single(remedy.Together);
        Assert.NotNull(both.RemedyNote);
        var changed = With(With(Hostile("0.1 %", "100 ppm/K", "0.7 K"), remedy.Key, remedy.Value!.Value), remedy.Together[0].Key, remedy.Together[0].Value!.Value);
        Assert.True(WorstCase.Run(changed, Options).WithinBudget);

        // A budget below the quantisation alone: no change of the reference resistor can help, and the result says so.
        var none = Verifier.WorstCase(Hostile("1 %", "100 ppm/K", "0.01 K"), Options);
        Assert.Empty(none.Remedies);
        Assert.Contains("no tolerance or tempco of the reference resistor", none.RemedyNote);
    }
}
