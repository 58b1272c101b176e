using ThermVerify.Sensors;

namespace ThermVerify.Tests.Sensors;

public class PlatinumRtdTests
{
    // IEC 60751 Pt100 reference table, printed to two decimals, so ±0.005 Ω. Recomputed from the
    // Callendar–Van Dusen equation of the same standard: 18.5201, 60.2558, 100, 138.5055, 175.856, 280.9775, 390.4811 Ω.
    [Theory]
    [InlineData(-200, 18.52)]
    [InlineData(-100, 60.26)]
    [InlineData(0, 100.00)]
    [InlineData(100, 138.51)]
    [InlineData(200, 175.86)]
    [InlineData(500, 280.98)]
    [InlineData(850, 390.48)]
    public void Pt100_matches_the_IEC_60751_table(double celsius, double tableOhms) =>
        Tolerance.AssertClose(tableOhms, TestSensors.Pt100().ResistanceOhms(celsius), rel: 0, abs: 0.005, what: $"R({celsius} °C)");

    // (−200 °C is left out: the printed 18.52 Ω lies just below the computed 18.5201 Ω, outside the valid range.)
    [Theory]
    [InlineData(-100, 60.26)]
    [InlineData(100, 138.51)]
    [InlineData(850, 390.48)]
    public void Pt100_inverse_of_table_values_lands_within_the_table_precision(double celsius, double tableOhms)
    {
        // IEC 60751 table: ±0.005 Ω divided by the slope (≥ 0.33 Ω/K over the range) is under 0.016 K.
        Tolerance.AssertClose(celsius, TestSensors.Pt100().TemperatureCelsius(tableOhms), rel: 0, abs: 0.016, what: $"T({tableOhms} Ω)");
    }

    [Theory]
    [InlineData(-200)]
    [InlineData(-37.5)]
    [InlineData(0)]
    [InlineData(419.527)]
    [InlineData(850)]
    public void Pt1000_is_ten_times_Pt100(double celsius) =>
        // IEC 60751: the relationship scales with R0.
        Tolerance.AssertClose(10 * TestSensors.Pt100().ResistanceOhms(celsius), new PlatinumRtd(1000).ResistanceOhms(celsius), rel: 1e-14);

    [Fact]
    public void Above_zero_the_inverse_is_the_quadratic_root()
    {
        // IEC 60751: for t ≥ 0, t = (−A + √(A² − 4B(1 − R/R0)))/(2B), written here in the textbook form.
        const double a = PlatinumRtd.IecA, b = PlatinumRtd.IecB, ohms = 250;
        var expected = (-a + Math.Sqrt(a * a - 4 * b * (1 - ohms / 100))) / (2 * b);
        Tolerance.AssertClose(expected, TestSensors.Pt100().TemperatureCelsius(ohms), rel: 1e-12);
    }

    [Fact]
    public void Outside_minus_200_to_850_it_refuses_and_names_the_range()
    {
        var rtd = TestSensors.Pt100();
        var e = Assert.Throws<SensorRangeException>(() => rtd.ResistanceOhms(851));
        Assert.Contains("851", e.Message);
        Assert.Contains("-200 °C to 850 °C", e.Message);
        var r = Assert.Throws<SensorRangeException>(() => rtd.TemperatureCelsius(400));
        Assert.Contains("400", r.Message);
        Assert.Contains("18.5201 Ω to 390.481 Ω", r.Message);
    }

    [Fact]
    public void Coefficients_that_make_R_fall_are_refused() =>
        Assert.Throws<ArgumentException>(() => new PlatinumRtd(100, a: 3.9083e-3, b: -5e-6));
}
