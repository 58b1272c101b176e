using ThermVerify.Components;
using ThermVerify.Design;
using ThermVerify.Tests.FrontEnd;
using ThermVerify.Tolerances;

namespace ThermVerify.Tests.Tolerances;

/// <summary>
/// choose-fixed on a ratiometric current source chooses the reference resistor: the code is 2^N·G·R_s/R_ref, so the
/// LSB in kelvin is R_ref/(G·2^N·dR_s/dT) (Ohm's law twice, IEC 60751's slope by hand), and no candidate below G·R_s(max)
/// (where the signal would leave the reference) is tried.
/// </summary>
public class ReferenceResistorChoiceTests
{
    private static readonly FixedResistorSearchOptions Options = new() { Series = ESeries.E12, Threads = 1 };

    [Fact]
    public void Candidates_start_where_the_signal_fits_and_their_resolution_is_R_ref_over_2_to_the_N_dR_dT()
    {
        var ranked = FixedResistorSearch.Run(CurrentDesigns.Ratiometric(), Options);
        var smallest = CurrentDesigns.Ohms(200);
        Assert.All(ranked.Where(c => !c.IsPresent), c => Assert.InRange(c.Ohms, smallest, 4 * smallest));
        Assert.Contains(ranked, c => c.IsPresent && c.Ohms == 2000);
        foreach (var c in ranked)
            // dR/dT is smallest at 200 °C (B < 0), so the LSB in K is largest there.
            Tolerance.AssertClose(c.Ohms / 65536 / CurrentDesigns.OhmsPerKelvin(200), c.WorstKelvinPerLsb, 1e-6, what: $"K per LSB at {c.Ohms} Ω");
        // Ranked by the worst error: a finer LSB reads closer, so the smallest reference that fits comes first here.
        Assert.Equal(ranked.Where(c => !c.IsPresent).Min(c => c.Ohms), ranked[0].Ohms);
    }

    [Fact]
    public void A_gain_stage_moves_the_smallest_candidate_up_by_the_gain()
    {
        var ranked = FixedResistorSearch.Run(CurrentDesigns.Ratiometric(("adc.gain", "4"), ("current_source.reference_resistor", "\"1 kohm\"")), Options);
        Assert.All(ranked.Where(c => !c.IsPresent), c => Assert.True(c.Ohms >= 4 * CurrentDesigns.Ohms(200), $"{c.Ohms} Ω"));
    }

    [Fact]
    public void The_slope_objective_and_a_fixed_reference_are_refused_with_what_to_do()
    {
        var slope = Assert.Throws<DesignException>(() => FixedResistorSearch.Run(CurrentDesigns.Ratiometric(), Options with { Objective = FixedResistorObjective.SlopeAt }));
        Assert.Contains("worst error or the resolution", slope.Message);
        var fixedReference = Assert.Throws<DesignException>(() => FixedResistorSearch.Run(CurrentDesigns.Pt100(), Options));
        Assert.Contains("reference_resistor", fixedReference.Message);
    }
}
