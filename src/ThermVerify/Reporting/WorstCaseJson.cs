using System.Text.Json;
using ThermVerify.Design;
using ThermVerify.Provenance;
using ThermVerify.Tolerances;
using static ThermVerify.Reporting.ReportJson;

namespace ThermVerify.Reporting;

/// <summary>A worst-case analysis as JSON, schema "thermverify.worstcase/1" (docs/json-output.md).</summary>
public static class WorstCaseJson
{
    public const string Schema = "thermverify.worstcase/1";

    public static string Write(WorstCaseResult r, FrontEndDesign design, RunProvenance provenance, string? designPath = null)
    {
        var worst = r.Worst;
        return JsonSerializer.Serialize(new
        {
            schema = Schema,
            tool = Tool(provenance),
            provenance = ProvenanceJson.ToJson(provenance),
            design = DesignDocument(design, designPath),
            verdict = new
            {
                withinBudget = r.WithinBudget,
                worstCelsius = worst.Celsius,
                worstLowKelvin = N(worst.LowKelvin),
                worstHighKelvin = N(worst.HighKelvin),
                worstBudgetKelvin = worst.BudgetKelvin,
                pointsOverBudget = r.Points.Count(p => !p.WithinBudget),
                points = r.Points.Count,
            },
            parameters = r.Parameters.Select(Parameter),
            cornersEvaluated = r.CornersEvaluated,
            enumeration = r.Enumeration is { } e
                ? new { corners = e.Corners, largestShortfallKelvin = e.LargestShortfallKelvin, shortfallCelsius = e.ShortfallCelsius }
                : null,
            points = r.Points.Select(p => new
            {
                celsius = p.Celsius,
                budgetKelvin = p.BudgetKelvin,
                nominalKelvin = N(p.NominalKelvin),
                lowKelvin = N(p.LowKelvin),
                highKelvin = N(p.HighKelvin),
                linearSumKelvin = N(p.LinearSumKelvin),
                rssKelvin = N(p.RssKelvin),
                sigmaKelvin = N(p.SigmaKelvin),
                noiseKelvin = p.NoiseKelvin,
                withinBudget = p.WithinBudget,
            }),
            sensitivities = r.Sensitivities.Select(s => new
            {
                key = s.Parameter.Key,
                unit = s.Parameter.Unit,
                kelvinPerUnit = s.KelvinPerUnit,
            }),
            remedyNote = r.RemedyNote,
            remedies = r.Remedies.Select(m => new
            {
                key = m.Key, action = m.Action, value = N(m.Value), unit = m.Unit, method = m.Method, proof = m.Proof,
                together = m.Together.Select(t => new { key = t.Key, action = t.Action, value = N(t.Value), unit = t.Unit, method = t.Method }),
            }),
        }, Options);
    }
}
