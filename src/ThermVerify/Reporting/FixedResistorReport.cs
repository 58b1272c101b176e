using System.Globalization;
using ThermVerify.Reporting.Text;
using ThermVerify.Design;
using ThermVerify.FrontEnd;
using ThermVerify.Provenance;
using ThermVerify.Quantities;
using ThermVerify.Reporting.Plots;
using ThermVerify.Tolerances;

namespace ThermVerify.Reporting;

/// <summary>The report page of a fixed-resistor search: the ranking figure and the ranked candidates.</summary>
public static class FixedResistorReport
{
    public static AnalysisReport Build(IReadOnlyList<FixedResistorCandidate> ranked, FrontEndDesign design, FixedResistorSearchOptions options, RunProvenance provenance,
        string designFile, int top = 15)
    {
        if (ranked.Count == 0) throw new ArgumentException("A fixed-resistor report needs at least one candidate.", nameof(ranked));
        var model = new ClosedFormModel(design);
        var present = FixedResistorSearch.PresentOhms(design);
        var best = ranked[0];
        var presentRank = ranked.Select((c, i) => (c, i)).Where(x => Math.Abs(x.c.Ohms / present - 1) < 1e-9).Select(x => x.i + 1).FirstOrDefault();
        var verdict = $"Best {options.Series.Name} value by {Describe(options.Objective)}: {Ohms(best.Ohms)} ({Figure(best, options.Objective)}); " +
                      (presentRank > 0 ? $"the design's {Ohms(present)} ranks {presentRank} of {ranked.Count}" : $"the design's {Ohms(present)} is not among the {ranked.Count} candidates");
        var slopeOnly = options.Objective == FixedResistorObjective.SlopeAt;
        var rows = ranked.Take(Math.Max(1, top)).Select((c, i) => (IReadOnlyList<string>)
        [
            (i + 1).ToString(CultureInfo.InvariantCulture), Ohms(c.Ohms), ToleranceText.Kelvin(c.WorstErrorKelvin), F(c.WorstErrorCelsius, "0.##"),
            F(c.WorstKelvinPerLsb, "0.0000"), F(c.SlopeVoltsPerKelvin * 1e3, "0.000"), F(c.MaximumSelfHeatingKelvin * 1e3, "0.0"),
            slopeOnly ? "-" : c.WithinBudget ? "within" : "over",
        ]);
        ReportSection[] sections =
        [
            new("candidates", "Ranked candidates",
            [
                $"{ranked.Count} values of {options.Series.Name} (IEC 60063) tried as the {FixedResistorSearch.PartName(design)}, ranked by {Describe(options.Objective)}; the first {Math.Min(Math.Max(1, top), ranked.Count)} below, --json holds them all." +
                (slopeOnly ? "" : " Each figure comes from a full check of that candidate (settling by transient on a 9-point grid) with the self-heating added; neighbours can swap places by a fraction of an LSB, so read the ranking together with the resolution.") +
                (design.Bridge is null ? "" : " The bridge keeps its balance: each candidate has the opposite half's high resistor as declared and its low resistor re-balanced to null at the same sensor resistance (--json: oppositeLowOhms)."),
            ], [new ReportTable(["rank", "R_fixed", "worst error (K)", "at (°C)", "worst K/LSB", "|dV/dT| (mV/K)", "self-heating (mK)", "budget"], [.. rows])]),
        ];
        return new AnalysisReport($"thermverify choose-fixed: {design.Name}", design.Description, verdict, null,
            [.. ReportFormat.Settings(design, model.Sensor.Description, model.Adc)], designFile,
            [FixedResistorPlot.Render(ranked, options.Objective, present, design.Check.BudgetKelvin, design.Name)], sections,
            DesignWriter.ToToml(design), provenance, FixedResistorJson.Schema);
    }

    public static string Describe(FixedResistorObjective goal) => goal switch
    {
        FixedResistorObjective.WorstResolution => "worst resolution (K per LSB, smallest first)",
        FixedResistorObjective.SlopeAt => "divider slope |dV/dT| (steepest first)",
        _ => "worst reported error with self-heating (smallest first)",
    };

    private static string Figure(FixedResistorCandidate c, FixedResistorObjective goal) => goal switch
    {
        FixedResistorObjective.WorstResolution => $"worst {F(c.WorstKelvinPerLsb, "0.0000")} K/LSB",
        FixedResistorObjective.SlopeAt => $"{F(c.SlopeVoltsPerKelvin * 1e3, "0.000")} mV/K",
        _ => $"worst error {ToleranceText.Kelvin(c.WorstErrorKelvin)} K at {F(c.WorstErrorCelsius, "0.##")} °C, {(c.WithinBudget ? "within" : "over")} budget",
    };

    private static string Ohms(double v) => EngineeringFormat.Format(v, UnitKind.Ohm, 3);

    private static string F(double v, string format) => double.IsFinite(v) ? v.ToString(format, CultureInfo.InvariantCulture) : "-";
}
