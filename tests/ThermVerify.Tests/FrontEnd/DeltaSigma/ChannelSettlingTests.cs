using ThermVerify.FrontEnd;
using ThermVerify.FrontEnd.DeltaSigma;
using ThermVerify.Tests.Design;

namespace ThermVerify.Tests.FrontEnd.DeltaSigma;

/// <summary>The readings after a channel switch: the analog transient through the sinc filter, against closed forms.</summary>
public class ChannelSettlingTests
{
    [Theory]
    [InlineData(1, 0)]
    [InlineData(3, 2)]
    [InlineData(4, 3)]
    public void A_fast_source_without_filter_reset_needs_N_minus_1_readings_discarded(int order, int discard)
    {
        // Without a reset the filter still holds the other channel for N − 1 readings after a synchronous switch (the
        // sinc^N impulse response spans N conversions; Hogenauer 1981, from memory); the bare 5 kΩ source settles within
        // the first charging phase, so the filter alone sets the count.
        var design = DeltaSigmaDesigns.Make(("adc.filter", $"\"sinc{order}\""), ("adc.filter_reset", "false"));
        var r = ChannelSettling.At(design, 25, BuiltInEngine.Instance);
        Assert.Equal(discard, r.ReadingsToDiscard);
        Assert.Equal(discard > 0, r.FirstUsedOff);
        // With the other channel at 0 V or full scale, the first reading's error is the step times the share of the
        // impulse response still on the other channel: 1 − (step response at the first conversion).
        var filter = SincFilter.Of(design.Adc.DeltaSigma!);
        var share = 1 - filter.StepReadings(1)[0];
        var expected = share * Math.Max(r.FinalVolts, 3.3 - r.FinalVolts);
        Tolerance.AssertClose(expected, Math.Abs(r.FirstUsedErrorVolts), 1e-6, 1e-6, "first reading's error");
    }

    [Fact]
    public void With_filter_reset_the_first_reading_of_a_fast_source_is_final()
    {
        var design = DeltaSigmaDesigns.Make();
        var r = ChannelSettling.At(design, 25, BuiltInEngine.Instance);
        Assert.Equal(0, r.ReadingsToDiscard);
        Assert.False(r.FirstUsedOff);
        // The first reading comes after the filter has filled: three conversions of 20 ms (sinc3 at 50 Hz).
        Assert.Equal(3 / 50.0, r.Readings[0].Seconds, 9);
    }

    [Fact]
    public void Behind_a_reservoir_the_readings_follow_the_single_pole_through_the_filter()
    {
        // The reservoir rests at the unloaded voltage; joined, the input pulls it to the loaded level with
        // τ = (R_s ∥ R_eq)·C_res. An exponential e^(−a·n) through sinc^N with reset is e^(−a·n)·H(e^(−a)), with
        // H(z) = [(1 − z^(−M))/(M(1 − z^(−1)))]^N (Hogenauer 1981, from memory), a = T_mod/τ.
        var design = DeltaSigmaDesigns.Make(("adc.filter", "\"sinc2\""), ("adc.data_rate", "\"1 kHz\""),
            ("filter.series_resistor", "\"10 kohm\""), ("filter.reservoir_capacitor", "\"100 nF\""));
        var r = ChannelSettling.At(design, 25, BuiltInEngine.Instance);
        var load = InputLoading.At(design, 25, BuiltInEngine.Instance);
        var d = design.Adc.DeltaSigma!;
        var tau = ChannelSettling.AnalogTimeConstant(design, d, load);
        var t = 1 / d.ModulatorRateHertz;
        var a = t / tau;
        var m = d.Decimation;
        var h = Math.Pow((1 - Math.Exp(a * m)) / (m * (1 - Math.Exp(a))), 2);
        var step = load.UnloadedVolts - load.SwitchedVolts;
        Assert.True(step > 1e-3, $"the load's step {step} V");
        for (var k = 0; k < 4; k++)
        {
            // Sample n is read at (n + 1.5)·T after the input joins at T: n_k + 1.5 periods after it.
            var n = (k + 2) * m - 1;
            var expected = step * Math.Exp(-a * (n + 0.5)) * h;
            // Within 2 % of the first error and 1 µV: the switched input against the single pole (charge sharing, C_in).
            Tolerance.AssertClose(expected, r.ErrorVolts[k], 0.02, 1e-6, $"reading {k + 1}");
        }
        Assert.True(r.ReadingsToDiscard > 0);
    }
}

/// <summary>The buffered input's channel switch: the single pole of its input current through the filter.</summary>
public class BufferedChannelSettlingTests
{
    [Fact]
    public void A_buffered_input_current_settles_as_its_single_pole_through_the_filter()
    {
        // Own filter: the reservoir rests unloaded and falls by I·R_s with τ = R_s·C when the buffer joins; through a
        // reset sinc1 of M samples, reading k is the mean of the exponential over its conversion (elementary).
        var design = DeltaSigmaDesigns.Make(("adc.input", "\"buffered\""), ("adc.sampling_capacitance", null), ("adc.input_current", "\"+50 nA\""),
            ("adc.filter", "\"sinc1\""), ("adc.data_rate", "\"1 kHz\""), ("filter.series_resistor", "\"10 kohm\""), ("filter.reservoir_capacitor", "\"100 nF\""));
        var r = ChannelSettling.At(design, 25, BuiltInEngine.Instance);
        var rs = 5e3 + 10e3;
        var tau = rs * 100e-9;
        var t = 1 / 256e3;
        var step = 50e-9 * rs; // the unloaded level lies I·R_s above the loaded one
        for (var k = 0; k < 3; k++)
        {
            var sum = 0.0;
            for (var n = k * 256; n < (k + 1) * 256; n++) sum += Math.Exp(-(n + 0.5) * t / tau);
            Tolerance.AssertClose(step * sum / 256, r.ErrorVolts[k], 1e-9, 1e-15, $"reading {k + 1}");
        }
    }
}

/// <summary>The excitation switched on for a reading: the pin charges from 0 V through the source, then the filter.</summary>
public class SwitchOnSettlingTests
{
    [Fact]
    public void The_readings_after_switch_on_follow_the_charging_reservoir_through_the_filter()
    {
        // The pin charges as V·(1 − e^(−t/τ)), τ = (R_s ∥ R_eq)·C (single pole, elementary); the converter starts
        // 5 ms after the switch; through a sinc1 of M samples a reading is the mean of its M samples.
        var design = DeltaSigmaDesigns.Make(("divider.switch_on_lead", "\"5 ms\""), ("adc.filter", "\"sinc1\""), ("adc.data_rate", "\"500 Hz\""),
            ("filter.series_resistor", "\"1 kohm\""), ("filter.reservoir_capacitor", "\"1 uF\""));
        var r = ChannelSettling.At(design, 25, BuiltInEngine.Instance, ChannelStart.SwitchOn);
        var load = InputLoading.At(design, 25, BuiltInEngine.Instance);
        var tau = ChannelSettling.AnalogTimeConstant(design, design.Adc.DeltaSigma!, load);
        var t = 1 / 256e3;
        const int m = 512;
        for (var k = 0; k < 3; k++)
        {
            var mean = 0.0;
            for (var n = k * m; n < (k + 1) * m; n++) mean += Math.Exp(-(5e-3 + (n + 1.5) * t) / tau);
            // Within 1 % of the step: the input's switched load against its average (charge sharing, C_in/C = 8e-6).
            Tolerance.AssertClose(-load.SwitchedVolts * mean / m, r.ErrorVolts[k], 0.01, 1e-7, $"reading {k + 1}");
        }
        Assert.True(r.ReadingsToDiscard > 0);
    }
}

/// <summary>The trace of the pin a channel switch records for the report's figure.</summary>
public class ChannelSettlingTraceTests
{
    [Fact]
    public void The_trace_is_the_modulator_samples_decimated_and_ends_at_the_last_reading()
    {
        // The buffered single pole: sample n is the loaded level plus (unloaded − loaded)·e^(−(n + 0.5)·T/τ), τ = R_s·C
        // (elementary); the trace holds it at (n + 1)·T on the readings' clock, at most 600 points up to the last reading.
        var design = DeltaSigmaDesigns.Make(("adc.input", "\"buffered\""), ("adc.sampling_capacitance", null), ("adc.input_current", "\"+50 nA\""),
            ("adc.filter", "\"sinc1\""), ("adc.data_rate", "\"1 kHz\""), ("filter.series_resistor", "\"10 kohm\""), ("filter.reservoir_capacitor", "\"100 nF\""));
        var r = ChannelSettling.At(design, 25, BuiltInEngine.Instance);
        var load = InputLoading.At(design, 25, BuiltInEngine.Instance);
        var t = 1 / 256e3;
        var tau = 15e3 * 100e-9;
        Assert.InRange(r.Trace.Seconds.Length, 2, ChannelSettling.TracePoints + 1);
        Assert.Equal(r.Readings[^1].Seconds, r.Trace.Seconds[^1], 12);
        for (var i = 0; i < r.Trace.Seconds.Length; i++)
        {
            var n = Math.Round(r.Trace.Seconds[i] / t) - 1;
            var expected = load.SwitchedVolts + (load.UnloadedVolts - load.SwitchedVolts) * Math.Exp(-(n + 0.5) * t / tau);
            Tolerance.AssertClose(expected, r.Trace.Volts[i], 1e-12, 1e-15, $"sample {n}");
        }
    }
}
