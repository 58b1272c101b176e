using System.Globalization;
using ThermVerify.Design;
using ThermVerify.FrontEnd;
using ThermVerify.Provenance;
using ThermVerify.Reporting.Plots;
using ThermVerify.Tolerances;
using static ThermVerify.Reporting.Text.ToleranceText;

namespace ThermVerify.Reporting;

/// <summary>The report page of a worst-case analysis: the band, the enumeration check, the sensitivities at the worst point, the tolerances.</summary>
public static class WorstCaseReport
{
    public static AnalysisReport Build(WorstCaseResult r, FrontEndDesign design, RunProvenance provenance, string designFile)
    {
        var model = new ClosedFormModel(design);
        var worst = r.Worst;
        var verdict = I($"{(r.WithinBudget ? "PASS" : "FAIL")}: worst case {Kelvin(worst.LowKelvin)} K to {Kelvin(worst.HighKelvin)} K at {worst.Celsius:0.##} °C (budget ±{worst.BudgetKelvin:0.###} K)") +
                      (r.WithinBudget ? "" : I($"; {r.Points.Count(p => !p.WithinBudget)} of {r.Points.Count} temperatures over budget"));
        var enumeration = r.Enumeration switch
        {
            null => "The tolerances are too many to enumerate every corner; the band rests on the sensitivities' corners alone.",
            { LargestShortfallKelvin: <= 1e-9 } e => I($"All {e.Corners} corners enumerated (unquantised, nominal settling): the sensitivities' corners are the extremes."),
            var e => I($"All {e.Corners} corners enumerated (unquantised, nominal settling): the sensitivities' corners fall short of the extremes by up to {e.LargestShortfallKelvin * 1e3:0.###} mK at {e.ShortfallCelsius:0.##} °C."),
        };
        ReportSection[] sections =
        [
            new("band", "Worst-case band",
            [
                I($"{r.Parameters.Count} tolerances, {r.CornersEvaluated} corners verified in full. {enumeration}"),
                .. (design.Adc.Kind == ConverterKind.DeltaSigma ? [MonteCarloReport.Sentence(DeltaSigmaUnit.StaticReadingNote)] : Array.Empty<string>()),
                "Reported minus true, in K: the two corners' errors, the nominal unit, the linear sum Σ|sᵢ·aᵢ|, the root sum of squares √Σ(sᵢ·aᵢ)² and the standard deviation √Σ(sᵢ·σᵢ)²; --json holds every temperature.",
            ], [BandTable(r)]),
            new("sensitivities", "Sensitivities", [I($"The error each tolerance causes at its full value at {worst.Celsius:0.##} °C (central difference at ±a), largest first.")], [SensitivityTable(r)]),
            new("tolerances", "Tolerances", ["Every nonzero tolerance of the design (docs/tolerances.md)."], [Table(r.Parameters)]),
            .. RemedySections(r),
        ];
        return new AnalysisReport($"thermverify worstcase: {design.Name}", design.Description, verdict, r.WithinBudget,
            [.. ReportFormat.Settings(design, model.Sensor.Description, model.Adc)], designFile, [WorstCasePlot.Render(r, design.Name)], sections,
            DesignWriter.ToToml(design), provenance, WorstCaseJson.Schema);
    }

    private static ReportTable BandTable(WorstCaseResult r)
    {
        var every = Math.Max(1, r.Points.Count / 20);
        var rows = r.Points.Where((p, i) => i % every == 0 || i == r.Points.Count - 1 || p == r.Worst).Select(p => (IReadOnlyList<string>)
            [I($"{p.Celsius:0.##}"), p.BudgetKelvin.ToString("0.###", CultureInfo.InvariantCulture), Kelvin(p.NominalKelvin), Kelvin(p.LowKelvin), Kelvin(p.HighKelvin),
             ReportFormat.N(p.LinearSumKelvin, "0.000"), ReportFormat.N(p.RssKelvin, "0.000"), ReportFormat.N(p.SigmaKelvin, "0.000"), p.WithinBudget ? "within" : "over"]);
        return new ReportTable(["T (°C)", "budget", "nominal", "low corner", "high corner", "Σ|s·a|", "RSS", "σ", "verdict"], [.. rows]);
    }

    /// <summary>The proven remedies (the reference resistor's tolerance or tempco), each with its method and proof; none when none was searched.</summary>
    private static IEnumerable<ReportSection> RemedySections(WorstCaseResult r)
    {
        if (r.Remedies.Count == 0 && r.RemedyNote is null) return [];
        string[] paragraphs = [.. r.RemedyNote is { } note ? [note] : Array.Empty<string>(),
            .. r.Remedies.SelectMany(m => new[] { ReportFormat.RemedyLine(m), m.Method + ".", m.Proof + "." })];
        return [new ReportSection("remedies", "Remedies", paragraphs, [])];
    }

    private static ReportTable SensitivityTable(WorstCaseResult r)
    {
        var index = r.Points.ToList().IndexOf(r.Worst);
        return new ReportTable(["tolerance", "±", "effect (K)"],
            [.. r.Sensitivities.OrderByDescending(s => Math.Abs(s.KelvinPerUnit[index] * s.Parameter.HalfWidth))
                .Select(s => (IReadOnlyList<string>)[s.Parameter.Key, HalfWidth(s.Parameter), Kelvin(s.KelvinPerUnit[index] * s.Parameter.HalfWidth)])]);
    }

    private static string I(FormattableString s) => FormattableString.Invariant(s);
}
