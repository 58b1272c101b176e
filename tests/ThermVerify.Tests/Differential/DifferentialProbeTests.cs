using ThermVerify.Circuits.Spice;
using Xunit.Abstractions;

namespace ThermVerify.Tests.Differential;

/// <summary>
/// One seed of the differential run in detail, on request: <c>THERMVERIFY_PROBE_SEED=473 dotnet test
/// tests/ThermVerify.Tests --filter FullyQualifiedName~Probe_one_seed</c> (optionally <c>THERMVERIFY_PROBE_NODES</c>, the
/// generator's node limit: 15 as in the large run by default, 12 for a seed of the fast subset). It prints the circuit,
/// its ngspice deck, the poles and every comparison with its failure, notes and explanation. It judges nothing.
/// </summary>
public class DifferentialProbeTests(ITestOutputHelper output)
{
    public const string SeedVariable = "THERMVERIFY_PROBE_SEED";

    [ProbeFact]
    public void Probe_one_seed()
    {
        var seed = int.Parse(Environment.GetEnvironmentVariable(SeedVariable)!);
        var nodes = int.Parse(Environment.GetEnvironmentVariable("THERMVERIFY_PROBE_NODES") ?? "15");
        var rc = RandomCircuitGenerator.Generate(seed, seed % 2 == 0 ? CircuitClass.Linear : CircuitClass.Nonlinear, nodes);
        if (rc is null)
        {
            output.WriteLine($"seed {seed}: the generator made no circuit");
            return;
        }
        output.WriteLine(rc.Describe());
        output.WriteLine(SpiceDeckWriter.Write(NgspiceTwin.For(rc.Circuit), new OperatingPointAnalysis()));
        try
        {
            output.WriteLine($"screen: {StabilityScreen.FirstUnstableCombination(rc.Circuit, rc.Seed) ?? "every combination stable"}");
        }
        catch (Exception e)
        {
            output.WriteLine($"screen failed: {e.Message}");
        }
        var result = DifferentialCase.Run(rc);
        output.WriteLine($"stable: {result.Stable}; stop {result.Circuit.TransientStopSeconds:G4} s; fastest {result.Circuit.FastestTimeConstantSeconds:G3} s");
        foreach (var c in result.Comparisons)
            output.WriteLine($"{c.Analysis}: difference {c.Difference:G3}; ours {c.Milliseconds.Ours:F0} ms, ngspice {c.Milliseconds.Ngspice:F0} ms" +
                             (c.OursFailure is { } f ? $"\n  ours failed{(c.OursDeclined ? " (declined)" : "")}: {f}" : "") +
                             (c.NgspiceFailure is { } g ? $"\n  ngspice failed: {g}" : "") +
                             (c.Notes is { } n ? $"\n  notes: {n}" : "") + (c.Explanation is { } e ? $"\n  explained: {e}" : ""));
    }

    /// <summary>Skipped unless <see cref="SeedVariable"/> names a seed (and ngspice is there).</summary>
    public sealed class ProbeFactAttribute : FactAttribute
    {
        public ProbeFactAttribute()
        {
            if (!int.TryParse(Environment.GetEnvironmentVariable(SeedVariable), out _))
                Skip = $"a probe of one differential seed is on request: set {SeedVariable}";
            else if (new Ngspice.NgspiceFactAttribute().Skip is { } reason)
                Skip = reason;
        }
    }
}
