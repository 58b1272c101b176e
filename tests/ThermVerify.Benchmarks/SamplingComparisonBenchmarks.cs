using BenchmarkDotNet.Attributes;
using ThermVerify.Circuits.Spice;
using ThermVerify.Design;
using ThermVerify.FrontEnd;
using ThermVerify.Ngspice;
using ThermVerify.Simulation;

namespace ThermVerify.Benchmarks;

/// <summary>
/// The check's own sampling circuit of three bundled loggers (unbuffered, with a 100 nF reservoir, and buffered by an
/// op-amp follower), 64 conversions at 25 °C precharged to 0 V, through the built-in engine (exact propagation, as every
/// check runs it) and ngspice's shared library on the deck with the step guards that bring it to the cross-check's
/// accuracy. How the accuracy is matched: setup runs both once and prints the largest difference of the 64 samples in
/// LSB (the cross-check tests hold both to 0.01 LSB on every example, `EngineCrossCheckTests`); the exact run has no
/// time step, so that difference is ngspice's own error.
/// </summary>
[SimpleJob(launchCount: 1, warmupCount: 1, iterationCount: 3)]
[MemoryDiagnoser]
public class SamplingComparisonBenchmarks
{
    public const int Conversions = 64;

    [Params("cold-storage-logger", "cold-storage-logger-reservoir", "cold-storage-logger-buffered")]
    public string Example { get; set; } = "";

    private ThermVerify.Circuits.Circuit circuit = null!;
    private TransientOptions options = null!;
    private double[] sampleTimes = null!;
    private string deck = null!;

    [GlobalSetup]
    public void Setup()
    {
        var design = Repository.Load(Example + ".toml");
        var lsb = new ClosedFormModel(design).Adc.LsbVolts;
        (circuit, options) = SamplingRun.Setup(design, 25, 0.0, design.Check.SettleLimitLsb * lsb, Conversions);
        sampleTimes = [.. Enumerable.Range(0, Conversions).Select(k => FrontEndCircuit.SampleTimeSeconds(design, k))];
        var sweep = new TransientSweep(sampleTimes[^1], options.MaxStepSeconds);
        deck = SpiceDeckWriter.Write(circuit, sweep with { StepGuards = StepGuard.ForSwitches(circuit) });

        var ours = Samples(BuiltInEngine.Instance.StartTransient(circuit, options));
        using var ngspice = new NgspiceEngine();
        var theirs = Samples(ngspice.StartTransient(circuit, options));
        var worst = ours.Zip(theirs, (a, b) => Math.Abs(a - b)).Max() / lsb;
        Console.WriteLine($"// {Example}: largest difference of the {Conversions} samples, built-in against ngspice: {worst:G3} LSB");
    }

    private double[] Samples(ISampledTransient run) => [.. sampleTimes.Select(t => run.VoltageAt(t, FrontEndNodes.Hold))];

    [Benchmark(Baseline = true)]
    public double Built_in_exact() => Samples(BuiltInEngine.Instance.StartTransient(circuit, options)).Sum();

    [Benchmark]
    public double Ngspice_library_guarded() => NgspiceSession.Run(deck).Plot("tran")[FrontEndNodes.Hold].Real[^1];
}
