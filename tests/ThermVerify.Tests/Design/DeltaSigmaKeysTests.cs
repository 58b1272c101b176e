using ThermVerify.Check;
using ThermVerify.Design;
using ThermVerify.Firmware;
using ThermVerify.FrontEnd;
using ThermVerify.Tolerances;

namespace ThermVerify.Tests.Design;

/// <summary>The [adc] keys of a delta-sigma converter: read, refused with position and fix, written back.</summary>
public class DeltaSigmaKeysTests
{
    private static FrontEndDesign Parse(string text) => DesignLoader.Parse(text, "ds.toml", Path.GetTempPath());

    [Fact]
    public void The_plain_converter_is_read_with_its_defaults()
    {
        var adc = DeltaSigmaDesigns.Make().Adc;
        Assert.Equal(ConverterKind.DeltaSigma, adc.Kind);
        var ds = adc.DeltaSigma!;
        Assert.Equal(256e3, ds.ModulatorRateHertz);
        Assert.Equal(50, ds.DataRateHertz);
        Assert.False(ds.InputBuffered);
        Assert.Equal(8e-12, ds.SamplingCapacitanceFarads);
        Assert.Equal(DigitalFilterKind.Sinc, ds.Filter);
        Assert.Equal(3, ds.FilterOrder);
        Assert.Equal(5120, ds.Decimation); // 256 kHz / 50 Hz
        Assert.True(ds.FilterReset);
        Assert.Equal(0, ds.ReadingsDiscarded);
        Assert.Equal([50.0, 60.0], ds.RejectionHertz);
        Assert.Equal(50, adc.SampleRateHertz); // the data rate: readings per second of the channel
        Assert.Equal(0, adc.AcquisitionTimeSeconds);
    }

    [Fact]
    public void The_successive_approximation_converter_stays_the_default()
    {
        Assert.Equal(ConverterKind.SuccessiveApproximation, Check.TestDesign.Make().Adc.Kind);
        Assert.Null(Check.TestDesign.Make().Adc.DeltaSigma);
        Assert.Equal(ConverterKind.SuccessiveApproximation, Check.TestDesign.Make(("adc.kind", "\"successive-approximation\"")).Adc.Kind);
    }

    [Fact]
    public void A_buffered_converter_with_a_noise_table_is_read_and_its_row_found()
    {
        var ds = Parse(DeltaSigmaDesigns.WithNoiseTable(DeltaSigmaDesigns.TwoRows)).Adc.DeltaSigma!;
        Assert.True(ds.InputBuffered);
        Assert.Equal(2e-9, ds.InputCurrentAmperes);
        Assert.True(ds.InputCurrentSigned);
        Assert.Equal(4, ds.Gain);
        Assert.Equal(DigitalFilterKind.SincAverage, ds.Filter);
        Assert.Equal(4, ds.FilterOrder);
        Assert.Equal(2, ds.AverageLength);
        Assert.Equal(2560, ds.Decimation); // 256 kHz / (50 Hz · 2)
        Assert.False(ds.FilterReset);
        Assert.True(ds.SharedFilter);
        Assert.Equal(3, ds.ReadingsDiscarded);
        Assert.Equal([50.0, 60.0, 400.0], ds.RejectionHertz);
        Assert.Equal(0.01, ds.InterferenceVolts!.Value, 15);
        Assert.Equal(2, ds.NoiseTable.Count);
        Assert.Equal(0.4e-6, ds.TableNoise!.RmsVolts, 15);
    }

    [Fact]
    public void Both_kinds_write_back_to_equal_designs()
    {
        foreach (var design in new[] { DeltaSigmaDesigns.Make(), Parse(DeltaSigmaDesigns.WithNoiseTable(DeltaSigmaDesigns.TwoRows)) })
        {
            var text = DesignWriter.ToToml(design);
            var back = Parse(text);
            Assert.Equal(design.Adc, back.Adc);
            Assert.Equal(text, DesignWriter.ToToml(back));
        }
    }

    [Theory]
    [InlineData("adc.acquisition_time", "\"2 us\"", "successive-approximation")]
    [InlineData("adc.precharge", "\"worst\"", "successive-approximation")]
    [InlineData("adc.filter", "\"sinc9\"", "sinc8")]
    [InlineData("adc.filter", null, "sinc3")]
    [InlineData("adc.input", "\"half\"", "unbuffered")]
    [InlineData("adc.input_current", "\"1 nA\"", "only to a buffered input")]
    [InlineData("adc.sampling_capacitance", null, "sampling_capacitance")]
    [InlineData("adc.data_rate", "\"60 Hz\"", "not a whole number")]
    [InlineData("adc.data_rate", "\"300 kHz\"", "not a whole number")]
    [InlineData("adc.average_length", "0", "outside 1..1024")]
    [InlineData("adc.readings_discarded", "-1", "outside 0..1000")]
    [InlineData("adc.filter_reset", "\"yes\"", "true or false")]
    [InlineData("adc.channel_filter", "\"both\"", "shared")]
    [InlineData("adc.gain", "0", "greater than zero")]
    [InlineData("adc.rejection_frequencies", "\"50 Hz\"", "list")]
    [InlineData("adc.rejection_frequencies", "[\"50 V\"]", "")]
    [InlineData("adc.modulator_rate", "\"1e15 Hz\"", "plausible")]
    public void A_wrong_delta_sigma_key_is_refused_at_its_key_with_a_fix(string key, string? value, string words)
    {
        var e = Assert.Throws<DesignException>(() => DeltaSigmaDesigns.Make((key, value)));
        Assert.True(key == e.KeyPath, e.Message);
        Assert.Contains(words, e.Message);
        Assert.True(e.Line > 1, $"line {e.Line}");
        Assert.NotEmpty(e.Hint);
    }

    [Theory]
    [InlineData("adc.modulator_rate", "\"256 kHz\"")]
    [InlineData("adc.filter_reset", "true")]
    public void A_delta_sigma_key_on_a_successive_approximation_converter_is_refused(string key, string value)
    {
        var e = Assert.Throws<DesignException>(() => Check.TestDesign.Make((key, value)));
        Assert.Equal(key, e.KeyPath);
        Assert.Contains("kind = \"delta-sigma\"", e.Message);
    }

    [Fact]
    public void A_noise_table_without_the_designs_row_is_refused_with_the_fix()
    {
        var rows = DeltaSigmaDesigns.TwoRows.Replace("data_rate = \"50 Hz\"", "data_rate = \"25 Hz\"");
        var e = Assert.Throws<DesignException>(() => Parse(DeltaSigmaDesigns.WithNoiseTable(rows)));
        Assert.Equal("adc.noise_table", e.KeyPath);
        Assert.Contains("no row at the design's data rate 50 Hz and gain 4", e.Message);
        Assert.Contains("does not interpolate", e.Message);
    }

    [Fact]
    public void A_noise_table_beside_a_single_noise_and_a_repeated_row_are_refused()
    {
        var both = Assert.Throws<DesignException>(() => Parse(DeltaSigmaDesigns.WithNoiseTable("noise = \"1 uV\"\n" + DeltaSigmaDesigns.TwoRows)));
        Assert.Equal("adc.noise", both.KeyPath);
        var twice = Assert.Throws<DesignException>(() => Parse(DeltaSigmaDesigns.WithNoiseTable(DeltaSigmaDesigns.TwoRows.Replace("10 Hz", "50 Hz"))));
        Assert.Equal("adc.noise_table[2].data_rate", twice.KeyPath);
        var unknown = Assert.Throws<DesignException>(() => Parse(DeltaSigmaDesigns.WithNoiseTable(DeltaSigmaDesigns.TwoRows.Replace("gain = 4\nnoise", "gian = 4\nnoise"))));
        Assert.Contains("Did you mean \"gain\"", unknown.Message);
    }
}
