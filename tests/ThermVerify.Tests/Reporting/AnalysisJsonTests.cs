using System.Text.Json;
using ThermVerify.Reporting;

namespace ThermVerify.Tests.Reporting;

/// <summary>The JSON of the tolerance analyses against the results they come from (docs/json-output.md).</summary>
public class AnalysisJsonTests(AnalysisFixture fixture) : IClassFixture<AnalysisFixture>
{
    private JsonElement MonteCarlo() => JsonDocument.Parse(MonteCarloJson.Write(fixture.MonteCarlo, fixture.Design, TestRun.Provenance, "test.toml")).RootElement;

    [Fact]
    public void Monte_carlo_yield_is_the_fraction_of_units_within_budget_in_the_unit_data()
    {
        var root = MonteCarlo();
        Assert.Equal("thermverify.montecarlo/1", root.GetProperty("schema").GetString());
        var units = root.GetProperty("units").EnumerateArray().ToList();
        Assert.Equal(fixture.MonteCarlo.Units, units.Count);
        var within = units.Count(u => u.GetProperty("withinBudget").GetBoolean());
        var yield = root.GetProperty("yield");
        Assert.Equal(within, yield.GetProperty("unitsWithinBudget").GetInt32());
        Assert.Equal((double)within / units.Count, yield.GetProperty("fraction").GetDouble());
        // The fixture's design has one budget over the whole range, and each unit's error must leave room for the noise
        // (at most largestNoiseKelvin at any temperature; docs/tolerances.md): a unit whose largest |error| leaves that
        // much is within budget, and one whose largest |error| exceeds the budget itself is not.
        var budget = fixture.Design.Check.BudgetKelvin;
        var room = yield.GetProperty("largestNoiseKelvin").GetDouble();
        Assert.True(room > 0, "the converter's assumed noise takes some of the budget");
        foreach (var u in units)
        {
            var worst = u.GetProperty("worstErrorKelvin").ValueKind == JsonValueKind.Number ? Math.Abs(u.GetProperty("worstErrorKelvin").GetDouble()) : double.NaN;
            var isWithin = u.GetProperty("withinBudget").GetBoolean();
            if (worst + room <= budget) Assert.True(isWithin, $"|error| {worst} K leaves the {room} K of noise");
            if (!(worst <= budget)) Assert.False(isWithin, $"|error| {worst} K is over the budget itself");
        }
        // Neither 0 nor 1, or the checks above could not tell a wrong count from a right one.
        Assert.InRange(within, 1, units.Count - 1);
        // Binomial standard error √(y(1 − y)/N) (definition).
        var y = (double)within / units.Count;
        Tolerance.AssertClose(Math.Sqrt(y * (1 - y) / units.Count), yield.GetProperty("standardError").GetDouble(), 1e-12, 0, "standard error");
    }

    [Fact]
    public void Monte_carlo_envelope_is_ordered_from_min_through_the_percentiles_to_max()
    {
        var root = MonteCarlo();
        var percentiles = root.GetProperty("percentiles").EnumerateArray().Select(p => p.GetDouble()).ToList();
        Assert.Equal(percentiles.Order(), percentiles);
        var envelope = root.GetProperty("envelope").EnumerateArray().ToList();
        Assert.Equal(fixture.MonteCarlo.Envelope.Count, envelope.Count);
        foreach (var e in envelope)
        {
            double[] chain = [e.GetProperty("minKelvin").GetDouble(), .. e.GetProperty("percentilesKelvin").EnumerateArray().Select(p => p.GetDouble()), e.GetProperty("maxKelvin").GetDouble()];
            Assert.Equal(percentiles.Count + 2, chain.Length);
            for (var i = 1; i < chain.Length; i++) Assert.True(chain[i - 1] <= chain[i], $"envelope not ordered at {e.GetProperty("celsius")} °C: {string.Join(", ", chain)}");
            Assert.InRange(e.GetProperty("meanKelvin").GetDouble(), chain[0], chain[^1]);
        }
        // The units' worst errors: every one lies inside the envelope's extremes at its own worst temperature.
        var byCelsius = envelope.ToDictionary(e => e.GetProperty("celsius").GetDouble());
        foreach (var u in root.GetProperty("units").EnumerateArray())
        {
            var e = byCelsius[u.GetProperty("worstCelsius").GetDouble()];
            Assert.InRange(u.GetProperty("worstErrorKelvin").GetDouble(), e.GetProperty("minKelvin").GetDouble(), e.GetProperty("maxKelvin").GetDouble());
        }
    }

    [Fact]
    public void Monte_carlo_contributors_share_the_whole_variance_and_the_histogram_every_unit()
    {
        var root = MonteCarlo();
        var shares = root.GetProperty("contributors").GetProperty("shares").EnumerateArray().ToList();
        Tolerance.AssertClose(1, shares.Sum(s => s.GetProperty("share").GetDouble()), 1e-9, 0, "sum of the shares");
        Assert.Equal(fixture.MonteCarlo.Parameters.Count + 1, shares.Count);
        var counts = root.GetProperty("worstErrorHistogram").GetProperty("counts").EnumerateArray().Sum(c => c.GetInt32());
        Assert.Equal(fixture.MonteCarlo.Units, counts);
        foreach (var u in root.GetProperty("units").EnumerateArray())
            Assert.Equal(fixture.MonteCarlo.Parameters.Count, u.GetProperty("deviations").GetArrayLength());
    }

    [Fact]
    public void Worst_case_json_holds_the_band_and_rss_never_exceeds_the_linear_sum()
    {
        var root = JsonDocument.Parse(WorstCaseJson.Write(fixture.WorstCase, fixture.Design, TestRun.Provenance)).RootElement;
        Assert.Equal("thermverify.worstcase/1", root.GetProperty("schema").GetString());
        var points = root.GetProperty("points").EnumerateArray().ToList();
        Assert.Equal(fixture.WorstCase.Points.Count, points.Count);
        Assert.Equal(points.All(p => p.GetProperty("withinBudget").GetBoolean()), root.GetProperty("verdict").GetProperty("withinBudget").GetBoolean());
        foreach (var p in points)
        {
            // √Σx² ≤ Σ|x| (the 2-norm never exceeds the 1-norm).
            Assert.True(p.GetProperty("rssKelvin").GetDouble() <= p.GetProperty("linearSumKelvin").GetDouble() + 1e-15);
            Assert.True(p.GetProperty("lowKelvin").GetDouble() <= p.GetProperty("highKelvin").GetDouble());
        }
        foreach (var s in root.GetProperty("sensitivities").EnumerateArray())
            Assert.Equal(points.Count, s.GetProperty("kelvinPerUnit").GetArrayLength());
        Assert.Equal(JsonValueKind.Object, root.GetProperty("enumeration").ValueKind);
    }

    [Fact]
    public void Fixed_json_ranks_by_the_worst_error()
    {
        var root = JsonDocument.Parse(FixedResistorJson.Write(fixture.Fixed, fixture.Design, fixture.FixedOptions, TestRun.Provenance)).RootElement;
        Assert.Equal("thermverify.fixed/1", root.GetProperty("schema").GetString());
        Assert.Equal("E12", root.GetProperty("search").GetProperty("series").GetString());
        var candidates = root.GetProperty("candidates").EnumerateArray().ToList();
        // E12 from 3.3 kΩ to 33 kΩ: 3.3, 3.9, 4.7, 5.6, 6.8, 8.2, then the same times ten, then 33 k (IEC 60063).
        Assert.Equal(13, candidates.Count);
        Assert.Equal(Enumerable.Range(1, 13), candidates.Select(c => c.GetProperty("rank").GetInt32()));
        var errors = candidates.Select(c => Math.Abs(c.GetProperty("worstErrorKelvin").GetDouble())).ToList();
        Assert.Equal(errors.Order(), errors);
        // The design's 10 kΩ is an E12 value inside the range, so it has a rank.
        Assert.Equal(JsonValueKind.Number, root.GetProperty("search").GetProperty("presentRank").ValueKind);
    }

    [Fact]
    public void No_document_holds_nan_or_infinity()
    {
        foreach (var text in new[] { MonteCarloJson.Write(fixture.MonteCarlo, fixture.Design, TestRun.Provenance), WorstCaseJson.Write(fixture.WorstCase, fixture.Design, TestRun.Provenance),
                     FixedResistorJson.Write(fixture.Fixed, fixture.Design, fixture.FixedOptions, TestRun.Provenance) })
        {
            Assert.DoesNotContain("NaN", text);
            Assert.DoesNotContain("Infinity", text);
        }
    }
}
