using ThermVerify.Design;
using ThermVerify.Tests.Check;

namespace ThermVerify.Tests.Design;

/// <summary>The converter's noise (adc.noise) and the [noise] keys: read, written back, and refused with the key, line and fix.</summary>
public class NoiseKeysTests
{
    [Fact]
    public void Noise_keys_are_read_and_the_normal_form_loads_back_to_the_same_design()
    {
        var design = TestDesign.Make(("adc.noise", "\"0.7 LSB\""), ("noise.coverage", "2"), ("noise.readings_averaged", "32"), ("noise.ramp_rate", "\"20 mK/s\""));
        Assert.Equal(0.7, design.Adc.NoiseLsb);
        Assert.Null(design.Adc.NoiseVolts);
        Assert.Equal(new NoiseSpec { Coverage = 2, ReadingsAveraged = 32, RampKelvinPerSecond = 0.02 }, design.Noise);
        var again = DesignLoader.Parse(DesignWriter.ToToml(design), "normal.toml", Path.GetTempPath());
        Assert.Equal(design.Adc, again.Adc);
        Assert.Equal(design.Noise, again.Noise);

        var volts = TestDesign.Make(("adc.noise", "\"150 uV\""));
        Assert.Equal(150e-6, volts.Adc.NoiseVolts!.Value, 15);
        Assert.Null(volts.Adc.NoiseLsb);
        Assert.Equal(volts.Adc, DesignLoader.Parse(DesignWriter.ToToml(volts), "normal.toml", Path.GetTempPath()).Adc);
    }

    [Fact]
    public void Without_the_keys_noise_is_counted_at_three_sigma_one_conversion_per_reading_and_the_converter_noise_is_assumed()
    {
        var design = TestDesign.Make();
        Assert.Equal(3, design.Noise.Coverage);
        Assert.Equal(1, design.Noise.ReadingsAveraged);
        Assert.Null(design.Noise.RampKelvinPerSecond);
        Assert.False(design.Adc.NoiseDeclared);
    }

    [Theory]
    [InlineData("adc.noise", "\"3 K\"", "LSB")]
    [InlineData("adc.noise", "\"-1 LSB\"", "negative")]
    [InlineData("adc.noise", "0.5", "unit")]
    [InlineData("noise.coverage", "0", "standard deviations")]
    [InlineData("noise.coverage", "12", "standard deviations")]
    [InlineData("noise.readings_averaged", "0", "1..65536")]
    [InlineData("noise.readings_averaged", "2.5", "whole number")]
    [InlineData("noise.ramp_rate", "\"1 K\"", "K/s")]
    [InlineData("noise.ramp_rate", "\"0 K/s\"", "greater than zero")]
    public void A_wrong_noise_value_is_refused_at_its_key_with_what_would_fix_it(string key, string value, string words)
    {
        var e = Assert.Throws<DesignException>(() => TestDesign.Make((key, value)));
        Assert.Equal(key, e.KeyPath);
        Assert.True(e.Line > 1, $"line {e.Line}");
        Assert.Contains(words, e.Message);
    }

    [Fact]
    public void An_unknown_key_in_noise_is_refused_with_a_suggestion()
    {
        var e = Assert.Throws<DesignException>(() => TestDesign.Make(("noise.readings_average", "16")));
        Assert.Contains("readings_averaged", e.Message);
    }
}
