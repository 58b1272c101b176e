using System.Text.Json;
using ThermVerify.Design;
using ThermVerify.Provenance;
using ThermVerify.Tolerances;
using static ThermVerify.Reporting.ReportJson;

namespace ThermVerify.Reporting;

/// <summary>A Monte Carlo run as JSON, schema "thermverify.montecarlo/1" (docs/json-output.md).</summary>
public static class MonteCarloJson
{
    public const string Schema = "thermverify.montecarlo/1";

    public static string Write(MonteCarloResult r, FrontEndDesign design, RunProvenance provenance, string? designPath = null, bool simulatedUnitSettling = true) =>
        JsonSerializer.Serialize(new
        {
            schema = Schema,
            tool = Tool(provenance),
            provenance = ProvenanceJson.ToJson(provenance),
            design = DesignDocument(design, designPath),
            run = new { units = r.Units, seed = r.Seed, unitSettlingSimulated = simulatedUnitSettling },
            parameters = r.Parameters.Select(Parameter),
            yield = new
            {
                unitsWithinBudget = r.UnitsWithinBudget,
                units = r.Units,
                fraction = r.Yield,
                standardError = r.YieldStandardError,
                largestNoiseKelvin = r.LargestNoiseKelvin,
            },
            maximumSelfHeatingKelvin = r.MaximumSelfHeatingKelvin,
            channelSwitch = r.ChannelSwitch is { } s
                ? new { celsius = s.Celsius, budgetKelvin = s.BudgetKelvin, nominalKelvin = s.NominalKelvin, worstKelvin = s.WorstKelvin, unitsOver = s.UnitsOver }
                : null,
            percentiles = r.Percentiles,
            envelope = r.Envelope.Select(e => new
            {
                celsius = e.Celsius,
                budgetKelvin = e.BudgetKelvin,
                nominalErrorKelvin = N(e.NominalErrorKelvin),
                minKelvin = N(e.MinKelvin),
                percentilesKelvin = e.PercentileKelvin.Select(p => N(p)),
                maxKelvin = N(e.MaxKelvin),
                meanKelvin = N(e.MeanKelvin),
                standardDeviationKelvin = N(e.StandardDeviationKelvin),
            }),
            contributors = new
            {
                celsius = r.ContributorsCelsius,
                varianceKelvinSquared = r.VarianceKelvinSquared,
                shares = r.Contributors.Select(s => new
                {
                    key = s.Key,
                    kind = s.Kind?.ToString(),
                    share = s.Share,
                    kelvinPerUnit = N(s.KelvinPerUnit),
                }),
            },
            worstErrorHistogram = new
            {
                lowerEdgesKelvin = r.WorstErrors.LowerEdgesKelvin,
                binWidthKelvin = r.WorstErrors.BinWidthKelvin,
                counts = r.WorstErrors.Counts,
            },
            units = Enumerable.Range(0, r.Units).Select(u => new
            {
                worstErrorKelvin = N(r.WorstErrorKelvin[u]),
                worstCelsius = r.WorstCelsius[u],
                withinBudget = r.UnitWithinBudget[u],
                deviations = r.Deviations[u],
            }),
        }, Options);
}
