using ThermVerify.Design;

namespace ThermVerify.Tests.Design;

/// <summary>The [tolerances] section and the switched-excitation keys of [divider].</summary>
public class ToleranceKeysTests
{
    private static FrontEndDesign Parse(string text) => DesignLoader.Parse(text, "test.toml", Path.GetTempPath());

    private static string WithDivider(string extra) => DesignText.With(11, "excitation = \"3.3 V\"\n" + extra);

    [Fact]
    public void DefaultsAreUniformWithoutLeakageSpreadAndContinuousExcitation()
    {
        var d = Parse(DesignText.Valid);
        Assert.Equal(ToleranceShape.Uniform, d.Tolerances.Distribution);
        Assert.Equal(0, d.Tolerances.LeakageSpread);
        Assert.Null(d.VoltageDivider.SwitchOnLeadSeconds);
        Assert.Null(d.VoltageDivider.ReadingIntervalSeconds);
    }

    [Fact]
    public void NormalDistributionWithCoverageAndSpreadIsRead()
    {
        var d = Parse(DesignText.Valid + "[tolerances]\ndistribution = \"normal\"\ncoverage_factor = 2\nleakage_spread = \"50 %\"\n");
        Assert.Equal(ToleranceShape.Normal, d.Tolerances.Distribution);
        Assert.Equal(2, d.Tolerances.CoverageFactor);
        Assert.Equal(0.5, d.Tolerances.LeakageSpread);
    }

    [Fact]
    public void CoverageFactorWithAUniformDistributionIsRejected()
    {
        var e = Assert.Throws<DesignException>(() => Parse(DesignText.Valid + "[tolerances]\ncoverage_factor = 3\n"));
        Assert.Equal("tolerances.coverage_factor", e.KeyPath);
        Assert.Contains("normal", e.Hint);
    }

    [Fact]
    public void SwitchedExcitationKeysAreRead()
    {
        var d = Parse(WithDivider("switch_on_lead = \"500 us\"\nreading_interval = \"1 s\""));
        Tolerance.AssertClose(500e-6, d.VoltageDivider.SwitchOnLeadSeconds!.Value, 1e-12);
        Assert.Equal(1, d.VoltageDivider.ReadingIntervalSeconds);
    }

    [Fact]
    public void ReadingIntervalWithoutLeadIsRejected()
    {
        var e = Assert.Throws<DesignException>(() => Parse(WithDivider("reading_interval = \"1 s\"")));
        Assert.Equal("divider.reading_interval", e.KeyPath);
    }

    [Fact]
    public void ReadingIntervalShorterThanTheLeadIsRejected()
    {
        var e = Assert.Throws<DesignException>(() => Parse(WithDivider("switch_on_lead = \"2 ms\"\nreading_interval = \"1 ms\"")));
        Assert.Equal("divider.reading_interval", e.KeyPath);
    }

    [Fact]
    public void NewKeysSurviveTheNormalForm()
    {
        var d = Parse(WithDivider("switch_on_lead = \"500 us\"\nreading_interval = \"2 s\"") +
                      "[tolerances]\ndistribution = \"normal\"\ncoverage_factor = 2.5\nleakage_spread = \"30 %\"\n");
        var again = Parse(DesignWriter.ToToml(d));
        Assert.Equal(d, again with { Source = d.Source });
    }
}
