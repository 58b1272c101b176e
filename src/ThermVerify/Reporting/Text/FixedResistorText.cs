using System.Text;
using ThermVerify.Components;
using ThermVerify.Design;
using ThermVerify.Provenance;
using ThermVerify.Quantities;
using ThermVerify.Tolerances;
using static ThermVerify.Reporting.Text.TextNumbers;

namespace ThermVerify.Reporting.Text;

/// <summary>The terminal ranking of fixed-resistor candidates.</summary>
public static class FixedResistorText
{
    public static string Render(FrontEndDesign design, ESeries series, FixedResistorObjective goal, IReadOnlyList<FixedResistorCandidate> ranked, int top,
        RunProvenance provenance)
    {
        var text = new StringBuilder();
        var seriesValues = ranked.Count(c => !c.IsPresent || series.Contains(c.Ohms));
        var presentApart = seriesValues < ranked.Count ? " and the present value" : "";
        text.AppendLine(Invariant($"{design.Name}: {seriesValues} {series} candidates{presentApart}, ranked by {FixedResistorReport.Describe(goal)}; {FixedResistorSearch.PartName(design)} now {Ohms(FixedResistorSearch.PresentOhms(design))}"));
        ProvenanceText.Append(text, provenance);
        // A bridge's candidates carry the opposite low resistor that keeps the balance (BridgeHalfChoice).
        var bridge = design.Bridge is not null;
        string[] headers = ["rank", design.CurrentSource is null ? "R_fixed" : "R_ref", .. bridge ? ["R_low (opposite)"] : Array.Empty<string>(),
            "worst error (K)", "at (°C)", "worst K/LSB", "|dV/dT| (mV/K)", "self-heating (mK)", "margin (K)", "budget"];
        var table = new TextTable(headers);
        var shown = Math.Max(1, top);
        // The design's own resistor is always listed, below the top ones when it ranks lower, so its gain can be judged.
        var presentRank = ranked.Select((c, i) => (c, i)).Where(x => x.c.IsPresent).Select(x => x.i).DefaultIfEmpty(-1).First();
        var rows = ranked.Select((c, i) => (c, i)).Where(x => x.i < shown || x.i == presentRank);
        foreach (var (c, i) in rows)
            table.AddRow([Integer(i + 1), Ohms(c.Ohms) + (c.IsPresent ? " (now)" : ""),
                .. bridge ? [c.OppositeLowOhms is { } low ? EngineeringFormat.Format(low, UnitKind.Ohm, 4) : "-"] : Array.Empty<string>(),
                Format(c.WorstErrorKelvin, "0.000"), Format(c.WorstErrorCelsius, "0.##"),
                Format(c.WorstKelvinPerLsb, "0.0000"), Format(c.SlopeVoltsPerKelvin * 1e3, "0.000"), Format(c.MaximumSelfHeatingKelvin * 1e3, "0.0"),
                goal == FixedResistorObjective.SlopeAt ? "-" : Format(c.MarginKelvin, "+0.000;-0.000"),
                goal == FixedResistorObjective.SlopeAt ? "-" : c.WithinBudget ? "within" : "over"]);
        text.Append(table);
        if (presentRank > 0 && goal == FixedResistorObjective.WorstError)
        {
            var (best, now) = (ranked[0], ranked[presentRank]);
            text.AppendLine(Invariant($"best {Ohms(best.Ohms)} against {Ohms(now.Ohms)} now: worst error {Format(Math.Abs(best.WorstErrorKelvin), "0.000")} K instead of {Format(Math.Abs(now.WorstErrorKelvin), "0.000")} K (rank {presentRank + 1} of {ranked.Count})"));
        }
        return text.ToString();
    }

    private static string Ohms(double v) => EngineeringFormat.Format(v, UnitKind.Ohm, 3);
}
