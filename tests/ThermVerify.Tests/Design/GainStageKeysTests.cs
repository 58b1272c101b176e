using ThermVerify.Design;
using ThermVerify.Tests.Check;

namespace ThermVerify.Tests.Design;

/// <summary>The programmable-gain stage's keys of [adc]: gain, pga_gain_error, pga_input_current, on either converter.</summary>
public class GainStageKeysTests
{
    private static DesignException Fails(string text) =>
        Assert.Throws<DesignException>(() => DesignLoader.Parse(text, "pga.toml", Path.GetTempPath()));

    [Fact]
    public void The_keys_are_read_with_their_signs_and_written_back()
    {
        var design = TestDesign.Make(("adc.gain", "8"), ("adc.pga_gain_error", "\"0.1 %\""), ("adc.pga_input_current", "\"-2 nA\""));
        var stage = design.Adc.GainStage!;
        Assert.Equal(8, stage.Gain);
        Assert.Equal(1e-3, stage.GainError, 15);
        Assert.False(stage.GainErrorSigned);
        Tolerance.AssertClose(-2e-9, stage.InputCurrentAmperes, 1e-12);
        Assert.True(stage.InputCurrentSigned);
        Assert.Equal(3.3 / 8, design.FullScaleAtPinVolts, 12);
        var normal = DesignWriter.ToToml(design);
        var back = DesignLoader.Parse(normal, "normal.toml", Path.GetTempPath());
        Assert.Equal(design.Adc, back.Adc);
        Assert.Equal(normal, DesignWriter.ToToml(back));
    }

    [Fact]
    public void Without_the_keys_there_is_no_gain_stage()
    {
        Assert.Null(TestDesign.Make().Adc.GainStage);
        Assert.Null(DeltaSigmaDesigns.Make().Adc.GainStage);
        Assert.Equal(1, TestDesign.Make().Adc.ProgrammableGain);
    }

    [Fact]
    public void A_delta_sigma_gain_is_the_gain_stage_and_written_once()
    {
        var design = DeltaSigmaDesigns.Make(("adc.gain", "16"), ("adc.pga_gain_error", "\"+0.05 %\""));
        Assert.Equal(16, design.Adc.GainStage!.Gain);
        Assert.Equal(16, design.Adc.DeltaSigma!.Gain);
        Assert.True(design.Adc.GainStage.GainErrorSigned);
        var normal = DesignWriter.ToToml(design);
        Assert.Single(normal.Split('\n'), l => l.StartsWith("gain = ", StringComparison.Ordinal));
        Assert.Equal(design.Adc, DesignLoader.Parse(normal, "normal.toml", Path.GetTempPath()).Adc);
    }

    [Fact]
    public void A_gain_of_zero_is_refused_at_its_line_and_column()
    {
        var e = Fails(DesignText.With(20, "gain = 0"));
        Assert.Equal("adc.gain", e.KeyPath);
        Assert.Equal(20, e.Line);
        Assert.Equal(8, e.Column);
        Assert.Contains("greater than zero", e.Message);
    }

    [Fact]
    public void A_gain_beyond_the_plausible_range_is_refused_at_its_line()
    {
        var e = Fails(DesignText.With(20, "gain = 1e6"));
        Assert.Equal("adc.gain", e.KeyPath);
        Assert.Equal(20, e.Line);
    }

    [Fact]
    public void A_gain_error_in_volts_is_refused_at_its_line_with_the_unit_wanted()
    {
        var e = Fails(DesignText.With(20, "pga_gain_error = \"5 mV\""));
        Assert.Equal("adc.pga_gain_error", e.KeyPath);
        Assert.Equal(20, e.Line);
        Assert.Contains("%", e.Message);
    }

    [Fact]
    public void An_input_current_in_ohms_is_refused_at_its_line()
    {
        var e = Fails(DesignText.With(20, "pga_input_current = \"5 ohm\""));
        Assert.Equal("adc.pga_input_current", e.KeyPath);
        Assert.Equal(20, e.Line);
        Assert.Contains("current", e.Message);
    }

    [Fact]
    public void A_misspelt_key_is_refused_with_the_right_one_suggested()
    {
        var e = Fails(DesignText.With(20, "pga_gain_eror = \"0.1 %\""));
        Assert.Equal(20, e.Line);
        Assert.Contains("pga_gain_error", e.Message);
    }
}
