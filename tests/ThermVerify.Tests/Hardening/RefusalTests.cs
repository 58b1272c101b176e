using ThermVerify.Cli;
using ThermVerify.Design;
using ThermVerify.Quantities;
using ThermVerify.Tests.Cli;
using ThermVerify.Tests.Design;

namespace ThermVerify.Tests.Hardening;

/// <summary>
/// Values that would be read silently into something else are refused, with the range or the rule, before any
/// work: RKM letters outside resistances and capacitances, a third dot in a range, an underflow to zero, a minus on
/// a value that cannot be negative, implausible magnitudes, and work beyond the bounds (with the option that raises
/// them).
/// </summary>
public class RefusalTests
{
    private static DesignException Refused(string text) =>
        Assert.Throws<DesignException>(() => DesignLoader.Parse(text, "x.toml", Path.GetTempPath()));

    [Theory]
    [InlineData("0K5", UnitKind.Kelvin)]   // would read as 500 K, and a failing design would pass
    [InlineData("1K5", UnitKind.Kelvin)]
    [InlineData("0k5", UnitKind.Kelvin)]
    [InlineData("1u5", UnitKind.Second)]
    [InlineData("4k7", UnitKind.Hertz)]
    [InlineData("4K7", UnitKind.Farad)]    // K is a resistor letter only
    public void An_rkm_code_is_read_only_for_resistance_and_capacitance(string text, UnitKind kind)
    {
        var e = Assert.Throws<QuantityFormatException>(() => QuantityParser.Parse(text, kind));
        Assert.Contains("RKM code", e.Problem);
    }

    [Fact]
    public void Rkm_codes_still_read_where_iec_60062_puts_them()
    {
        // IEC 60062: 4K7 = 4.7 kΩ, 4n7 = 4.7 nF.
        Tolerance.AssertClose(4.7e3, QuantityParser.Parse("4K7", UnitKind.Ohm).Value, 1e-12, 0, "4K7");
        Tolerance.AssertClose(4.7e-9, QuantityParser.Parse("4n7", UnitKind.Farad).Value, 1e-12, 0, "4n7");
    }

    [Fact]
    public void A_budget_of_0K5_is_refused_at_its_position()
    {
        var e = Refused(DesignText.With(23, "budget = \"0K5\""));
        Assert.Equal((23, 10), (e.Line, e.Column));
        Assert.Contains("RKM code", e.Problem);
        Assert.Contains("0.5 K", e.Hint);
    }

    [Theory]
    [InlineData("-40...125 degC")]
    [InlineData("-40 degC ... 125 degC")]
    [InlineData("-40 .. 0 .. 125 degC")]
    public void A_range_takes_exactly_two_dots(string text)
    {
        var e = Assert.Throws<QuantityFormatException>(() => QuantityParser.ParseRange(text, UnitKind.Celsius));
        Assert.Contains("exactly one \"..\"", e.Problem);
    }

    [Theory]
    [InlineData("1e-400 F", UnitKind.Farad)]
    [InlineData("1e-320 V", UnitKind.Volt)]     // subnormal: digits lost
    [InlineData("0.001e-306 ohm", UnitKind.Ohm)]
    public void An_underflow_to_zero_is_refused(string text, UnitKind kind)
    {
        var e = Assert.Throws<QuantityFormatException>(() => QuantityParser.Parse(text, kind));
        Assert.Contains("too small to represent", e.Problem);
    }

    [Fact]
    public void Zero_written_as_zero_is_still_zero()
    {
        Assert.Equal(0, QuantityParser.Parse("0 F", UnitKind.Farad).Value);
        Assert.Equal(0, QuantityParser.Parse("0e-400 V", UnitKind.Volt).Value);
    }

    [Theory]
    [InlineData("-0 ohm", UnitKind.Ohm)]
    [InlineData("-0 F", UnitKind.Farad)]
    [InlineData("-0.0 s", UnitKind.Second)]
    public void A_minus_sign_on_a_value_that_cannot_be_negative_is_refused_even_on_zero(string text, UnitKind kind)
    {
        var e = Assert.Throws<QuantityFormatException>(() => QuantityParser.Parse(text, kind));
        Assert.Contains("cannot be negative", e.Problem);
    }

    [Fact]
    public void Negative_zero_where_a_sign_is_allowed_reads_as_plain_zero()
    {
        var q = QuantityParser.Parse("-0 V", UnitKind.Volt);
        Assert.False(double.IsNegative(q.Value));
    }

    [Theory]
    [InlineData(11, "excitation = \"1e-300 V\"", "plausible range 1 mV .. 1 kV")]
    [InlineData(10, "fixed_resistor = \"1e30 ohm\"", "plausible range")]
    [InlineData(23, "budget = \"1e300 K\"", "plausible range")]
    [InlineData(23, "budget = \"1.7e308 K\"", "plausible range")]
    [InlineData(16, "sample_rate = \"1e300 Hz\"", "plausible range")]
    [InlineData(22, "range = \"-300 degC .. 125 degC\"", "outside the plausible temperatures")]
    [InlineData(6, "beta = nan", "NaN and infinity")]
    [InlineData(6, "beta = -inf", "NaN and infinity")]
    [InlineData(6, "beta = inf", "NaN and infinity")]
    [InlineData(10, "fixed_resistor = nan", "NaN and infinity")]
    public void Implausible_and_non_finite_values_are_refused_at_their_position(int line, string replacement, string problem)
    {
        var e = Refused(DesignText.With(line, replacement));
        Assert.Contains(problem, e.Problem);
        Assert.Equal(line, e.Line);
    }

    [Fact]
    public void A_sweep_beyond_the_point_limit_is_refused_before_the_work_and_the_limit_can_be_raised()
    {
        using var folder = new HostileFolder();
        var design = folder.Write("d.toml", DesignText.Valid + "step = \"0.00001 K\"\n"); // 10 µK: 16.5 million points
        var refused = CliRunner.Run("check", design, "-q");
        Assert.Equal(ExitCodes.BadInput, refused.ExitCode);
        Assert.Contains("more than the limit of 100000", refused.Error);
        Assert.Contains("--max-points", refused.Error);
        var coarse = folder.Write("e.toml", DesignText.Valid + "step = \"0.001 K\"\n"); // 165,001 points
        Assert.Equal(ExitCodes.BadInput, CliRunner.Run("validate", coarse).ExitCode);
        Assert.Equal(ExitCodes.Success, CliRunner.Run("validate", coarse, "--max-points", "200000").ExitCode);
    }

    [Fact]
    public void The_conversion_limit_stops_a_sampling_run_with_the_option_that_raises_it()
    {
        using var folder = new HostileFolder();
        // Through ngspice, which runs conversion by conversion; the built-in engine finds this design's steady state directly.
        var run = CliRunner.Run("check", folder.Design(), "-q", "--engine", "ngspice", "--max-conversions", "1");
        Assert.Equal(ExitCodes.SimulationFailed, run.ExitCode);
        Assert.Contains("--max-conversions", run.Error);
    }
}
