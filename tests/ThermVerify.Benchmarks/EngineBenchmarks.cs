using BenchmarkDotNet.Attributes;
using ThermVerify.Circuits;
using ThermVerify.Simulation;

namespace ThermVerify.Benchmarks;

/// <summary>
/// The two engine workloads thermverify runs most: a temperature sweep of a sensor divider and the
/// sampling transient through many conversions. Per-point figures are the run time divided by 1,651.
/// </summary>
[MemoryDiagnoser]
public class EngineBenchmarks
{
    private Circuit divider = null!;
    private double[] temperatures = null!;
    private Circuit sampling = null!;
    private TransientOptions options = null!;

    [GlobalSetup]
    public void Setup()
    {
        divider = FrontEnds.NtcDivider();
        temperatures = FrontEnds.Temperatures();
        sampling = FrontEnds.SamplingInput();
        options = new TransientOptions
        {
            StopTimeSeconds = FrontEnds.Conversions * FrontEnds.SamplePeriodSeconds,
            OutputTimesSeconds = FrontEnds.AcquisitionEnds(),
        };
    }

    [Benchmark(Description = "DC temperature sweep, 1651 points")]
    public double TemperatureSweep() => DcSweep.Temperature(divider, temperatures).Voltage("adc")[^1];

    [Benchmark(Description = "Sampling transient, 64 conversions")]
    public double SamplingTransient() => Transient.Run(sampling, options).FinalVoltage("hold");
}
