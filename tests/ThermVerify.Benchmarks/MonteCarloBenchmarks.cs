using BenchmarkDotNet.Attributes;
using ThermVerify.Design;
using ThermVerify.Tolerances;

namespace ThermVerify.Benchmarks;

/// <summary>
/// The Monte Carlo of the bundled oven example (Pt1000 class B, 151 temperatures): one unit verified (DC sweep of
/// its own circuit, the sampling transient at its worst temperature, the reading), and a 1,000-unit run on two
/// threads. docs/performance.md has the figures and the whole-process time of the 10,000-unit run.
/// </summary>
[ShortRunJob]
[MemoryDiagnoser]
public class MonteCarloBenchmarks
{
    private FrontEndDesign design = null!;
    private UnitEvaluator evaluator = null!;
    private double[] deviations = null!;

    [GlobalSetup]
    public void Setup()
    {
        design = Repository.Load("oven-pt1000.toml");
        evaluator = new UnitEvaluator(design, 1);
        var random = new UnitRandom(1, 0);
        deviations = evaluator.Set.Sample(ref random);
    }

    [Benchmark]
    public double OneUnit() => evaluator.Evaluate(deviations).WorstErrorKelvin;

    [Benchmark]
    public double OneUnitNominalSettling() => evaluator.Evaluate(deviations, simulateSettling: false).WorstErrorKelvin;

    [Benchmark]
    public double ThousandUnitsTwoThreads() =>
        MonteCarlo.Run(evaluator, new MonteCarloOptions { Units = 1000, Threads = 2 }).Yield;
}
