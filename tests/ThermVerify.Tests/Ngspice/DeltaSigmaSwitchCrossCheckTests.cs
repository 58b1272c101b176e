using ThermVerify.Design;
using ThermVerify.FrontEnd;
using ThermVerify.FrontEnd.DeltaSigma;
using ThermVerify.Ngspice;
using Xunit.Abstractions;

namespace ThermVerify.Tests.Ngspice;

/// <summary>
/// The switched-capacitor input transient after a channel switch, the deck `deck --analysis tran` writes for a
/// delta-sigma design, run by ngspice (an outside engine) against the built-in engine's exact propagation of the same
/// circuit: the modulator's samples (v(ds_in) as the input capacitor leaves the pin) and the readings the sinc filter
/// makes of them, and the check's own readings (ChannelSettling) beside them.
/// </summary>
public class DeltaSigmaSwitchCrossCheckTests(ITestOutputHelper output)
{
    public static TheoryData<string> Unbuffered()
    {
        var data = new TheoryData<string>();
        foreach (var file in ExampleDesigns.DeltaSigma())
            if (ExampleDesigns.Load(file).Adc.DeltaSigma is { InputBuffered: false })
                data.Add(file);
        return data;
    }

    [NgspiceTheory]
    [MemberData(nameof(Unbuffered))]
    public void The_channel_switch_deck_gives_the_checks_samples_and_readings_in_ngspice(string file)
    {
        const int readings = 4;
        var design = ExampleDesigns.Load(file);
        var d = design.Adc.DeltaSigma!;
        var celsius = (design.Check.Range.MinCelsius + design.Check.Range.MaxCelsius) / 2;
        var lsb = new ClosedFormModel(design).Adc.LsbVolts;
        var deck = FrontEndDecks.Write(design, DeckAnalysis.Tran, new DeckOptions { Conversions = readings, PrintFigures = false });
        using var ngspice = new NgspiceEngine();
        var plot = ngspice.Run(deck).Plot("tran");
        var time = plot["time"].Real;
        var theirs = plot[InputLoading.InputNode].Real;

        var other = DeltaSigmaDecks.OtherChannelVolts(design, celsius);
        var circuit = ChannelSettling.SwitchCircuit(design, celsius, other, 0);
        var filter = SincFilter.Of(d);
        var ends = DeltaSigmaDecks.ReadingEnds(d, filter, readings);
        var period = 1 / d.ModulatorRateHertz;
        var run = ((ICheckEngine)BuiltInEngine.Instance).StartTransient(circuit,
            new ThermVerify.Simulation.TransientOptions { StopTimeSeconds = ChannelSettling.SampleSeconds(d, ends[^1]) + period, MaxStepSeconds = period / 20 });
        // ngspice opens a switch at the first time point past the control's threshold, inside its 1 ps edge, so the
        // instant itself is not comparable; T/1000 before it the input capacitor is on the pin in both engines (its
        // switch's τ is T/200, so it follows the pin) and the pin has moved by a few nV at most.
        var before = ChannelSettling.SampleSeconds(d, 0) - DeltaSigmaDecks.MeasureSeconds(d, 0);
        var count = ends[^1] + 1;
        var atEdge = new double[count];
        var ours = new double[count];
        var ngspiceSamples = new double[count];
        var worst = 0.0;
        for (long n = 0; n < count; n++)
        {
            var t = ChannelSettling.SampleSeconds(d, n);
            ours[n] = run.VoltageAt(t - before, InputLoading.InputNode);
            atEdge[n] = run.VoltageAt(t, InputLoading.InputNode);
            ngspiceSamples[n] = At(time, theirs, t - before);
            worst = Math.Max(worst, Math.Abs(ours[n] - ngspiceSamples[n]));
        }
        var history = other ?? 0;
        var ourReadings = filter.Readings(n => ours[n], _ => history, readings, d.FilterReset);
        var theirReadings = filter.Readings(n => ngspiceSamples[n], _ => history, readings, d.FilterReset);
        var check = ChannelSettling.At(design, celsius, BuiltInEngine.Instance, d.SharedFilter ? ChannelStart.SharedFilter : ChannelStart.OwnFilter);
        output.WriteLine($"{file}: LSB {lsb:G4} V, worst sample difference {worst:G4} V ({worst / lsb:G3} LSB) over {count} samples");
        for (var k = 0; k < readings; k++)
            output.WriteLine($"reading {k + 1}: ours {ourReadings[k].Value:R} V, ngspice {theirReadings[k].Value:R} V, difference {(ourReadings[k].Value - theirReadings[k].Value) / lsb:G3} LSB");

        // The check's readings are this circuit's samples at the switch's opening through the filter (to a millionth of an
        // LSB: the exact propagation stops at other times here, so rounding differs), and
        // the deck holds the other channel the check found worse.
        if (other is { } v) Assert.Equal(v, check.OtherChannelVolts);
        var checkReadings = filter.Readings(n => atEdge[n], _ => history, readings, d.FilterReset);
        for (var k = 0; k < readings; k++)
            Tolerance.AssertClose(check.Readings[k].Value, checkReadings[k].Value, 0, 1e-6 * lsb, $"{file}: the check's reading {k + 1}");
        // Against ngspice (reltol 1e-6, trapezoidal, the deck as written): every sample within 0.05 LSB of the 24-bit
        // converter (measured 0.023 LSB, 2.7 nV, in the steep start after the switch), every reading within 0.01 LSB
        // (measured 0.0013 LSB): the filter averages the samples' differences.
        Assert.True(worst <= 0.05 * lsb, $"{file}: samples differ by up to {worst:G4} V ({worst / lsb:G3} LSB)");
        for (var k = 0; k < readings; k++)
            Tolerance.AssertClose(ourReadings[k].Value, theirReadings[k].Value, 0, 0.01 * lsb, $"{file}: reading {k + 1} against ngspice");
        // The transient is not flat: the first reading is far from the last (the check's channel-switch finding).
        Assert.True(Math.Abs(ourReadings[0].Value - ourReadings[^1].Value) > 1000 * lsb);
    }

    [NgspiceFact]
    public void The_switch_deck_prints_the_last_sample_of_each_reading_as_the_built_in_engine_has_it()
    {
        // A small shared-filter design (1 kHz sinc3 from 256 kHz: three readings are 1,536 modulator periods): what
        // `ngspice -b` prints (7 significant digits) against the built-in engine's run of the same circuit at the same times.
        var design = ThermVerify.Tests.Design.DeltaSigmaDesigns.Make(("adc.data_rate", "\"1 kHz\""), ("adc.channel_filter", "\"shared\""),
            ("filter.series_resistor", "\"1 kohm\""), ("filter.reservoir_capacitor", "\"10 nF\""));
        const int readings = 3;
        var d = design.Adc.DeltaSigma!;
        var celsius = (design.Check.Range.MinCelsius + design.Check.Range.MaxCelsius) / 2;
        var printed = BatchOutput.Run(FrontEndDecks.Write(design, DeckAnalysis.Tran, new DeckOptions { Conversions = readings }));
        var ends = DeltaSigmaDecks.ReadingEnds(d, SincFilter.Of(d), readings);
        var run = ((ICheckEngine)BuiltInEngine.Instance).StartTransient(ChannelSettling.SwitchCircuit(design, celsius, DeltaSigmaDecks.OtherChannelVolts(design, celsius), 0),
            new ThermVerify.Simulation.TransientOptions { StopTimeSeconds = ChannelSettling.SampleSeconds(d, ends[^1]) + 1 / d.ModulatorRateHertz });
        for (var k = 0; k < readings; k++)
            Tolerance.AssertClose(run.VoltageAt(DeltaSigmaDecks.MeasureSeconds(d, ends[k]), InputLoading.InputNode), printed.Measure($"last_sample_{k + 1}"),
                5e-7, 1e-9, $"last sample of reading {k + 1}");
    }

    [NgspiceTheory]
    [MemberData(nameof(ExampleDesigns.DeltaSigma), MemberType = typeof(ExampleDesigns))]
    public void The_ac_and_noise_decks_of_a_delta_sigma_design_print_the_response_and_the_noise_density(string file)
    {
        // The noise a delta-sigma reading starts from is the density at the pin of this circuit (DeltaSigmaNoise); what
        // `ngspice -b` prints of the decks against the built-in AC and noise analyses, within the limits of every deck
        // (0.01 dB, 0.1°, 1 %; RunnableDeckTests).
        var design = ExampleDesigns.Load(file);
        var celsius = (design.Check.Range.MinCelsius + design.Check.Range.MaxCelsius) / 2;
        var pin = FrontEndCircuit.PinNode(design);
        var ac = BatchOutput.Run(FrontEndDecks.Write(design, DeckAnalysis.Ac));
        var frequencies = ac.Column("frequency").ToArray();
        var response = ThermVerify.Simulation.AcAnalysis.Run(FrontEndDecks.AcCircuit(design, celsius), ThermVerify.Simulation.FrequencySweep.At(frequencies)).Voltage(pin);
        for (var k = 0; k < frequencies.Length; k++)
        {
            Tolerance.AssertClose(20 * Math.Log10(response[k].Magnitude), ac.Column($"vdb({pin})")[k], 0, 0.01, $"{file}: dB at {frequencies[k]:G4} Hz");
            Tolerance.AssertClose(response[k].Phase, ac.Column($"vp({pin})")[k], 0, 0.1 * Math.PI / 180, $"{file}: phase at {frequencies[k]:G4} Hz");
        }
        var noise = BatchOutput.Run(FrontEndDecks.Write(design, DeckAnalysis.Noise));
        var noiseFrequencies = noise.Column("frequency").ToArray();
        var density = ThermVerify.Simulation.NoiseAnalysis.Run(FrontEndDecks.AcCircuit(design, celsius), pin, ThermVerify.Simulation.FrequencySweep.At(noiseFrequencies)).OutputDensity;
        Assert.True(noiseFrequencies.Length > 20);
        for (var k = 0; k < noiseFrequencies.Length; k++)
            Tolerance.AssertClose(density[k], noise.Column("onoise_spectrum")[k], 0.01, 0, $"{file}: noise at {noiseFrequencies[k]:G4} Hz");
    }

    [NgspiceTheory]
    [MemberData(nameof(ExampleDesigns.DeltaSigma), MemberType = typeof(ExampleDesigns))]
    public void The_sweep_deck_prints_the_pin_with_the_inputs_average_load(string file)
    {
        // The deck's sweep against the built-in operating point of the check's circuit with the load (InputLoading.Average)
        // at each temperature: within 1 µV and ngspice's 7 printed digits, as every sweep deck (RunnableDeckTests).
        var design = ExampleDesigns.Load(file);
        var printed = BatchOutput.Run(FrontEndDecks.Write(design, DeckAnalysis.Dc));
        var temperatures = ThermVerify.Sensors.SensorTabulation.Grid(design.Check.Range, design.Check.StepKelvin).ToArray();
        var pin = printed.Column($"v({FrontEndCircuit.PinNode(design)})");
        Assert.Equal(temperatures.Length, pin.Count);
        for (var i = 0; i < temperatures.Length; i++)
        {
            var ours = ThermVerify.Simulation.OperatingPoint.Solve(InputLoading.Average(design, temperatures[i])).Voltage(FrontEndCircuit.PinNode(design));
            Tolerance.AssertClose(ours, pin[i], 5e-7, 1e-6, $"{file}: v(pin) at {temperatures[i]} °C");
        }
    }

    [NgspiceTheory]
    [InlineData("own")]
    [InlineData("shared")]
    public void The_buffered_switch_deck_in_ngspice_follows_the_checks_single_pole(string channelFilter)
    {
        // The check takes a buffered input's settling in closed form (a single pole, elementary); the deck is the circuit
        // it stands for, and ngspice's run of it gives the same samples and readings. A 50 nA input behind 10 kΩ and
        // 100 nF (τ = 1.5 ms against T = 3.9 µs), sinc1 at 1 kHz: three readings are 768 modulator periods.
        var design = ThermVerify.Tests.Design.DeltaSigmaDesigns.Make(("adc.input", "\"buffered\""), ("adc.sampling_capacitance", null),
            ("adc.input_current", "\"+50 nA\""), ("adc.filter", "\"sinc1\""), ("adc.data_rate", "\"1 kHz\""), ("adc.channel_filter", $"\"{channelFilter}\""),
            ("filter.series_resistor", "\"10 kohm\""), ("filter.reservoir_capacitor", "\"100 nF\""));
        const int readings = 3;
        var d = design.Adc.DeltaSigma!;
        var celsius = (design.Check.Range.MinCelsius + design.Check.Range.MaxCelsius) / 2;
        var lsb = new ClosedFormModel(design).Adc.LsbVolts;
        using var ngspice = new NgspiceEngine();
        var plot = ngspice.Run(FrontEndDecks.Write(design, DeckAnalysis.Tran, new DeckOptions { Conversions = readings, PrintFigures = false })).Plot("tran");
        var time = plot["time"].Real;
        var pin = plot[FrontEndCircuit.PinNode(design)].Real;
        var other = DeltaSigmaDecks.OtherChannelVolts(design, celsius);
        var start = d.SharedFilter ? ChannelStart.SharedFilter : ChannelStart.OwnFilter;
        var load = InputLoading.At(design, celsius, BuiltInEngine.Instance);
        var filter = SincFilter.Of(d);
        var count = DeltaSigmaDecks.ReadingEnds(d, filter, readings)[^1] + 1;
        var closed = new double[count];
        var theirs = new double[count];
        var worst = 0.0;
        for (long n = 0; n < count; n++)
        {
            closed[n] = ChannelSettling.BufferedSample(design, d, load, start, other ?? 0, n);
            theirs[n] = At(time, pin, BufferedSwitchDeck.SampleSeconds(d, n, other is not null));
            worst = Math.Max(worst, Math.Abs(closed[n] - theirs[n]));
        }
        var step = Math.Abs(closed[0] - load.SwitchedVolts);
        output.WriteLine($"{channelFilter}: step {step:G4} V, LSB {lsb:G4} V, worst sample difference {worst:G4} V ({worst / lsb:G3} LSB, {worst / step:G3} of the step)");
        var history = other ?? 0;
        var ours = ChannelSettling.At(design, celsius, BuiltInEngine.Instance, start);
        var ngspiceReadings = filter.Readings(n => theirs[n], _ => history, readings, d.FilterReset);
        for (var k = 0; k < readings; k++)
            output.WriteLine($"reading {k + 1}: check {ours.Readings[k].Value:R} V, ngspice {ngspiceReadings[k].Value:R} V, difference {(ours.Readings[k].Value - ngspiceReadings[k].Value) / lsb:G3} LSB");
        Assert.True(step > 1000 * lsb, "the transient is not flat");
        // Measured: 2.5e-9 of the step (own filter, 0.73 mV) and 8.8e-9 (shared, 1.8 V, 0.08 LSB); readings within 0.07 LSB.
        Assert.True(worst <= 1e-7 * step + 0.05 * lsb, $"samples differ by up to {worst:G4} V");
        for (var k = 0; k < readings; k++)
            Tolerance.AssertClose(ours.Readings[k].Value, ngspiceReadings[k].Value, 0, 1e-7 * step + 0.05 * lsb, $"reading {k + 1}");
    }

    /// <summary>The value at a time point ngspice took (switch edges are breakpoints, so samples fall on one), else linear between neighbours.</summary>
    private static double At(double[] time, double[] value, double t)
    {
        var i = Array.BinarySearch(time, t);
        if (i >= 0) return value[i];
        i = ~i;
        if (i > 0 && t - time[i - 1] <= 1e-13) return value[i - 1];
        if (i < time.Length && time[i] - t <= 1e-13) return value[i];
        var w = (t - time[i - 1]) / (time[i] - time[i - 1]);
        return value[i - 1] + w * (value[i] - value[i - 1]);
    }
}
