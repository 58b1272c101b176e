using System.Xml.Linq;
using ThermVerify.Baselines;
using ThermVerify.Check;
using ThermVerify.Circuits;
using ThermVerify.Reporting;

namespace ThermVerify.Tests.Reporting;

/// <summary>
/// The Ant JUnit report format CI systems read (from memory: testsuites › testsuite › testcase with classname and
/// name; a &lt;failure message type&gt; child marks a failed case; tests/failures/errors counts on the suite).
/// </summary>
public class JUnitTests(ReportFixture fixture) : IClassFixture<ReportFixture>
{
    [Fact]
    public void One_case_per_check_and_per_finding_with_failures_counted()
    {
        var result = fixture.Result;
        var doc = XDocument.Parse(CheckJUnit.Write(result, TestRun.Provenance));
        var suite = doc.Root!.Element("testsuite")!;
        var cases = suite.Elements("testcase").ToList();

        Assert.Equal("testsuites", doc.Root.Name.LocalName);
        Assert.Equal(1 + result.Design.Check.Regions.Count + result.Findings.Count, cases.Count);
        Assert.Equal(cases.Count, (int)suite.Attribute("tests")!);
        var failures = cases.Count(c => c.Element("failure") is not null);
        Assert.Equal(failures, (int)suite.Attribute("failures")!);
        Assert.Equal(result.Findings.Count(f => f.Severity == Severity.Fail) + (result.Points.All(p => p.WithinBudget) ? 0 : 1), failures);
        Assert.All(cases, c => Assert.False(string.IsNullOrWhiteSpace((string?)c.Attribute("classname"))));
        foreach (var f in result.Findings)
            Assert.Single(cases, c => ((string)c.Attribute("name")!).StartsWith(f.Id + ":"));
    }

    [Fact]
    public void Baseline_figures_become_cases_and_a_worse_one_fails()
    {
        var now = BaselineFigures.From(fixture.Result, TestRun.Provenance);
        var before = now with { Figures = [.. now.Figures.Select(f => f.Id == "loading.worst" ? f with { Value = -1 } : f)] };
        var comparison = BaselineComparison.Compare("b.json", before, now);
        var cases = XDocument.Parse(CheckJUnit.Write(fixture.Result, TestRun.Provenance, comparison)).Descendants("testcase")
            .Where(c => (string)c.Attribute("classname")! == "thermverify.baseline").ToList();

        Assert.Equal(now.Figures.Count, cases.Count);
        Assert.NotNull(cases.Single(c => (string)c.Attribute("name")! == "loading.worst").Element("failure"));
        Assert.Single(cases, c => c.Element("failure") is not null);
    }
}
