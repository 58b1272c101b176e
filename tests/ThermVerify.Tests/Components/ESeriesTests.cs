using ThermVerify.Components;

namespace ThermVerify.Tests.Components;

public class ESeriesTests
{
    // IEC 60063, the E12 and E24 tables as the standard prints them (not the rounded formula).
    private static readonly double[] PrintedE12 = [1.0, 1.2, 1.5, 1.8, 2.2, 2.7, 3.3, 3.9, 4.7, 5.6, 6.8, 8.2];
    private static readonly double[] PrintedE24 =
        [1.0, 1.1, 1.2, 1.3, 1.5, 1.6, 1.8, 2.0, 2.2, 2.4, 2.7, 3.0, 3.3, 3.6, 3.9, 4.3, 4.7, 5.1, 5.6, 6.2, 6.8, 7.5, 8.2, 9.1];

    [Fact]
    public void E6_E12_E24_are_the_printed_lists()
    {
        Assert.Equal(PrintedE12, ESeries.E12.Mantissas);
        Assert.Equal(PrintedE24, ESeries.E24.Mantissas);
        // IEC 60063 E6: 1.0 1.5 2.2 3.3 4.7 6.8.
        Assert.Equal([1.0, 1.5, 2.2, 3.3, 4.7, 6.8], ESeries.E6.Mantissas);
    }

    [Fact]
    public void Printed_E24_differs_from_the_formula_at_eight_values()
    {
        // IEC 60063 printed values against round(10^(i/24), 1): they differ at 2.7 3.0 3.3 3.6 3.9 4.3 4.7 8.2.
        var differing = Enumerable.Range(0, 24).Where(i => Math.Round(Math.Pow(10, i / 24.0), 1) != PrintedE24[i]).Select(i => PrintedE24[i]);
        Assert.Equal([2.7, 3.0, 3.3, 3.6, 3.9, 4.3, 4.7, 8.2], differing);
    }

    [Theory]
    [InlineData("E48", 48, 0, 1.00)]
    [InlineData("E48", 48, 47, 9.53)]
    [InlineData("E96", 96, 0, 1.00)]
    [InlineData("E96", 96, 1, 1.02)]
    [InlineData("E96", 96, 24, 1.78)]
    [InlineData("E96", 96, 48, 3.16)]
    [InlineData("E96", 96, 58, 4.02)]
    [InlineData("E96", 96, 95, 9.76)]
    [InlineData("E192", 192, 1, 1.01)]
    [InlineData("E192", 192, 185, 9.20)]
    [InlineData("E192", 192, 191, 9.88)]
    public void Precision_series_spot_values_and_counts(string name, int count, int index, double expected)
    {
        // IEC 60063 E48/E96/E192 tables; spot values recomputed as round(10^(i/n), 2), except E192 index 185,
        // printed 9.20 where the formula gives 9.19 (from memory of the standard).
        var series = ESeries.Get(name);
        Assert.Equal(count, series.Mantissas.Count);
        Assert.Equal(expected, series.Mantissas[index]);
    }

    [Fact]
    public void E192_differs_from_the_formula_only_at_920()
    {
        var differing = Enumerable.Range(0, 192).Where(i => Math.Round(Math.Pow(10, i / 192.0), 2) != ESeries.E192.Mantissas[i]).ToArray();
        Assert.Equal([185], differing);
        // E96 is every second E192 value and E48 every fourth (IEC 60063 construction), away from 9.20.
        Assert.Equal(ESeries.E96.Mantissas, ESeries.E192.Mantissas.Where((_, i) => i % 2 == 0));
    }

    [Theory]
    [InlineData("E24", 4800, 4700, 5100, 4700)]      // 4.8k: nearer 4.7k by ratio (2.1 % against 6.3 %)
    [InlineData("E24", 4700, 4700, 5100, 4300)]      // on a series value: next higher/lower step away
    [InlineData("E24", 9.5, 9.1, 10, 9.1)]           // across the decade boundary upwards
    [InlineData("E24", 1.04e6, 1.0e6, 1.1e6, 1.0e6)]  // 1.05M would go to 1.1M: by ratio 4.9 % against 4.8 %
    [InlineData("E12", 100, 100, 120, 82)]           // across the decade boundary downwards
    [InlineData("E96", 10_050, 10_000, 10_200, 10_000)]
    [InlineData("E6", 4.7e-9, 4.7e-9, 6.8e-9, 3.3e-9)] // capacitance: 4n7 is recognised despite floating point
    [InlineData("E12", 0.0395, 0.039, 0.047, 0.039)]
    public void Nearest_next_higher_next_lower(string name, double value, double nearest, double higher, double lower)
    {
        // Arithmetic on the IEC 60063 lists; nearest is by ratio (common practice, no source).
        var s = ESeries.Get(name);
        Tolerance.AssertClose(nearest, s.Nearest(value), rel: 1e-15, what: "nearest");
        Tolerance.AssertClose(higher, s.NextHigher(value), rel: 1e-15, what: "next higher");
        Tolerance.AssertClose(lower, s.NextLower(value), rel: 1e-15, what: "next lower");
    }

    [Fact]
    public void Nearest_is_by_ratio_not_difference()
    {
        // Between 8.2 and 10 (E12) the geometric mean is √82 = 9.055 while the midpoint is 9.1: 9.06 is nearer 8.2
        // by difference but nearer 10 by ratio.
        Assert.Equal(10, ESeries.E12.Nearest(9.06));
        Assert.Equal(8.2, ESeries.E12.Nearest(9.05));
    }

    [Fact]
    public void Names_parse_case_insensitively_and_unknown_names_are_refused()
    {
        Assert.Same(ESeries.E96, ESeries.Get(" e96 "));
        Assert.Same(ESeries.E192, ESeries.Get(ESeriesName.E192));
        var e = Assert.Throws<ArgumentException>(() => ESeries.Get("E100"));
        Assert.Contains("E6, E12, E24, E48, E96, E192", e.Message);
        Assert.Throws<ArgumentOutOfRangeException>(() => ESeries.E24.Nearest(0));
        Assert.Throws<ArgumentOutOfRangeException>(() => ESeries.E24.Nearest(double.NaN));
    }

    [Fact]
    public void Contains_recognises_members_in_any_decade()
    {
        Assert.True(ESeries.E96.Contains(48.7e3));
        Assert.False(ESeries.E24.Contains(48.7e3));
        Assert.True(ESeries.E12.Contains(2.2e-12));
    }
}
