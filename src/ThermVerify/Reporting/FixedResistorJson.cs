using System.Text.Json;
using ThermVerify.Design;
using ThermVerify.Provenance;
using ThermVerify.Tolerances;
using static ThermVerify.Reporting.ReportJson;

namespace ThermVerify.Reporting;

/// <summary>A fixed-resistor search as JSON, schema "thermverify.fixed/1" (docs/json-output.md).</summary>
public static class FixedResistorJson
{
    public const string Schema = "thermverify.fixed/1";

    public static string Write(IReadOnlyList<FixedResistorCandidate> ranked, FrontEndDesign design, FixedResistorSearchOptions options, RunProvenance provenance, string? designPath = null)
    {
        var slopeOnly = options.Objective == FixedResistorObjective.SlopeAt;
        var range = design.Check.Range;
        return JsonSerializer.Serialize(new
        {
            schema = Schema,
            tool = Tool(provenance),
            provenance = ProvenanceJson.ToJson(provenance),
            design = DesignDocument(design, designPath),
            search = new
            {
                series = options.Series.Name.ToString(),
                objective = ObjectiveName(options.Objective),
                slopeCelsius = options.SlopeCelsius ?? (range.MinCelsius + range.MaxCelsius) / 2,
                presentOhms = FixedResistorSearch.PresentOhms(design),
                part = FixedResistorSearch.PartName(design),
                presentRank = ranked.Select((c, i) => (c, i)).Where(x => x.c.IsPresent).Select(x => (int?)(x.i + 1)).FirstOrDefault(),
                candidates = ranked.Count,
            },
            candidates = ranked.Select((c, i) => new
            {
                rank = i + 1,
                ohms = c.Ohms,
                worstErrorKelvin = N(c.WorstErrorKelvin),
                worstErrorCelsius = N(c.WorstErrorCelsius),
                worstKelvinPerLsb = N(c.WorstKelvinPerLsb),
                slopeVoltsPerKelvin = c.SlopeVoltsPerKelvin,
                maximumSelfHeatingKelvin = N(c.MaximumSelfHeatingKelvin),
                withinBudget = slopeOnly ? (bool?)null : c.WithinBudget,
                marginKelvin = slopeOnly ? null : N(c.MarginKelvin),
                present = c.IsPresent,
                oppositeLowOhms = c.OppositeLowOhms,
            }),
        }, Options);
    }

    public static string ObjectiveName(FixedResistorObjective objective) => objective switch
    {
        FixedResistorObjective.WorstResolution => "resolution",
        FixedResistorObjective.SlopeAt => "slope",
        _ => "error",
    };
}
