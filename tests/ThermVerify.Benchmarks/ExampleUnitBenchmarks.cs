using BenchmarkDotNet.Attributes;
using ThermVerify.Design;
using ThermVerify.Tolerances;

namespace ThermVerify.Benchmarks;

/// <summary>
/// One Monte Carlo unit of every bundled example, as `montecarlo` verifies it: its own DC sweeps and, by default, its
/// own sampling transient (or a delta-sigma unit's channel switch). The unit is the first of seed 1; the evaluator is
/// built once, as a run builds it once for all its units.
/// </summary>
[SimpleJob(launchCount: 1, warmupCount: 2, iterationCount: 5)]
[MemoryDiagnoser]
public class ExampleUnitBenchmarks
{
    [ParamsSource(nameof(Examples))]
    public string Example { get; set; } = "";

    public static IEnumerable<string> Examples() => Repository.Examples();

    private UnitEvaluator evaluator = null!;
    private double[] deviations = null!;

    [GlobalSetup]
    public void Setup()
    {
        evaluator = new UnitEvaluator(Repository.Load(Example + ".toml"), 1);
        var random = new UnitRandom(1, 0);
        deviations = evaluator.Set.Sample(ref random);
        evaluator.Evaluate(deviations); // what a run computes once, from the nominal unit, before its units
    }

    [Benchmark]
    public double OneUnit() => evaluator.Evaluate(deviations).WorstErrorKelvin;
}
