using ThermVerify.Tests.Ngspice;
using Xunit.Abstractions;

namespace ThermVerify.Tests.Differential;

/// <summary>
/// The built-in engine against ngspice 39 on seeded random circuits (<see cref="RandomCircuitGenerator"/>,
/// <see cref="DifferentialCase"/>): a fast subset in every test run, the large run on request.
/// </summary>
public class DifferentialTests(ITestOutputHelper output)
{
    /// <summary>Circuits of the fast subset (seeds 1 to this, linear and nonlinear alternating, up to 12 nodes; well under a minute).</summary>
    public const int FastCount = 100;

    internal static DifferentialReport RunMany(int first, int count, int maxNodes)
    {
        // THERMVERIFY_DIFFERENTIAL_LOG: a file that gets a line before and after every analysis, as it happens.
        if (Environment.GetEnvironmentVariable("THERMVERIFY_DIFFERENTIAL_LOG") is { Length: > 0 } log)
            DifferentialCase.Progress = line => File.AppendAllText(log, line + Environment.NewLine);
        var cases = new List<CaseResult>();
        for (var seed = first; seed < first + count; seed++)
        {
            var circuitClass = seed % 2 == 0 ? CircuitClass.Linear : CircuitClass.Nonlinear;
            if (RandomCircuitGenerator.Generate(seed, circuitClass, maxNodes) is { } rc)
                cases.Add(DifferentialCase.Run(rc));
        }
        return new DifferentialReport(cases);
    }

    [NgspiceFact]
    public void Fast_subset_of_random_circuits_completes_and_agrees_with_ngspice()
    {
        var report = RunMany(1, FastCount, 12);
        output.WriteLine(report.Render(DifferentialCase.Limits));
        Judge(report);
    }

    /// <summary>
    /// Current-controlled sources (F, H) in random linear circuits: 40 seeds of their own (the fast subset's circuits stay
    /// as they are), each sensing a voltage source of the circuit, against ngspice as every random circuit is. Linear
    /// only for now: in a nonlinear circuit (seed 9) an F in the feedback of two clamped op-amps left the source sweep
    /// 0.12 of the scale from ngspice's; that is explained since (ngspice's sweep drift and its gmin,
    /// <c>SeedRegressionTests</c>), but adding F and H to the nonlinear class would change every seed's circuit.
    /// </summary>
    [NgspiceFact]
    public void Random_circuits_with_current_controlled_sources_agree_with_ngspice()
    {
        var cases = new List<CaseResult>();
        for (var seed = 1; seed <= CurrentControlledCount; seed++)
            if (RandomCircuitGenerator.Generate(seed, CircuitClass.Linear, 10, currentControlled: true) is { } rc)
                cases.Add(DifferentialCase.Run(rc));
        var report = new DifferentialReport(cases);
        output.WriteLine(report.Render(DifferentialCase.Limits));
        Assert.True(cases.Count(c => c.Circuit.Circuit.Elements.Any(e => e is ThermVerify.Circuits.Cccs or ThermVerify.Circuits.Ccvs)) >= CurrentControlledCount / 2,
            "most circuits carry a current-controlled source");
        Judge(report);
    }

    private const int CurrentControlledCount = 40;

    /// <summary>
    /// The large run, on request only: <c>THERMVERIFY_DIFFERENTIAL=3000 dotnet test tests/ThermVerify.Tests --filter
    /// FullyQualifiedName~Large_run</c>, optionally <c>THERMVERIFY_DIFFERENTIAL_FIRST</c> (first seed, default 1) and
    /// <c>THERMVERIFY_DIFFERENTIAL_REPORT</c> (a file for the report, which docs/engine.md quotes, and beside it the same
    /// path with <c>.tsv</c> added: every comparison on a line, to combine the chunks of a long run).
    /// </summary>
    [DifferentialLargeRunFact]
    public void Large_run_of_random_circuits_completes_and_agrees_with_ngspice()
    {
        var count = int.Parse(Environment.GetEnvironmentVariable(DifferentialLargeRunFactAttribute.CountVariable)!);
        var first = int.Parse(Environment.GetEnvironmentVariable("THERMVERIFY_DIFFERENTIAL_FIRST") ?? "1");
        var report = RunMany(first, count, 15);
        var text = report.Render(DifferentialCase.Limits);
        output.WriteLine(text);
        if (Environment.GetEnvironmentVariable("THERMVERIFY_DIFFERENTIAL_REPORT") is { Length: > 0 } path)
        {
            File.WriteAllText(path, text);
            File.WriteAllText(path + ".tsv", report.Table(DifferentialCase.Limits));
        }
        Judge(report);
    }

    /// <summary>
    /// Issue 15's acceptance: the engine completes every screened circuit's analysis that ngspice completes, or says
    /// why it declines (an ill-conditioned matrix, named); and where both complete, the 99th percentile of the
    /// unexplained differences is within each analysis' limit.
    /// </summary>
    private static void Judge(DifferentialReport report)
    {
        var failures = report.OursOnlyFailures.Select(p => $"{p.Comparison.Analysis}, seed {p.Case.Circuit.Seed}: {p.Comparison.OursFailure}").ToList();
        Assert.True(failures.Count == 0, "built-in failures where ngspice completed:\n" + string.Join("\n", failures));
        foreach (var (analysis, limit) in DifferentialCase.Limits)
            Assert.True(report.Percentile(analysis, 99) <= limit,
                $"{analysis}: 99th percentile {report.Percentile(analysis, 99):G3} above {limit:G3}");
        Assert.True(report.Screened.Count() >= report.Cases.Count / 2, "at least half the circuits are stable and compared");
    }
}
