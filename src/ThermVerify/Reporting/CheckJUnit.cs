using System.Globalization;
using System.Xml.Linq;
using ThermVerify.Baselines;
using ThermVerify.Check;
using ThermVerify.Provenance;
using static ThermVerify.Reporting.ReportFormat;

namespace ThermVerify.Reporting;

/// <summary>
/// The check as JUnit XML (the Ant junit report format that CI systems read): one test suite per design, one test
/// case per check (the budget over the range and in each region, each baseline figure) and one per finding. A
/// failing finding or a broken budget is a &lt;failure&gt;; warnings and notes pass and carry their text in
/// &lt;system-out&gt;. The suite's &lt;properties&gt; say where it came from (tool, engine, design hash, settings); a
/// baseline made differently adds a passing case that says how.
/// </summary>
public static class CheckJUnit
{
    public static string Write(CheckResult result, RunProvenance provenance, BaselineComparison? baseline = null)
    {
        var cases = new List<XElement>();
        var design = result.Design;
        cases.Add(Budget(result, result.Points, $"budget {C(design.Check.Range.MinCelsius)} to {C(design.Check.Range.MaxCelsius)}"));
        foreach (var region in design.Check.Regions)
            cases.Add(Budget(result, [.. result.Points.Where(p => region.Range.Contains(p.Celsius))], $"budget region {C(region.Range.MinCelsius)} to {C(region.Range.MaxCelsius)}"));
        foreach (var f in result.Findings) cases.Add(FindingCase(f));
        if (baseline is not null)
        {
            if (baseline.RunDifferences.Count > 0)
            {
                var note = Case("baseline", "made differently");
                note.Add(new XElement("system-out", "the baseline was made differently, which alone may move figures:\n" + string.Join("\n", baseline.RunDifferences)));
                cases.Add(note);
            }
            foreach (var f in baseline.Figures) cases.Add(BaselineCase(f));
        }

        var failures = cases.Count(c => c.Element("failure") is not null);
        var suite = new XElement("testsuite",
            new XAttribute("name", $"thermverify check: {design.Name}"),
            new XAttribute("tests", cases.Count), new XAttribute("failures", failures),
            new XAttribute("errors", 0), new XAttribute("skipped", 0), new XAttribute("time", "0"),
            Properties(provenance), cases);
        var root = new XElement("testsuites", new XAttribute("name", "thermverify"),
            new XAttribute("tests", cases.Count), new XAttribute("failures", failures), new XAttribute("errors", 0), new XAttribute("time", "0"), suite);
        return new XDeclaration("1.0", "utf-8", null) + "\n" + root + "\n";
    }

    private static XElement Budget(CheckResult result, IReadOnlyList<CheckPoint> points, string name)
    {
        var test = Case("check", name);
        if (points.Count == 0)
        {
            test.Add(new XElement("system-out", "no check point lies in this range"));
            return test;
        }
        var worst = points.MaxBy(p => double.IsFinite(p.ErrorKelvin) ? Math.Abs(p.ErrorKelvin) : double.PositiveInfinity)!;
        var over = points.Where(p => !p.WithinBudget).ToList();
        var text = $"worst reported error {K(worst.ErrorKelvin)} at {C(worst.Celsius)}, budget {K(worst.BudgetKelvin, false)}; {over.Count} of {points.Count} points over budget";
        if (over.Count > 0)
            test.Add(new XElement("failure", new XAttribute("message", text), new XAttribute("type", "budget"),
                string.Join("\n", over.Select(p => $"{C(p.Celsius)}: error {K(p.ErrorKelvin)}, budget {K(p.BudgetKelvin, false)}"))));
        else
            test.Add(new XElement("system-out", text));
        return test;
    }

    private static XElement FindingCase(Finding f)
    {
        var test = Case("finding", $"{f.Id}: {f.Title}");
        var text = $"{C(f.FromCelsius)} to {C(f.ToCelsius)}, worst at {C(f.WorstCelsius)}: {N(f.SizeLsb, "+0.##;-0.##")} LSB = {K(f.SizeKelvin)}. Cause: {f.Cause}" +
                   (f.RemedyNote is { } note ? $"\nremedies: {note}" : "") +
                   string.Concat(f.Remedies.Select(m => $"\nremedy: {RemedyLine(m)} ({m.Proof})"));
        test.Add(f.Severity == Severity.Fail
            ? new XElement("failure", new XAttribute("message", $"{f.Id}: {f.Title}"), new XAttribute("type", "finding"), text)
            : new XElement("system-out", $"{f.Severity.ToString().ToUpperInvariant()}: {text}"));
        return test;
    }

    private static XElement BaselineCase(FigureChange f)
    {
        var test = Case("baseline", f.Id);
        var text = $"{f.Description}: baseline {Figure(f.Before, f.Unit)}, now {Figure(f.Now, f.Unit)}, tolerance ±{N(f.Tolerance, "0.####")} {f.Unit}: {ChangeText(f.Change)}";
        test.Add(f.Change == Change.Worse
            ? new XElement("failure", new XAttribute("message", text), new XAttribute("type", "baseline"))
            : new XElement("system-out", text));
        return test;
    }

    private static XElement Properties(RunProvenance p) => new("properties",
        Property("thermverify.version", p.ToolVersion), Property("engine", p.EngineText),
        Property("design.sha256", p.Design?.Sha256 ?? "none"), Property("design.files", p.Design is { } d ? string.Join(", ", d.Files.Select(f => $"{f.Name} {f.Sha256}")) : "none"),
        p.Settings.Select(s => Property("setting." + s.Name, s.Value)));

    private static XElement Property(string name, string value) => new("property", new XAttribute("name", name), new XAttribute("value", value));

    private static XElement Case(string kind, string name) =>
        new("testcase", new XAttribute("classname", $"thermverify.{kind}"), new XAttribute("name", name), new XAttribute("time", 0.ToString(CultureInfo.InvariantCulture)));
}
