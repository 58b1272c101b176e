using BenchmarkDotNet.Attributes;
using ThermVerify.Circuits;
using ThermVerify.Design;
using ThermVerify.FrontEnd;
using ThermVerify.Simulation;
using ThermVerify.Tolerances;

namespace ThermVerify.Benchmarks;

/// <summary>
/// Issue 17's units without op-amps, side by side in one run: the netlist soil probe's first sample after its PULSE
/// switches on (10 ns rise, 10 ms lead, 2 µs window), time-stepped all the way (the baseline, what every unit did
/// before) against stepped through the rise and exact after it (SettledSourcesTransient); one Monte Carlo unit of that
/// example and of the oven; and one DC temperature sweep of 151 points on the autoclave's 13-unknown bridge and
/// in-amp circuit, where the conditioning check's one-pass bound and the LU's cheaper equilibration count most.
/// </summary>
[ShortRunJob]
[MemoryDiagnoser]
public class UnitSpeedBenchmarks
{
    private Circuit switchOnCircuit = null!;
    private TransientOptions switchOnOptions = null!;
    private UnitEvaluator soilUnits = null!, ovenUnits = null!;
    private double[] soilDeviations = null!, ovenDeviations = null!;
    private Circuit autoclaveDc = null!;
    private double[] autoclaveTemperatures = null!;

    [GlobalSetup]
    public void Setup()
    {
        var soil = Repository.Load("soil-probe-switched-netlist.toml");
        (switchOnCircuit, switchOnOptions) = SwitchOnSettling.Setup(soil, -10, null, 1e-6);
        (soilUnits, soilDeviations) = Units(soil);
        (ovenUnits, ovenDeviations) = Units(Repository.Load("oven-pt1000.toml"));
        var autoclave = Repository.Load("autoclave-pt100-bridge-inamp.toml");
        autoclaveDc = FrontEndCircuit.Dc(autoclave, null);
        var (lo, hi) = (autoclave.Check.Range.MinCelsius, autoclave.Check.Range.MaxCelsius);
        autoclaveTemperatures = [.. Enumerable.Range(0, 151).Select(i => lo + i * (hi - lo) / 150)];
    }

    private static (UnitEvaluator, double[]) Units(FrontEndDesign design)
    {
        var evaluator = new UnitEvaluator(design, 1);
        var random = new UnitRandom(1, 0);
        return (evaluator, evaluator.Set.Sample(ref random));
    }

    [Benchmark(Baseline = true)]
    public double SwitchOnTimeStepped()
    {
        var run = new TransientSimulation(switchOnCircuit, switchOnOptions);
        run.AdvanceTo(switchOnOptions.StopTimeSeconds);
        return run.Voltage(FrontEndNodes.Hold);
    }

    [Benchmark]
    public double SwitchOnSteppedThenExact() =>
        BuiltInEngine.Instance.StartTransient(switchOnCircuit, switchOnOptions).VoltageAt(switchOnOptions.StopTimeSeconds, FrontEndNodes.Hold);

    [Benchmark]
    public double SoilProbeNetlistUnit() => soilUnits.Evaluate(soilDeviations).WorstErrorKelvin;

    [Benchmark]
    public double OvenUnit() => ovenUnits.Evaluate(ovenDeviations).WorstErrorKelvin;

    [Benchmark]
    public int AutoclaveDcSweep() => DcSweep.Temperature(autoclaveDc, autoclaveTemperatures).Count;
}
