using ThermVerify.Quantities;

namespace ThermVerify.Tests.Quantities;

public class QuantityParserTests
{
    private const double Rel = 1e-12;

    // RKM codes: IEC 60062, clause on letter-and-digit code (letter marks the decimal point and multiplier):
    // R47 = 0.47 Ω, 4R7 = 4.7 Ω, 4K7 = 4.7 kΩ, 4M7 = 4.7 MΩ; capacitors p n µ: 4n7 = 4.7 nF.
    [Theory]
    [InlineData("4k7", 4.7e3)]
    [InlineData("4K7", 4.7e3)]
    [InlineData("2R2", 2.2)]
    [InlineData("R47", 0.47)]
    [InlineData("100R", 100.0)]   // common practice on schematics, consistent with IEC 60062 (R as the decimal point)
    [InlineData("47R", 47.0)]
    [InlineData("4M7", 4.7e6)]
    [InlineData("1M0", 1.0e6)]
    [InlineData("10k", 10e3)]
    [InlineData("4k75", 4.75e3)]
    [InlineData("1m", 1e-3)]           // milli-ohm: m is milli (SI Brochure, 9th ed., table 7)
    [InlineData("4k7 ohm", 4.7e3)]
    [InlineData("4k7\u03A9", 4.7e3)]
    public void RkmAndBarePrefixResistances(string text, double expectedOhms)
    {
        var q = QuantityParser.Parse(text, UnitKind.Ohm);
        Assert.Equal(UnitKind.Ohm, q.Unit);
        Tolerance.AssertClose(expectedOhms, q.Value, Rel, 0, text);
    }

    [Theory]
    [InlineData("4n7", 4.7e-9)]       // IEC 60062
    [InlineData("1u5", 1.5e-6)]       // IEC 60062, u standing in for µ (common practice, no source)
    [InlineData("4\u00B5" + "7", 4.7e-6)]
    [InlineData("p68", 0.68e-12)]
    [InlineData("100 nF", 100e-9)]
    [InlineData("100nF", 100e-9)]
    [InlineData("100n", 100e-9)]
    [InlineData("22 pF", 22e-12)]
    [InlineData("1 mF", 1e-3)]
    [InlineData("10 \u03BCF", 10e-6)]  // Greek mu accepted for micro
    public void Capacitances(string text, double expectedFarads)
    {
        var q = QuantityParser.Parse(text, UnitKind.Farad);
        Tolerance.AssertClose(expectedFarads, q.Value, Rel, 0, text);
    }

    // SI prefixes and units: SI Brochure, 9th ed. (tables 7 and 4).
    [Theory]
    [InlineData("3.3 V", UnitKind.Volt, 3.3)]
    [InlineData("12.3 mV", UnitKind.Volt, 12.3e-3)]
    [InlineData("-0.1 V", UnitKind.Volt, -0.1)]
    [InlineData("+1.5e-3 V", UnitKind.Volt, 1.5e-3)]
    [InlineData("50 pA", UnitKind.Ampere, 50e-12)]
    [InlineData("10 fA", UnitKind.Ampere, 10e-15)]
    [InlineData("1.5 us", UnitKind.Second, 1.5e-6)]
    [InlineData("1.5 \u00B5s", UnitKind.Second, 1.5e-6)]
    [InlineData("10 kHz", UnitKind.Hertz, 10e3)]
    [InlineData("1 MHz", UnitKind.Hertz, 1e6)]
    [InlineData("100 kohm", UnitKind.Ohm, 100e3)]
    [InlineData("100 kOhms", UnitKind.Ohm, 100e3)]
    [InlineData("2.2 M\u2126", UnitKind.Ohm, 2.2e6)]
    [InlineData("0.5 K", UnitKind.Kelvin, 0.5)]
    [InlineData("500 mK", UnitKind.Kelvin, 0.5)]
    [InlineData("-40 degC", UnitKind.Celsius, -40)]
    [InlineData("-40 \u00B0C", UnitKind.Celsius, -40)]
    [InlineData("125\u2103", UnitKind.Celsius, 125)]
    [InlineData("1 %", UnitKind.Percent, 0.01)]
    [InlineData("0.1%", UnitKind.Percent, 0.001)]
    [InlineData("50 ppm", UnitKind.Ppm, 50e-6)]
    [InlineData("25 ppm/K", UnitKind.PpmPerKelvin, 25e-6)]
    [InlineData("25 ppm/degC", UnitKind.PpmPerKelvin, 25e-6)]
    [InlineData("100 dB", UnitKind.Decibel, 100)]
    [InlineData("2 mW/K", UnitKind.WattPerKelvin, 2e-3)]
    [InlineData("1.5 mW/\u00B0C", UnitKind.WattPerKelvin, 1.5e-3)]
    [InlineData("0.5 V/us", UnitKind.VoltPerSecond, 0.5e6)]
    [InlineData("0.5 V/\u00B5s", UnitKind.VoltPerSecond, 0.5e6)]
    [InlineData("500 kV/s", UnitKind.VoltPerSecond, 0.5e6)]
    [InlineData("20 nV/rtHz", UnitKind.VoltPerRootHertz, 20e-9)]
    [InlineData("20 nV/\u221AHz", UnitKind.VoltPerRootHertz, 20e-9)]
    [InlineData("0.5 pA/rtHz", UnitKind.AmperePerRootHertz, 0.5e-12)]
    [InlineData("1 LSB", UnitKind.Lsb, 1)]
    [InlineData("-0.5 LSB", UnitKind.Lsb, -0.5)]
    [InlineData("5 uV/K", UnitKind.VoltPerKelvin, 5e-6)]
    [InlineData("5 \u00B5V/\u00B0C", UnitKind.VoltPerKelvin, 5e-6)]
    [InlineData("45 deg", UnitKind.Degree, 45)]
    [InlineData("60\u00B0", UnitKind.Degree, 60)]
    [InlineData("12", UnitKind.Dimensionless, 12)]
    [InlineData("3.5e-3", UnitKind.Dimensionless, 3.5e-3)]
    public void UnitsAndPrefixes(string text, UnitKind unit, double expectedSi)
    {
        var q = QuantityParser.Parse(text, unit);
        Assert.Equal(unit, q.Unit);
        Tolerance.AssertClose(expectedSi, q.Value, Rel, 0, text);
    }

    [Fact]
    public void ToleranceMayBeWrittenInPercentOrPpmAndIsAFractionEitherWay()
    {
        Assert.Equal(0.01, QuantityParser.Parse("1 %", UnitKind.Percent, UnitKind.Ppm).Value, 15);
        Assert.Equal(0.01, QuantityParser.Parse("10000 ppm", UnitKind.Percent, UnitKind.Ppm).Value, 15);
    }

    [Theory]
    [InlineData("", "empty")]
    [InlineData("   ", "empty")]
    [InlineData("NaN", "NaN")]
    [InlineData("Infinity ohm", "infinity")]
    [InlineData("1e999 ohm", "too large")]
    [InlineData("4.7 kohmz", "unknown unit \"kohmz\"")]
    [InlineData("3.3 V", "wrong unit")]
    [InlineData("-4k7", "cannot be negative")]
    [InlineData("-10 kohm", "cannot be negative")]
    [InlineData("4700", "missing unit")]
    [InlineData("1meg", "meg")]
    [InlineData("1 MEG", "meg")]
    [InlineData("1 Megohm", "meg")]
    [InlineData("4k7 kohm", "both an RKM letter and an SI prefix")]
    [InlineData("4k7k", "both an RKM letter and an SI prefix")]
    [InlineData("4.7k5", "decimal point and an RKM letter")]
    [InlineData("4k7.5", "decimal point and an RKM letter")]
    [InlineData("4.7K", "kelvin")]
    [InlineData("4.7 Kohm", "unknown unit")]
    [InlineData("4,7 kohm", "comma")]
    [InlineData("kohm", "no number")]
    [InlineData("4.7 k ohm", "unknown unit")]
    public void RejectedResistances(string text, string expectedFragment)
    {
        var e = Assert.Throws<QuantityFormatException>(() => QuantityParser.Parse(text, UnitKind.Ohm));
        Assert.Contains(expectedFragment, e.Message, StringComparison.OrdinalIgnoreCase);
        Assert.StartsWith($"\"{text}\"", e.Message);
        Assert.False(string.IsNullOrWhiteSpace(e.Hint));
    }

    [Theory]
    [InlineData("1 MF", UnitKind.Farad, "megafarad")]
    [InlineData("1M0", UnitKind.Farad, "megafarad")]
    [InlineData("2R2", UnitKind.Farad, "wrong unit")]
    [InlineData("2R2 V", UnitKind.Volt, "R means ohms")]
    [InlineData("-1 us", UnitKind.Second, "cannot be negative")]
    [InlineData("-10 nF", UnitKind.Farad, "cannot be negative")]
    [InlineData("298.15 K", UnitKind.Celsius, "wrong unit")]
    [InlineData("1 degC", UnitKind.Kelvin, "wrong unit")]
    [InlineData("25", UnitKind.Celsius, "missing unit")]
    [InlineData("1 lsb", UnitKind.Lsb, "unknown unit")]
    [InlineData("3.3 v", UnitKind.Volt, "unknown unit")]
    public void OtherRejections(string text, UnitKind unit, string expectedFragment)
    {
        var e = Assert.Throws<QuantityFormatException>(() => QuantityParser.Parse(text, unit));
        Assert.Contains(expectedFragment, e.Message, StringComparison.OrdinalIgnoreCase);
    }

    [Fact]
    public void KelvinWhereCelsiusIsExpectedSaysToWriteDegC()
    {
        var e = Assert.Throws<QuantityFormatException>(() => QuantityParser.Parse("298.15 K", UnitKind.Celsius));
        Assert.Contains("degC", e.Hint);
    }

    [Fact]
    public void ImpliedUnitNeedsExactlyOnePrefixedKind()
    {
        var e = Assert.Throws<QuantityFormatException>(() => QuantityParser.Parse("10k", UnitKind.Ohm, UnitKind.Volt));
        Assert.Contains("missing unit", e.Message);
    }

    [Fact]
    public void TryParseReportsFailureWithoutThrowing()
    {
        Assert.False(QuantityParser.TryParse("4.7 kohmz", out _, UnitKind.Ohm));
        Assert.True(QuantityParser.TryParse("4k7", out var q, UnitKind.Ohm));
        Assert.Equal(4700, q.Value, 9);
    }

    [Theory]
    [InlineData("-40 degC .. 125 degC", UnitKind.Celsius, -40, 125)]
    [InlineData("-40..125 degC", UnitKind.Celsius, -40, 125)]
    [InlineData("-40 .. 125 \u00B0C", UnitKind.Celsius, -40, 125)]
    [InlineData("0 V .. 3.3 V", UnitKind.Volt, 0, 3.3)]
    [InlineData("-0.1 V .. 2.2 V", UnitKind.Volt, -0.1, 2.2)]
    [InlineData("0..3.3 V", UnitKind.Volt, 0, 3.3)]
    [InlineData("1.5..2.5 V", UnitKind.Volt, 1.5, 2.5)]
    [InlineData("500 mV .. 1 V", UnitKind.Volt, 0.5, 1)]
    public void Ranges(string text, UnitKind unit, double min, double max)
    {
        var r = QuantityParser.ParseRange(text, unit);
        Assert.Equal(unit, r.Unit);
        Tolerance.AssertClose(min, r.Min, Rel, 1e-15, "min");
        Tolerance.AssertClose(max, r.Max, Rel, 1e-15, "max");
    }

    [Theory]
    [InlineData("125 degC .. -40 degC", "low end is not below")]
    [InlineData("25 degC .. 25 degC", "low end is not below")]
    [InlineData("-40 degC", "not a range")]
    [InlineData("-40 degC ..", "each side")]
    [InlineData("-40 K .. 125 degC", "low end")]
    [InlineData("-40 degC .. 125", "missing unit")]
    public void RejectedRanges(string text, string expectedFragment)
    {
        var e = Assert.Throws<QuantityFormatException>(() => QuantityParser.ParseRange(text, UnitKind.Celsius));
        Assert.Contains(expectedFragment, e.Message);
        Assert.StartsWith($"\"{text}\"", e.Message);
    }
}
