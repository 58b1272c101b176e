using System.Numerics;
using ThermVerify.Circuits;
using ThermVerify.Design;
using ThermVerify.FrontEnd;
using ThermVerify.FrontEnd.DeltaSigma;
using ThermVerify.Simulation;
using ThermVerify.Tests.Design;
using ThermVerify.Tests.Ngspice;

namespace ThermVerify.Tests.FrontEnd.DeltaSigma;

/// <summary>
/// A channel switch's readings from the recurrence the engine composes (powers and geometric sums of the period map,
/// <see cref="RecurrenceReadings"/>) against the same engine read sample by sample through the filter's convolution
/// (the path every engine without a composed recurrence takes): every reading and the trace within 1e-3 LSB (the
/// sample-by-sample path takes the settled sample once 256 in a row are within 1e-4 LSB of it).
/// </summary>
public class ChannelSettlingRecurrenceTests
{
    /// <summary>The built-in engine with its transients read sample by sample only (no composed recurrence).</summary>
    private sealed class SampleBySampleEngine : ICheckEngine
    {
        public string Name => "built-in, sample by sample";

        IReadOnlyList<double[]> ICheckEngine.TemperatureSweep(Circuit circuit, IReadOnlyList<double> temperaturesCelsius, IReadOnlyList<string> nodes) =>
            BuiltInEngine.Instance.TemperatureSweep(circuit, temperaturesCelsius, nodes);

        ISampledTransient ICheckEngine.StartTransient(Circuit circuit, TransientOptions options) =>
            new Plain(BuiltInEngine.Instance.StartTransient(circuit, options));

        (double[] FrequenciesHertz, Complex[][] Volts) ICheckEngine.AcSweep(Circuit circuit, double startHertz, double stopHertz, int pointsPerDecade,
            IReadOnlyList<string> nodes) => BuiltInEngine.Instance.AcSweep(circuit, startHertz, stopHertz, pointsPerDecade, nodes);

        (double[] FrequenciesHertz, double[] VoltsPerRootHertz) ICheckEngine.NoiseSweep(Circuit circuit, string node, string inputSource,
            double startHertz, double stopHertz, int pointsPerDecade) =>
            BuiltInEngine.Instance.NoiseSweep(circuit, node, inputSource, startHertz, stopHertz, pointsPerDecade);

        private sealed class Plain(ISampledTransient run) : ISampledTransient
        {
            public double VoltageAt(double timeSeconds, string node) => run.VoltageAt(timeSeconds, node);

            public bool TryPeriodicSteadyState(string samplingSwitch, string node, out double volts) =>
                run.TryPeriodicSteadyState(samplingSwitch, node, out volts);
        }
    }

    public static TheoryData<string> Cases =>
        ["kiln example", "kiln, no filter reset", "kiln, own filter", "kiln, sinc4 and a mean of 3", "plain test design", "plain, switched on"];

    private static FrontEndDesign Design(string name)
    {
        var kiln = ExampleDesigns.Load("kiln-bank-pt100-deltasigma.toml");
        FrontEndDesign Kiln(Func<DeltaSigmaSpec, DeltaSigmaSpec> change) => kiln with { Adc = kiln.Adc with { DeltaSigma = change(kiln.Adc.DeltaSigma!) } };
        return name switch
        {
            "kiln example" => kiln,
            "kiln, no filter reset" => Kiln(d => d with { FilterReset = false }),
            "kiln, own filter" => Kiln(d => d with { SharedFilter = false }),
            "kiln, sinc4 and a mean of 3" => Kiln(d => d with { FilterOrder = 4, AverageLength = 3, DataRateHertz = 10 }),
            "plain test design" => DeltaSigmaDesigns.Make(),
            _ => DeltaSigmaDesigns.Make(("divider.switch_on_lead", "\"5 ms\""), ("filter.reservoir_capacitor", "\"1 uF\""), ("filter.series_resistor", "\"1 kohm\"")),
        };
    }

    [Theory]
    [MemberData(nameof(Cases))]
    public void The_recurrence_gives_the_sample_by_sample_readings(string name)
    {
        var design = Design(name);
        var starts = ThermVerify.Check.DeltaSigma.DeltaSigmaFindings.Starts(design);
        foreach (var start in starts)
            foreach (var celsius in new[] { design.Check.Range.MinCelsius, design.Check.Range.MaxCelsius })
            {
                // The built-in engine composes the recurrence here (else both runs below would be sample by sample).
                var load = InputLoading.At(design, celsius, BuiltInEngine.Instance);
                Assert.NotNull(ChannelSettling.Recurrence(design, design.Adc.DeltaSigma!, celsius, load, BuiltInEngine.Instance, start, 0));
                var fast = ChannelSettling.At(design, celsius, BuiltInEngine.Instance, start);
                var slow = ChannelSettling.At(design, celsius, new SampleBySampleEngine(), start);
                var lsb = slow.LsbVolts;
                Assert.Equal(slow.OtherChannelVolts, fast.OtherChannelVolts);
                Assert.Equal(slow.Readings.Count, fast.Readings.Count);
                for (var k = 0; k < slow.Readings.Count; k++)
                {
                    Assert.Equal(slow.Readings[k].Seconds, fast.Readings[k].Seconds, 15);
                    Tolerance.AssertClose(slow.Readings[k].Value, fast.Readings[k].Value, 0, 1e-3 * lsb, $"{name}, {start}, {celsius} °C, reading {k + 1}");
                }
                Assert.Equal(slow.ReadingsToDiscard, fast.ReadingsToDiscard);
                Assert.Equal(slow.Trace.Seconds, fast.Trace.Seconds);
                for (var i = 0; i < slow.Trace.Volts.Length; i++)
                    Tolerance.AssertClose(slow.Trace.Volts[i], fast.Trace.Volts[i], 0, 1e-3 * lsb, $"{name}, {start}, trace point {i}");
            }
    }

    [Fact]
    public void The_run_wide_memo_gives_the_same_recurrence_and_readings()
    {
        // The check's engine keeps each circuit's composed recurrence for the run (MemoizingEngine): the first and a
        // repeated channel switch through it read exactly what the built-in engine gives directly.
        var design = ExampleDesigns.Load("kiln-bank-pt100-deltasigma.toml");
        var start = ThermVerify.Check.DeltaSigma.DeltaSigmaFindings.Start(design.Adc.DeltaSigma!);
        var memo = MemoizingEngine.Wrap(BuiltInEngine.Instance);
        var direct = ChannelSettling.At(design, 150, BuiltInEngine.Instance, start);
        var load = InputLoading.At(design, 150, BuiltInEngine.Instance);
        Assert.NotNull(ChannelSettling.Recurrence(design, design.Adc.DeltaSigma!, 150, load, memo, start, 0));
        foreach (var run in new[] { ChannelSettling.At(design, 150, memo, start), ChannelSettling.At(design, 150, memo, start) })
        {
            Assert.Equal(direct.Readings.Select(r => r.Value), run.Readings.Select(r => r.Value));
            Assert.Equal(direct.Trace.Volts, run.Trace.Volts);
        }
    }

    [Fact]
    public void A_buffered_inputs_readings_are_its_single_pole_convolved_with_the_filter()
    {
        // The stability chamber: buffered, no reset, sinc3 of 12,800. Reference: BufferedSample (the closed form) at every
        // modulator sample through the filter's convolution of its impulse response.
        var design = ExampleDesigns.Load("stability-chamber-pt100-pga.toml");
        var d = design.Adc.DeltaSigma!;
        var filter = SincFilter.Of(d);
        var start = ThermVerify.Check.DeltaSigma.DeltaSigmaFindings.Start(d);
        var celsius = design.Check.Range.MaxCelsius;
        var r = ChannelSettling.At(design, celsius, BuiltInEngine.Instance, start);
        var load = InputLoading.At(design, celsius, BuiltInEngine.Instance);
        var direct = filter.Readings(n => ChannelSettling.BufferedSample(design, d, load, start, r.OtherChannelVolts, n), _ => r.OtherChannelVolts,
            r.Readings.Count, d.FilterReset);
        for (var k = 0; k < direct.Count; k++)
            Tolerance.AssertClose(direct[k].Value, r.Readings[k].Value, 0, 1e-4 * r.LsbVolts, $"reading {k + 1}");
    }
}
