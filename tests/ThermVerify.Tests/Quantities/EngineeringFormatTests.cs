using FsCheck;
using FsCheck.Fluent;
using FsCheck.Xunit;
using ThermVerify.Quantities;

namespace ThermVerify.Tests.Quantities;

public class EngineeringFormatTests
{
    [Theory]
    [InlineData(4700, UnitKind.Ohm, "4.7 k\u03A9")]
    [InlineData(100e-9, UnitKind.Farad, "100 nF")]
    [InlineData(-40, UnitKind.Celsius, "-40 \u00B0C")]
    [InlineData(1.5e-6, UnitKind.Second, "1.5 \u00B5s")]
    [InlineData(12.3e-3, UnitKind.Volt, "12.3 mV")]
    [InlineData(3.3, UnitKind.Volt, "3.3 V")]
    [InlineData(0, UnitKind.Volt, "0 V")]
    [InlineData(0.01, UnitKind.Percent, "1 %")]
    [InlineData(25e-6, UnitKind.PpmPerKelvin, "25 ppm/K")]
    [InlineData(0.5e6, UnitKind.VoltPerSecond, "500 mV/\u00B5s")]
    [InlineData(20e-9, UnitKind.VoltPerRootHertz, "20 nV/\u221AHz")]
    [InlineData(2e-3, UnitKind.WattPerKelvin, "2 mW/K")]
    [InlineData(999.96, UnitKind.Ohm, "1 k\u03A9")]
    [InlineData(12, UnitKind.Dimensionless, "12")]
    [InlineData(1e-20, UnitKind.Volt, "1e-20 V")]
    public void PrintsEngineeringNotation(double value, UnitKind unit, string expected) =>
        Assert.Equal(expected, EngineeringFormat.Format(value, unit));

    public static readonly UnitKind[] AllKinds = Enum.GetValues<UnitKind>();

    /// <summary>Parse(Format(x)) ≈ x within half a unit in the last printed digit: rel 5e-4 for 4 digits.</summary>
    [Property(MaxTest = 500)]
    public Property FormatThenParseRoundTrips(NormalFloat mantissa, int exponent, byte kindIndex)
    {
        var kind = AllKinds[kindIndex % AllKinds.Length];
        var value = mantissa.Get * Math.Pow(10, exponent % 20);
        if (UnitSymbols.IsNonNegative(kind))
            value = Math.Abs(value);
        var text = EngineeringFormat.Format(value, kind, 4);
        var back = QuantityParser.Parse(text, kind);
        return (back.Unit == kind && Tolerance.Within(back.Value, value, 5e-4 + 1e-12, 1e-300))
            .Label($"{value:R} {kind} -> \"{text}\" -> {back.Value:R} {back.Unit}");
    }

    [Fact]
    public void RangeRoundTrips()
    {
        var text = EngineeringFormat.FormatRange(-40, 125, UnitKind.Celsius);
        Assert.Equal("-40 \u00B0C .. 125 \u00B0C", text);
        Assert.Equal(new QuantityRange(-40, 125, UnitKind.Celsius), QuantityParser.ParseRange(text, UnitKind.Celsius));
    }
}

public class ExactFormatTests
{
    [Theory]
    [InlineData(4700, UnitKind.Ohm, "4.7 k\u03A9")]
    [InlineData(4712.3456, UnitKind.Ohm, "4.7123456 k\u03A9")]
    [InlineData(100e-9, UnitKind.Farad, "100 nF")]
    [InlineData(0.01, UnitKind.Percent, "1 %")]
    [InlineData(-40, UnitKind.Celsius, "-40 \u00B0C")]
    [InlineData(0.5e6, UnitKind.VoltPerSecond, "500 mV/\u00B5s")]
    [InlineData(1.129148e-3, UnitKind.Dimensionless, "0.001129148")]
    [InlineData(8.75e-8, UnitKind.Dimensionless, "8.75e-8")]
    [InlineData(0, UnitKind.Ohm, "0 \u03A9")]
    public void PrintsShortestExactText(double value, UnitKind unit, string expected) =>
        Assert.Equal(expected, EngineeringFormat.FormatExact(value, unit));

    /// <summary>The normaliser relies on this: what it prints reads back as the very same double.</summary>
    [Property(MaxTest = 1000)]
    public Property FormatExactThenParseIsIdentity(NormalFloat mantissa, int exponent, byte kindIndex)
    {
        var kinds = EngineeringFormatTests.AllKinds;
        var kind = kinds[kindIndex % kinds.Length];
        var value = mantissa.Get * Math.Pow(10, exponent % 25);
        if (UnitSymbols.IsNonNegative(kind))
            value = Math.Abs(value);
        var text = EngineeringFormat.FormatExact(value, kind);
        var back = QuantityParser.Parse(text, kind);
        return (back.Unit == kind && back.Value.Equals(value)).Label($"{value:R} {kind} -> \"{text}\" -> {back.Value:R}");
    }
}
