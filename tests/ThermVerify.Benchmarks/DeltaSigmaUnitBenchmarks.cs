using BenchmarkDotNet.Attributes;
using ThermVerify.Design;
using ThermVerify.Tolerances;

namespace ThermVerify.Benchmarks;

/// <summary>
/// One Monte Carlo unit of the bundled kiln example (Pt100 on a 24-bit delta-sigma converter, unbuffered, shared
/// filter, 31 temperatures): its static reading alone, and with its own channel switch (the modulator's samples read
/// by exact propagation through the sinc3 filter, both other-channel levels, at one temperature). docs/performance.md
/// has the figures.
/// </summary>
[ShortRunJob]
[MemoryDiagnoser]
public class DeltaSigmaUnitBenchmarks
{
    private UnitEvaluator evaluator = null!;
    private double[] deviations = null!;

    [GlobalSetup]
    public void Setup()
    {
        var design = DesignLoader.Load(Path.Combine(RepositoryRoot(), "netlists", "kiln-bank-pt100-deltasigma.toml"));
        evaluator = new UnitEvaluator(design, 1);
        var random = new UnitRandom(1, 0);
        deviations = evaluator.Set.Sample(ref random);
        _ = evaluator.SwitchCelsius; // chosen once per run, from the nominal unit
    }

    [Benchmark]
    public double StaticReading() => evaluator.Evaluate(deviations, simulateSettling: false).WorstErrorKelvin;

    [Benchmark]
    public double WithChannelSwitch() => evaluator.Evaluate(deviations).ChannelSwitchKelvin!.Value;

    private static string RepositoryRoot()
    {
        for (var dir = new DirectoryInfo(AppContext.BaseDirectory); dir is not null; dir = dir.Parent)
            if (File.Exists(Path.Combine(dir.FullName, "Directory.Build.props")) && Directory.Exists(Path.Combine(dir.FullName, "netlists")))
                return dir.FullName;
        throw new DirectoryNotFoundException("netlists/ not found above the benchmark binaries");
    }
}
