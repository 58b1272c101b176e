using BenchmarkDotNet.Attributes;
using ThermVerify.Circuits;
using ThermVerify.Circuits.Spice;
using ThermVerify.Design;
using ThermVerify.Ngspice;
using ThermVerify.Simulation;
using ThermVerify.FrontEnd;

/// <summary>
/// The same two simulations through the built-in engine, the ngspice shared library and an `ngspice -b` process:
/// the temperature sweep of the cold-storage logger's DC circuit (1,651 points, −40 °C to 125 °C in 0.1 K steps) and
/// its sampling transient (64 conversions at 25 °C, precharged to 0 V). The decks are written once in setup, so the
/// ngspice figures are pure engine time (plus process start for `ngspice -b`); the ngspice transient deck carries the
/// step guards the ngspice engine uses to reach the cross-check accuracy (and once without them, for comparison).
/// </summary>
[MemoryDiagnoser]
[SimpleJob(launchCount: 1, warmupCount: 3, iterationCount: 10)]
public class EngineComparisonBenchmarks
{
    public const int SweepPoints = 1651;
    public const int Conversions = 64;

    private Circuit dcCircuit = null!;
    private double[] temperatures = null!;
    private string dcDeck = null!;
    private Circuit samplingCircuit = null!;
    private TransientOptions samplingOptions = null!;
    private double[] sampleTimes = null!;
    private string samplingDeck = null!;
    private string unguardedSamplingDeck = null!;

    [GlobalSetup]
    public void Setup()
    {
        var design = ThermVerify.Benchmarks.Repository.Load("cold-storage-logger.toml");
        temperatures = [.. Enumerable.Range(0, SweepPoints).Select(i => -40 + 0.1 * i)];
        dcCircuit = FrontEndCircuit.Dc(design, null);
        dcDeck = SpiceDeckWriter.Write(dcCircuit, DcTemperatureSweep.From(temperatures));

        var lsb = new ClosedFormModel(design).Adc.LsbVolts;
        (samplingCircuit, samplingOptions) = SamplingRun.Setup(design, 25, 0.0, design.Check.SettleLimitLsb * lsb, Conversions);
        sampleTimes = [.. Enumerable.Range(0, Conversions).Select(k => FrontEndCircuit.SampleTimeSeconds(design, k))];
        var sweep = new TransientSweep(sampleTimes[^1], samplingOptions.MaxStepSeconds);
        samplingDeck = SpiceDeckWriter.Write(samplingCircuit, sweep with { StepGuards = StepGuard.ForSwitches(samplingCircuit) });
        unguardedSamplingDeck = SpiceDeckWriter.Write(samplingCircuit, sweep);
    }

    [Benchmark(Baseline = true)]
    public double Sweep_built_in() => DcSweep.Temperature(dcCircuit, temperatures).Voltage(FrontEndNodes.Divider)[^1];

    [Benchmark]
    public double Sweep_ngspice_library() => NgspiceSession.Run(dcDeck).Plot("dc")[FrontEndNodes.Divider].Real[SweepPoints - 1];

    [Benchmark]
    public double Sweep_ngspice_process() => NgspiceProcess.Run(dcDeck).Plot("dc")[FrontEndNodes.Divider].Real[SweepPoints - 1];

    [Benchmark]
    public double Sampling_built_in()
    {
        var run = BuiltInEngine.Instance.StartTransient(samplingCircuit, samplingOptions);
        var sum = 0.0;
        foreach (var t in sampleTimes) sum += run.VoltageAt(t, FrontEndNodes.Hold);
        return sum;
    }

    [Benchmark]
    public double Sampling_ngspice_library() => NgspiceSession.Run(samplingDeck).Plot("tran")[FrontEndNodes.Hold].Real[^1];

    /// <summary>ngspice at its own step control, without the guards: faster, but 0.5 mV off after a charge-sharing step.</summary>
    [Benchmark]
    public double Sampling_ngspice_library_unguarded() => NgspiceSession.Run(unguardedSamplingDeck).Plot("tran")[FrontEndNodes.Hold].Real[^1];

    [Benchmark]
    public double Sampling_ngspice_process() => NgspiceProcess.Run(samplingDeck).Plot("tran")[FrontEndNodes.Hold].Real[^1];
}
