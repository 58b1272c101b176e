using ThermVerify.Sensors;

namespace ThermVerify.Tests.Sensors;

public class RtdToleranceClassTests
{
    // IEC 60751 (2008) tolerance classes table: AA 0.1 + 0.0017|t|, A 0.15 + 0.002|t|, B 0.3 + 0.005|t|;
    // class C 0.6 + 0.01|t| from memory.
    [Theory]
    [InlineData("AA", 0, 0.1)]
    [InlineData("AA", 100, 0.27)]
    [InlineData("A", -100, 0.35)]
    [InlineData("A", 0, 0.15)]
    [InlineData("B", 100, 0.8)]
    [InlineData("B", -50, 0.55)]
    [InlineData("C", 200, 2.6)]
    public void Tolerance_is_a_plus_b_abs_t(string name, double celsius, double expectedKelvin) =>
        Tolerance.AssertClose(expectedKelvin, RtdToleranceClass.Parse(name).ToleranceKelvin(celsius), rel: 1e-12);

    [Fact]
    public void Names_parse_case_insensitively_and_unknown_names_are_refused()
    {
        Assert.Same(RtdToleranceClass.AA, RtdToleranceClass.Parse("aa"));
        Assert.Same(RtdToleranceClass.B, RtdToleranceClass.Parse("Class B"));
        var e = Assert.Throws<ArgumentException>(() => RtdToleranceClass.Parse("D"));
        Assert.Contains("AA, A, B, C", e.Message);
    }
}
