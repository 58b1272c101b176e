using BenchmarkDotNet.Attributes;
using ThermVerify.Design;
using ThermVerify.Tolerances;

namespace ThermVerify.Benchmarks;

/// <summary>
/// One Monte Carlo unit of each bundled delta-sigma example: the kiln (Pt100 on a 24-bit converter, unbuffered,
/// shared filter, sinc3 at 50 Hz, 31 temperatures) and the stability chamber (Pt100 on a gain stage, buffered input,
/// sinc3 at 20 Hz, 31 temperatures): its static reading alone, and with its own channel switch (the modulator's
/// samples, both other-channel levels where the filter is shared, through the sinc3 filter, at one temperature).
/// docs/performance.md has the figures.
/// </summary>
[ShortRunJob]
[MemoryDiagnoser]
public class DeltaSigmaUnitBenchmarks
{
    private UnitEvaluator evaluator = null!;
    private double[] deviations = null!;

    [Params("kiln-bank-pt100-deltasigma", "stability-chamber-pt100-pga")]
    public string Example { get; set; } = "kiln-bank-pt100-deltasigma";

    [GlobalSetup]
    public void Setup()
    {
        var design = Repository.Load(Example + ".toml");
        evaluator = new UnitEvaluator(design, 1);
        var random = new UnitRandom(1, 0);
        deviations = evaluator.Set.Sample(ref random);
        _ = evaluator.SwitchCelsius; // chosen once per run, from the nominal unit
    }

    [Benchmark]
    public double StaticReading() => evaluator.Evaluate(deviations, simulateSettling: false).WorstErrorKelvin;

    [Benchmark]
    public double WithChannelSwitch() => evaluator.Evaluate(deviations).ChannelSwitchKelvin!.Value;
}
