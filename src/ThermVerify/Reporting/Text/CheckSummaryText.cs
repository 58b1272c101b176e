using System.Globalization;
using System.Text;
using ThermVerify.Check;
using ThermVerify.Design;
using ThermVerify.Provenance;
using ThermVerify.Quantities;

namespace ThermVerify.Reporting.Text;

/// <summary>The compact terminal summary of a check: verdict, a contribution table at a handful of temperatures, findings.</summary>
public static class CheckSummaryText
{
    public const string Caution =
        "Caution: simulation does not replace measurement on hardware. A reading that drives a heater, charger or cut-out " +
        "needs independent protection and must follow the applicable standards, local codes and licensed practice.";

    public static string Render(CheckResult result, RunProvenance provenance, int tableRows = 7)
    {
        var text = new StringBuilder();
        var d = result.Design;
        text.AppendLine($"thermverify check: {d.Name}");
        text.AppendLine($"  sensor   {result.SensorDescription}");
        var (label, excitation) = ReportFormat.Excitation(d);
        text.AppendLine($"  {label,-8} {excitation}");
        text.AppendLine($"  ADC      {d.Adc.Bits} bits, reference {ReportFormat.Reference(d, result.Adc)}, " +
                        $"1 LSB{(d.Adc.GainStage is null ? "" : " at the pin")} = {V(result.Adc.LsbVolts, UnitKind.Volt)}, " + ReportFormat.ConverterTiming(d));
        text.AppendLine($"  codes    {result.Adc.Describe()}");
        if (d.Adc.DeltaSigma is null) text.AppendLine($"  precharge {ReportFormat.PrechargeLine(result)}");
        text.AppendLine($"  check    {V(d.Check.Range.MinCelsius, UnitKind.Celsius)} to {V(d.Check.Range.MaxCelsius, UnitKind.Celsius)} in {V(d.Check.StepKelvin, UnitKind.Kelvin)} steps, budget {V(d.Check.BudgetKelvin, UnitKind.Kelvin)}" +
                        string.Concat(d.Check.Regions.Select(r => $" ({r.Range}: {V(r.BudgetKelvin, UnitKind.Kelvin)})")));
        if (ReportFormat.NominalPartsLine(d) is { } parts) text.AppendLine($"  nominal  {parts}");
        ProvenanceText.Append(text, provenance);
        text.AppendLine();

        var worst = result.Worst;
        text.Append(VerdictLine(result));
        text.AppendLine();

        text.AppendLine("Reported-temperature error and its causes (K; the causes add up to the error, effects the design does not have are left out; " +
                        "the noise of a reading counts in the budget beside the error):");
        var columns = ReportFormat.ContributionColumns(result.Points);
        var table = new TextTable(["T (°C)", "ideal", "sample", "code", "reported (°C)", "error", .. columns.Select(c => c.Header),
            ReportFormat.NoiseHeader(result.Points), "budget", "reading"]);
        foreach (var p in Selected(result.Points, worst, tableRows))
            table.AddRow([N(p.Celsius, "0.##"), V(p.IdealVolts, UnitKind.Volt), V(p.SampleVolts, UnitKind.Volt), p.Code.ToString(CultureInfo.InvariantCulture),
                double.IsFinite(p.ReportedCelsius) ? N(p.ReportedCelsius, "0.000") : "none", K(p.ErrorKelvin, unit: false),
                .. columns.Select(c => K(c.Kelvin(p), unit: false)), ReportFormat.NoiseCell(p), N(p.BudgetKelvin, "0.###"), ReportFormat.ReadingCell(p)]);
        text.Append(table);
        text.AppendLine();

        text.Append(BufferSectionRender.Text(result.Buffer));
        text.Append(BufferSectionRender.Text(NoiseSections.Build(result.Noise)));
        text.Append(BufferSectionRender.Text(DeltaSigmaSections.Build(result.DeltaSigma)));
        if (result.Findings.Count == 0) text.AppendLine("Findings: none; every effect is within ½ LSB.");
        else text.AppendLine("Findings:");
        foreach (var f in result.Findings) AppendFinding(text, f);
        text.AppendLine();
        if (result.Faults is { } faults)
        {
            text.AppendLine(FaultText.Render(faults));
            text.AppendLine();
        }
        else if (result.FaultsOmitted is { } omitted)
        {
            text.AppendLine("Fault thresholds: " + omitted);
            text.AppendLine();
        }
        text.AppendLine(Caution);
        return text.ToString();
    }

    /// <summary>The PASS or FAIL line alone, as printed under the header (and alone with --quiet).</summary>
    public static string VerdictLine(CheckResult result)
    {
        var worst = result.Worst;
        var over = result.Points.Count(p => !p.WithinBudget);
        return (result.Passed
            ? $"PASS: worst reported error {K(worst.ErrorKelvin)} at {C(worst.Celsius)} (budget {K(worst.BudgetKelvin, signed: false)})"
            : $"FAIL: worst reported error {K(worst.ErrorKelvin)} at {C(worst.Celsius)} (budget {K(worst.BudgetKelvin, signed: false)}); " +
              $"{over} of {result.Points.Count} points over budget, {result.Findings.Count(f => f.Severity == Severity.Fail)} failing finding(s)") + Environment.NewLine;
    }

    private static void AppendFinding(StringBuilder text, Finding f)
    {
        text.AppendLine($"  {f.Severity.ToString().ToUpperInvariant(),-4} {f.Id}: {f.Title}");
        text.AppendLine($"       {C(f.FromCelsius)} to {C(f.ToCelsius)}, worst at {C(f.WorstCelsius)}: " +
                        $"{V(f.SizeVolts, UnitKind.Volt)} = {N(f.SizeLsb, "+0.##;-0.##")} LSB = {K(f.SizeKelvin)}");
        text.AppendLine($"       cause: {f.Cause}" + (f.EstimateVolts is { } e && f.SimulatedVolts is { } s
            ? $"; closed form {V(e, UnitKind.Volt)}, simulated {V(s, UnitKind.Volt)}" : ""));
        if (f.RemedyNote is { } note)
            text.AppendLine($"       remedies: {note}");
        foreach (var r in f.Remedies)
        {
            text.AppendLine($"       remedy: {r.Action}{(r.Value is null ? "" : " " + ReportFormat.RemedyValue(r))} [{r.Key}]");
            foreach (var t in r.Together)
                text.AppendLine($"         together with: {t.Action}{(t.Value is null ? "" : " " + ReportFormat.RemedyValue(t))} [{t.Key}]");
            if (r.Proof.Length > 0)
                text.AppendLine($"         ({r.Proof})");
        }
    }

    /// <summary>Both ends, the worst point and evenly spread points between, in temperature order.</summary>
    private static IEnumerable<CheckPoint> Selected(IReadOnlyList<CheckPoint> points, CheckPoint worst, int rows) =>
        Enumerable.Range(0, rows - 1)
            .Select(i => points[(int)Math.Round(i * (points.Count - 1) / (double)Math.Max(rows - 2, 1))])
            .Append(worst).Distinct().OrderBy(p => p.Celsius);

    private static string V(double value, UnitKind unit) => double.IsFinite(value) ? EngineeringFormat.Format(value, unit, 4) : "n/a";
    private static string C(double celsius) => $"{N(celsius, "0.##")} °C";
    private static string N(double value, string format) => double.IsFinite(value) ? value.ToString(format, CultureInfo.InvariantCulture) : "n/a";

    private static string K(double kelvin, bool signed = true, bool unit = true) =>
        !double.IsFinite(kelvin) ? "n/a" : N(kelvin, signed ? "+0.000;-0.000;0.000" : "0.000") + (unit ? " K" : "");
}
