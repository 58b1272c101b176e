using System.Text;
using ThermVerify.Quantities;
using ThermVerify.Sensors;
using static ThermVerify.Reporting.Text.TextNumbers;

namespace ThermVerify.Reporting.Text;

/// <summary>What `fit` prints: the Beta and Steinhart–Hart coefficients and every point's residual under each.</summary>
internal static class FitText
{
    public static string Render(SensorFitSummary summary)
    {
        var text = new StringBuilder();
        text.AppendLine($"Beta (from {summary.BetaPoints}): β = {Format(summary.Beta.Model.Beta, "0.###")} K, " +
                        $"R0 = {EngineeringFormat.Format(summary.Beta.Model.R0Ohms, UnitKind.Ohm, 6)} at {Format(summary.Beta.Model.T0Celsius, "0.###")} °C");
        AppendFit(text, "Steinhart–Hart (A + B ln R + C ln³R)", summary.SteinhartHart);
        AppendFit(text, "Steinhart–Hart with squared term (+ D ln²R)", summary.SteinhartHartWithSquaredTerm);
        text.AppendLine(summary.Rated is { } rated
            ? $"Rated values (from {rated.Source}): R25 = {EngineeringFormat.Format(rated.R25Ohms, UnitKind.Ohm, 6)}, β25/85 = {Format(rated.Beta2585Kelvin, "0.#")} K"
            : "Rated values: R25 and β25/85 need points at 25 °C and 85 °C, or points spanning 25 °C to 85 °C");
        text.AppendLine();

        var table = new TextTable(["T (°C)", "R", "Beta residual (K)",
            .. summary.SteinhartHart is null ? Array.Empty<string>() : ["S–H residual (K)"],
            .. summary.SteinhartHartWithSquaredTerm is null ? Array.Empty<string>() : ["S–H4 residual (K)"]]);
        for (var i = 0; i < summary.Points.Count; i++)
        {
            var p = summary.Points[i];
            table.AddRow([Format(p.Celsius, "0.###"), EngineeringFormat.Format(p.Ohms, UnitKind.Ohm, 6), Format(summary.Beta.ResidualsKelvin[i], "0.00000"),
                .. summary.SteinhartHart is null ? Array.Empty<string>() : [Format(summary.SteinhartHart.ResidualsKelvin[i], "0.0000000")],
                .. summary.SteinhartHartWithSquaredTerm is null ? Array.Empty<string>() : [Format(summary.SteinhartHartWithSquaredTerm.ResidualsKelvin[i], "0.0000000")]]);
        }
        text.Append(table);
        return text.ToString();
    }

    private static void AppendFit(StringBuilder text, string title, SensorFit<SteinhartHartThermistor>? fit)
    {
        if (fit is null) return;
        var m = fit.Model;
        text.AppendLine($"{title}: A = {Scientific(m.A)}, B = {Scientific(m.B)}, C = {Scientific(m.C)}" + (m.D != 0 ? $", D = {Scientific(m.D)}" : "") +
                        $"; worst residual {Format(fit.MaxAbsResidualKelvin, "G3")} K");
    }

    private static string Scientific(double value) => Format(value, "0.0000000000E+0");
}
