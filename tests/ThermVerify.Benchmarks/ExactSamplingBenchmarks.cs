using BenchmarkDotNet.Attributes;
using BenchmarkDotNet.Configs;
using ThermVerify.Circuits;
using ThermVerify.Design;
using ThermVerify.Simulation;
using ThermVerify.Simulation.Switched;
using ThermVerify.FrontEnd;

namespace ThermVerify.Benchmarks;

/// <summary>
/// Sampling transients by exact propagation (Simulation/Switched) against the time-stepping engine, on the check's own
/// sampling circuits at 15 °C, precharged to 0 V: the cold-storage logger without and with its 100 nF reservoir, and
/// the op-amp follower straight into 100 nF (linear throughout at 0 V precharge, so every interval is checked and passes). Each run
/// starts from the circuit (operating point included); the time-stepping engine runs at the check's tolerances
/// (relative 1e-8). Exact propagation also gives 4,096 conversions one by one, the 4,096th directly by a matrix power,
/// and the periodic steady state.
/// </summary>
[MemoryDiagnoser]
[GroupBenchmarksBy(BenchmarkLogicalGroupRule.ByCategory)]
[CategoriesColumn]
[SimpleJob(launchCount: 1, warmupCount: 2, iterationCount: 6)]
public class ExactSamplingBenchmarks
{
    private const int Conversions = 64;
    private const double Celsius = 15;

    private Case unbuffered = null!;
    private Case reservoir = null!;
    private Case opAmp = null!;

    private sealed record Case(Circuit Circuit, TransientOptions Options, double[] SampleTimes);

    [GlobalSetup]
    public void Setup()
    {
        unbuffered = Load("cold-storage-logger.toml");
        reservoir = Load("cold-storage-logger-reservoir.toml");
        opAmp = Load("cold-storage-logger-bare-opamp.toml");
    }

    [Benchmark(Baseline = true), BenchmarkCategory("no reservoir")]
    public double Stepping_64_no_reservoir() => Stepping(unbuffered);

    [Benchmark, BenchmarkCategory("no reservoir")]
    public double Exact_64_no_reservoir() => Exact(unbuffered);

    [Benchmark(Baseline = true), BenchmarkCategory("100 nF reservoir")]
    public double Stepping_64_reservoir() => Stepping(reservoir);

    [Benchmark, BenchmarkCategory("100 nF reservoir")]
    public double Exact_64_reservoir() => Exact(reservoir);

    [Benchmark, BenchmarkCategory("100 nF reservoir")]
    public double Exact_steady_state_reservoir() =>
        ExactSwitchedTransient.Start(reservoir.Circuit).SteadyStateSampleVoltage(FrontEndNodes.SamplingSwitch, FrontEndNodes.Hold);

    [Benchmark, BenchmarkCategory("100 nF reservoir")]
    public double Exact_4096_conversions_reservoir() =>
        ExactSwitchedTransient.Start(reservoir.Circuit).SampleVoltages(FrontEndNodes.SamplingSwitch, 4096, FrontEndNodes.Hold)[^1];

    [Benchmark, BenchmarkCategory("100 nF reservoir")]
    public double Exact_4096th_conversion_reservoir() =>
        ExactSwitchedTransient.Start(reservoir.Circuit).SampleVoltage(FrontEndNodes.SamplingSwitch, 4095, FrontEndNodes.Hold);

    [Benchmark(Baseline = true), BenchmarkCategory("op-amp into 100 nF")]
    public double Stepping_64_op_amp() => Stepping(opAmp);

    [Benchmark, BenchmarkCategory("op-amp into 100 nF")]
    public double Exact_64_op_amp() => Exact(opAmp);

    private static double Stepping(Case c)
    {
        var run = BuiltInEngine.Instance.StartTransient(c.Circuit, c.Options);
        var sum = 0.0;
        foreach (var t in c.SampleTimes)
            sum += run.VoltageAt(t, FrontEndNodes.Hold);
        return sum;
    }

    private static double Exact(Case c) =>
        ExactSwitchedTransient.Start(c.Circuit).SampleVoltages(FrontEndNodes.SamplingSwitch, Conversions, FrontEndNodes.Hold).Sum();

    private static Case Load(string file)
    {
        var design = Repository.Load(file);
        var lsb = new ClosedFormModel(design).Adc.LsbVolts;
        // 4,096 conversions in the circuit, so that the 4,096th can be read; the first 64 are the same either way.
        var (circuit, options) = SamplingRun.Setup(design, Celsius, 0.0, design.Check.SettleLimitLsb * lsb, 4096);
        options = options with { StopTimeSeconds = Conversions / design.Adc.SampleRateHertz };
        return new Case(circuit, options, [.. Enumerable.Range(0, Conversions).Select(k => FrontEndCircuit.SampleTimeSeconds(design, k))]);
    }
}
