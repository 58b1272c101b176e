using System.Text;
using ThermVerify.Components;
using ThermVerify.Design;
using ThermVerify.Quantities;
using ThermVerify.Tolerances;
using static ThermVerify.Reporting.Text.TextNumbers;

namespace ThermVerify.Reporting.Text;

/// <summary>The terminal ranking of fixed-resistor candidates.</summary>
public static class FixedResistorText
{
    public static string Render(FrontEndDesign design, ESeries series, FixedResistorObjective goal, IReadOnlyList<FixedResistorCandidate> ranked, int top)
    {
        var text = new StringBuilder();
        text.AppendLine(Invariant($"{design.Name}: {ranked.Count} {series} candidates, ranked by {FixedResistorReport.Describe(goal)}; now {Ohms(design.Divider.FixedResistorOhms)}"));
        var table = new TextTable("rank", "R_fixed", "worst error (K)", "at (°C)", "worst K/LSB", "|dV/dT| (mV/K)", "self-heating (mK)", "budget");
        foreach (var (c, i) in ranked.Take(Math.Max(1, top)).Select((c, i) => (c, i)))
            table.AddRow(Integer(i + 1), Ohms(c.Ohms), Format(c.WorstErrorKelvin, "0.000"), Format(c.WorstErrorCelsius, "0.##"),
                Format(c.WorstKelvinPerLsb, "0.0000"), Format(c.SlopeVoltsPerKelvin * 1e3, "0.000"), Format(c.MaximumSelfHeatingKelvin * 1e3, "0.0"),
                goal == FixedResistorObjective.SlopeAt ? "-" : c.WithinBudget ? "within" : "over");
        text.Append(table);
        return text.ToString();
    }

    private static string Ohms(double v) => EngineeringFormat.Format(v, UnitKind.Ohm, 3);
}
