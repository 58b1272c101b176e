using BenchmarkDotNet.Attributes;
using ThermVerify.Design;
using ThermVerify.FrontEnd;
using ThermVerify.Tolerances;

namespace ThermVerify.Benchmarks;

/// <summary>
/// The op-amp examples' sampling transients as a check and a Monte Carlo unit run them (issue 17): the buffered logger's
/// sampling run at −30 °C precharged to 0 V (its follower kicked about 5.6 mV by every acquisition), the same with a
/// follower slewing at 1 mV/µs (stepped on every kick: the hybrid), and one Monte Carlo unit of the buffered logger,
/// the bare op-amp logger and the buffered cable probe (DC sweeps, the unit's own sampling transient, the reading).
/// </summary>
[ShortRunJob]
[MemoryDiagnoser]
public class OpAmpSamplingBenchmarks
{
    private FrontEndDesign buffered = null!;
    private FrontEndDesign slow = null!;
    private (UnitEvaluator Evaluator, double[] Deviations) bufferedUnit, bareUnit, cableUnit;

    [GlobalSetup]
    public void Setup()
    {
        buffered = Repository.Load("cold-storage-logger-buffered.toml");
        var bare = Repository.Load("cold-storage-logger-bare-opamp.toml");
        slow = bare with { Buffer = bare.Buffer! with { SlewRateVoltsPerSecond = 1e3 } };
        bufferedUnit = Unit(buffered);
        bareUnit = Unit(bare);
        cableUnit = Unit(Repository.Load("buffered-cable-probe.toml"));
    }

    [Benchmark]
    public double Sampling_run_buffered_logger() => Sampling(buffered);

    [Benchmark]
    public double Sampling_run_slow_follower() => Sampling(slow);

    [Benchmark]
    public double Unit_buffered_logger() => bufferedUnit.Evaluator.Evaluate(bufferedUnit.Deviations).WorstErrorKelvin;

    [Benchmark]
    public double Unit_bare_opamp_logger() => bareUnit.Evaluator.Evaluate(bareUnit.Deviations).WorstErrorKelvin;

    [Benchmark]
    public double Unit_buffered_cable_probe() => cableUnit.Evaluator.Evaluate(cableUnit.Deviations).WorstErrorKelvin;

    private static double Sampling(FrontEndDesign design)
    {
        var lsb = new ClosedFormModel(design).Adc.LsbVolts;
        return SamplingRun.Run(design, -30, 0.0, design.Check.SettleLimitLsb * lsb).SteadyVolts;
    }

    private static (UnitEvaluator, double[]) Unit(FrontEndDesign design)
    {
        var evaluator = new UnitEvaluator(design, 1);
        var random = new UnitRandom(1, 0);
        return (evaluator, evaluator.Set.Sample(ref random));
    }
}
