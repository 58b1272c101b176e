using ThermVerify.Design;

namespace ThermVerify.Tests.Design;

public class DesignLoaderTests
{
    private static FrontEndDesign Parse(string text) => DesignLoader.Parse(text, "test.toml", Path.GetTempPath());

    private static DesignException Fails(string text) => Assert.Throws<DesignException>(() => Parse(text));

    [Fact]
    public void ValidDesignGetsItsValuesAndDefaults()
    {
        var d = Parse(DesignText.Valid);
        var beta = Assert.IsType<BetaSensorSpec>(d.Sensor);
        Assert.Equal(10e3, beta.R0Ohms);
        Assert.Equal(25, beta.ReferenceCelsius);
        Assert.Equal(3435, beta.BetaKelvin);
        Assert.Equal(SensorSide.Low, d.VoltageDivider.SensorSide);
        Assert.Equal(10e3, d.VoltageDivider.FixedResistorOhms);
        Assert.Null(d.Buffer);
        Assert.Equal(FilterSpec.None, d.Filter);
        Assert.Equal(12, d.Adc.Bits);
        Assert.Equal(3.3, d.Adc.ReferenceVolts);
        Tolerance.AssertClose(2e-6, d.Adc.AcquisitionTimeSeconds, 1e-15);
        // The worst plausible precharge unless the design says which (docs/design-file.md).
        Assert.Equal(PrechargeMode.Worst, d.Adc.Precharge);
        Assert.Equal(FirstTransition.HalfLsb, d.Adc.FirstTransition);
        Assert.Equal(CodeInverse.BinMiddle, d.Adc.FirmwareInverse);
        Assert.Equal(0, d.Adc.ReferenceTempcoPerKelvin);
        Assert.Equal(DesignDefaults.StepKelvin, d.Check.StepKelvin);
        Assert.Equal(DesignDefaults.SettleLimitLsb, d.Check.SettleLimitLsb);
        Assert.Equal(DesignDefaults.LeakageDoublingKelvin, d.Adc.LeakageDoublingKelvin);
        Assert.Equal(-40, d.Check.Range.MinCelsius);
        Assert.Equal(0.5, d.Check.BudgetKelvin);
    }

    [Fact]
    public void TomlSyntaxErrorHasLineAndColumn()
    {
        var e = Fails(DesignText.With(10, "fixed_resistor = "));
        Assert.Equal(10, e.Line);
        Assert.Equal(18, e.Column);
        Assert.Contains("TOML syntax", e.Message);
        Assert.StartsWith("test.toml:10:18:", e.Message);
    }

    [Fact]
    public void DuplicateKeyIsASyntaxError()
    {
        var e = Fails(DesignText.With(7, "beta = 3950"));
        Assert.Equal(7, e.Line);
        Assert.Contains("already defined", e.Message);
    }

    [Fact]
    public void A_very_long_unknown_key_is_shown_cut_with_its_length()
    {
        var key = new string('q', 1_000_000);
        var e = Fails(DesignText.With(10, $"  {key} = 1"));
        Assert.Equal(10, e.Line);
        Assert.Contains("unknown key", e.Problem);
        Assert.Contains("(1,000,000 characters)", e.Message);
        Assert.True(e.Message.Length < 1000, $"the message is {e.Message.Length} characters long");
    }

    [Fact]
    public void UnknownKeyNamesTheNearestValidKey()
    {
        var e = Fails(DesignText.With(10, "  fixed_resistr = \"10k\""));
        Assert.Equal(10, e.Line);
        Assert.Equal(3, e.Column);
        Assert.Equal("divider.fixed_resistr", e.KeyPath);
        Assert.Contains("unknown key", e.Problem);
        Assert.Contains("Did you mean \"fixed_resistor\"?", e.Hint);
    }

    [Fact]
    public void UnknownSectionNamesTheNearestSection()
    {
        var e = Fails(DesignText.With(8, "[dividr]"));
        Assert.Equal(8, e.Line);
        Assert.Equal(2, e.Column);
        Assert.Contains("\"divider\"", e.Hint);
    }

    [Fact]
    public void KeyOfAnotherSensorModelSaysWhichModelItBelongsTo()
    {
        var e = Fails(DesignText.With(7, "class = \"A\""));
        Assert.Equal(7, e.Line);
        Assert.Contains("\"rtd\"", e.Hint);
    }

    [Fact]
    public void MissingKeyPointsAtItsSection()
    {
        var e = Fails(DesignText.With(14, ""));
        Assert.Equal(13, e.Line);
        Assert.Equal(2, e.Column);
        Assert.Equal("adc.bits", e.KeyPath);
        Assert.Contains("missing required key \"bits\"", e.Problem);
    }

    [Fact]
    public void MissingSectionIsNamed()
    {
        var text = string.Join("\n", DesignText.Lines.Take(20)) + "\n";
        var e = Fails(text);
        Assert.Equal("check", e.KeyPath);
        Assert.Contains("missing section [check]", e.Problem);
    }

    [Fact]
    public void WrongUnitPointsAtTheValue()
    {
        var e = Fails(DesignText.With(11, "excitation = \"3.3 ohm\""));
        Assert.Equal(11, e.Line);
        Assert.Equal(14, e.Column);
        Assert.Equal("divider.excitation", e.KeyPath);
        Assert.Contains("wrong unit", e.Problem);
        Assert.Contains("\"3.3 ohm\"", e.Message);
    }

    [Fact]
    public void BareNumberWhereAUnitIsNeededSuggestsTheString()
    {
        var e = Fails(DesignText.With(11, "excitation = 3.3"));
        Assert.Equal(14, e.Column);
        Assert.Contains("missing unit", e.Problem);
        Assert.Contains("excitation = \"3.3 V\"", e.Hint);
    }

    [Theory]
    [InlineData(14, "bits = 30", 8, "outside 6..24")]
    [InlineData(14, "bits = 5", 8, "outside 6..24")]
    [InlineData(17, "acquisition_time = \"100 us\"", 20, "not shorter than the sample period")]
    [InlineData(11, "excitation = \"0 V\"", 14, "greater than zero")]
    [InlineData(11, "excitation = \"-3.3 V\"", 14, "greater than zero")]
    [InlineData(10, "fixed_resistor = \"-10k\"", 18, "cannot be negative")]
    [InlineData(22, "range = \"125 degC .. -40 degC\"", 9, "low end is not below")]
    [InlineData(23, "budget = \"0 K\"", 10, "greater than zero")]
    [InlineData(6, "beta = 3.435", 8, "outside 100 K")]
    [InlineData(9, "sensor_side = \"middle\"", 15, "not one of")]
    public void ImpossibleValuesAreRejectedAtTheValue(int line, string replacement, int column, string fragment)
    {
        var e = Fails(DesignText.With(line, replacement));
        Assert.Equal(line, e.Line);
        Assert.Equal(column, e.Column);
        Assert.Contains(fragment, e.Message);
        Assert.False(string.IsNullOrWhiteSpace(e.Hint));
    }

    [Fact]
    public void StepWiderThanRangeIsRejected()
    {
        var e = Fails(DesignText.Valid + "step = \"500 K\"\n");
        Assert.Equal(24, e.Line);
        Assert.Contains("wider than the range", e.Problem);
    }

    [Fact]
    public void RegionOutsideTheCheckRangeIsRejected()
    {
        var e = Fails(DesignText.Valid + "\n[[check.region]]\nrange = \"100 degC .. 150 degC\"\nbudget = \"1 K\"\n");
        Assert.Equal(26, e.Line);
        Assert.Equal("check.region[1].range", e.KeyPath);
    }

    [Fact]
    public void PathEscapingTheDesignFolderIsRejected()
    {
        var folder = Directory.CreateTempSubdirectory("thermverify-design-").FullName;
        try
        {
            var text = DesignText.With(5, "file = \"../outside.csv\"").Replace("model = \"beta\"", "model = \"table\"").Replace("beta = 3435", "");
            var e = Assert.Throws<DesignException>(() => DesignLoader.Parse(text, "t.toml", folder));
            Assert.Equal(5, e.Line);
            Assert.Equal(8, e.Column);
            Assert.Contains("outside the design's folder", e.Problem);
        }
        finally
        {
            Directory.Delete(folder, true);
        }
    }

    [Fact]
    public void MissingTableFileIsRejected()
    {
        var folder = Directory.CreateTempSubdirectory("thermverify-design-").FullName;
        try
        {
            var text = DesignText.With(5, "file = \"rt.csv\"").Replace("model = \"beta\"", "model = \"table\"").Replace("beta = 3435", "");
            var e = Assert.Throws<DesignException>(() => DesignLoader.Parse(text, "t.toml", folder));
            Assert.Contains("not found", e.Problem);
            File.WriteAllText(Path.Combine(folder, "rt.csv"), "celsius,ohms\n0,1000\n");
            var tooShort = Assert.Throws<DesignException>(() => DesignLoader.Parse(text, "t.toml", folder));
            Assert.Contains("at least 4", tooShort.Problem);
            Assert.Equal(5, tooShort.Line);
            File.WriteAllText(Path.Combine(folder, "rt.csv"), "celsius,ohms\n-50,300000\n0,30000\n50,4000\n130,300\n");
            var d = DesignLoader.Parse(text.Replace("-40 degC .. 125 degC", "-40 degC .. 120 degC"), "t.toml", folder);
            Assert.Equal(Path.Combine(folder, "rt.csv"), Assert.IsType<TableSensorSpec>(d.Sensor).FullPath);
        }
        finally
        {
            Directory.Delete(folder, true);
        }
    }

    [Fact]
    public void R0NeedsItsReferenceTemperature()
    {
        var e = Fails(DesignText.With(5, "r0 = \"32.6 kohm\""));
        Assert.Contains("reference_temperature", e.Problem);
        var d = Parse(DesignText.With(5, "r0 = \"32.6 kohm\"\nreference_temperature = \"0 degC\""));
        Assert.Equal(0, Assert.IsType<BetaSensorSpec>(d.Sensor).ReferenceCelsius);
    }

    [Fact]
    public void AbsoluteTemperatureInKelvinIsRejectedWithAHint()
    {
        var e = Fails(DesignText.With(22, "range = \"233.15 K .. 398.15 K\""));
        Assert.Contains("degC", e.Hint);
    }

    [Fact]
    public void FollowerWithGainOtherThanOneIsRejected()
    {
        var text = DesignText.Valid + "\n[buffer]\ngain = 2\ngain_bandwidth = \"1 MHz\"\nsupply = \"0 V .. 3.3 V\"\n";
        var e = Fails(text);
        Assert.Equal("buffer.gain", e.KeyPath);
        Assert.Equal(26, e.Line);
    }
}
