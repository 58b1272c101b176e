using ThermVerify.Design;
using ThermVerify.Tests.Check;

namespace ThermVerify.Tests.Design;

/// <summary>The [adc] keys of the transfer convention, the firmware's inverse, the reference tempco and the precharge cases.</summary>
public class AdcKeysTests
{
    [Fact]
    public void Conventions_and_reference_tempco_are_read_and_written_back()
    {
        var design = TestDesign.Make(("adc.first_transition", "\"one-lsb\""), ("adc.firmware_inverse", "\"bin-edge\""),
            ("adc.reference", "\"3.3 V\""), ("adc.reference_tempco", "\"-20 ppm/K\""), ("adc.precharge", "\"worst\""));
        Assert.Equal(FirstTransition.OneLsb, design.Adc.FirstTransition);
        Assert.Equal(CodeInverse.BinEdge, design.Adc.FirmwareInverse);
        Assert.Equal(-20e-6, design.Adc.ReferenceTempcoPerKelvin, 15);
        Assert.Equal(PrechargeMode.Worst, design.Adc.Precharge);
        // The normal form loads back to an equal design.
        Assert.Equal(design.Adc, DesignLoader.Parse(DesignWriter.ToToml(design), "normal.toml", Path.GetTempPath()).Adc);
    }

    [Fact]
    public void A_reference_tempco_on_a_ratiometric_converter_is_refused_with_the_key_and_the_fix()
    {
        var e = Assert.Throws<DesignException>(() => TestDesign.Make(("adc.reference_tempco", "\"20 ppm/K\"")));
        Assert.Equal("adc.reference_tempco", e.KeyPath);
        Assert.Contains("ratiometric", e.Message);
        Assert.Contains("give reference as a voltage", e.Message);
    }

    [Fact]
    public void A_reference_tolerance_on_a_ratiometric_converter_is_refused_at_its_line_with_the_fix()
    {
        // A ratiometric converter's reference is the excitation: a tolerance of its own would be silently ignored.
        var e = Assert.Throws<DesignException>(() => TestDesign.Make(("adc.reference_tolerance", "\"0.5 %\"")));
        Assert.Equal("adc.reference_tolerance", e.KeyPath);
        Assert.True(e.Line > 1, $"line {e.Line}");
        Assert.Contains("cancels", e.Message);
        Assert.Contains("divider.excitation_tolerance", e.Message);
        // Zero (what the normal form writes for a ratiometric converter) is no error.
        Assert.Equal(0, TestDesign.Make(("adc.reference_tolerance", "\"0 %\"")).Adc.ReferenceTolerance);
    }

    [Theory]
    [InlineData("first_transition", "\"third-lsb\"", "half-lsb")]
    [InlineData("firmware_inverse", "\"centre\"", "bin-middle")]
    [InlineData("precharge", "\"best\"", "worst")]
    public void An_unknown_word_names_the_allowed_ones(string key, string value, string allowed)
    {
        var e = Assert.Throws<DesignException>(() => TestDesign.Make(($"adc.{key}", value)));
        Assert.Equal($"adc.{key}", e.KeyPath);
        Assert.Contains(allowed, e.Message);
    }
}
