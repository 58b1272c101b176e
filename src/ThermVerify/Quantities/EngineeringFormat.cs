using System.Globalization;

namespace ThermVerify.Quantities;

/// <summary>
/// Prints SI values the way <see cref="QuantityParser"/> reads them back: "4.7 kΩ", "100 nF", "-40 °C",
/// "1.5 µs", "12.3 mV", "1 %", "25 ppm/K", "0.5 V/µs". The mantissa lies in [1, 1000) where a prefix applies;
/// outside the prefixes f..T the number is printed with an exponent.
/// </summary>
internal static class EngineeringFormat
{
    public static string Format(double valueSi, UnitKind unit, int significantDigits = 4)
    {
        if (!double.IsFinite(valueSi))
            throw new ArgumentOutOfRangeException(nameof(valueSi), valueSi, "only finite values can be printed");
        if (significantDigits is < 1 or > 17)
            throw new ArgumentOutOfRangeException(nameof(significantDigits), significantDigits, "between 1 and 17");
        var symbol = UnitSymbols.PrintedSymbol(unit);
        if (unit == UnitKind.VoltPerSecond)
            return Prefixed(valueSi * 1e-6, "V/\u00B5s", significantDigits);
        if (UnitSymbols.TakesPrefix(unit))
            return Prefixed(valueSi, symbol, significantDigits, unit == UnitKind.Farad);
        var written = valueSi / Math.Pow(10, UnitSymbols.StorageExponent(unit));
        var number = Plain(written, significantDigits);
        return symbol.Length == 0 ? number : $"{number} {symbol}";
    }

    /// <summary>
    /// Prints with as many digits as it takes for <see cref="QuantityParser"/> to read back exactly the same double:
    /// the shortest round-trip decimal of the value, with its decimal point moved textually (never by arithmetic).
    /// </summary>
    public static string FormatExact(double valueSi, UnitKind unit)
    {
        if (!double.IsFinite(valueSi))
            throw new ArgumentOutOfRangeException(nameof(valueSi), valueSi, "only finite values can be printed");
        var symbol = unit == UnitKind.VoltPerSecond ? "V/\u00B5s" : UnitSymbols.PrintedSymbol(unit);
        var shift = unit == UnitKind.VoltPerSecond ? -6 : -UnitSymbols.StorageExponent(unit);
        var (negative, digits, exponent) = Decompose(valueSi);
        if (digits == "0")
            return symbol.Length == 0 ? "0" : $"0 {symbol}";
        exponent += shift;
        var prefixExponent = 0;
        if (UnitSymbols.TakesPrefix(unit))
            prefixExponent = Math.Clamp((int)Math.Floor(exponent / 3.0) * 3, SiPrefixes.SmallestExponent, SiPrefixes.LargestExponent);
        if (unit == UnitKind.Farad && prefixExponent == 6)
            prefixExponent = 3; // "MF" is rejected by the parser
        var number = (negative ? "-" : "") + PlaceDecimalPoint(digits, exponent - prefixExponent);
        var suffix = SiPrefixes.Symbol(prefixExponent) + symbol;
        return suffix.Length == 0 ? number : $"{number} {suffix}";
    }

    /// <summary>Sign, significant digits and the power of ten of the first digit, from the shortest round-trip text.</summary>
    private static (bool Negative, string Digits, int Exponent) Decompose(double value)
    {
        var shortest = Math.Abs(value).ToString("R", CultureInfo.InvariantCulture);
        var e = shortest.IndexOfAny(['E', 'e']);
        var mantissa = e < 0 ? shortest : shortest[..e];
        var exponent = e < 0 ? 0 : int.Parse(shortest[(e + 1)..], CultureInfo.InvariantCulture);
        var point = mantissa.IndexOf('.');
        var digits = mantissa.Replace(".", "");
        exponent += (point < 0 ? mantissa.Length : point) - 1;
        var leadingZeros = digits.Length - digits.TrimStart('0').Length;
        digits = digits.TrimStart('0').TrimEnd('0');
        exponent -= leadingZeros;
        return (value < 0, digits.Length == 0 ? "0" : digits, exponent);
    }

    /// <summary>Writes d1.d2d3… × 10^exponent as plain decimal text when short, else with an exponent.</summary>
    private static string PlaceDecimalPoint(string digits, int exponent)
    {
        if (exponent < -6 || exponent > 15)
        {
            var mantissa = digits.Length == 1 ? digits : $"{digits[0]}.{digits[1..]}";
            return $"{mantissa}e{exponent.ToString(CultureInfo.InvariantCulture)}";
        }
        if (exponent < 0)
            return "0." + new string('0', -exponent - 1) + digits;
        if (digits.Length <= exponent + 1)
            return digits + new string('0', exponent + 1 - digits.Length);
        return $"{digits[..(exponent + 1)]}.{digits[(exponent + 1)..]}";
    }

    public static string FormatRange(double minSi, double maxSi, UnitKind unit, int significantDigits = 4) =>
        $"{Format(minSi, unit, significantDigits)} .. {Format(maxSi, unit, significantDigits)}";

    /// <param name="avoidMega">The parser rejects "MF" (see <see cref="QuantityParser"/>), so megafarads print as kF.</param>
    private static string Prefixed(double value, string symbol, int digits, bool avoidMega = false)
    {
        if (value == 0)
            return $"0 {symbol}";
        var rounded = RoundSignificant(value, digits);
        var exponent3 = (int)Math.Floor(Math.Log10(Math.Abs(rounded)) / 3) * 3;
        if (exponent3 < SiPrefixes.SmallestExponent || exponent3 > SiPrefixes.LargestExponent)
            return $"{Scientific(value, digits)} {symbol}";
        var mantissa = rounded / Math.Pow(10, exponent3);
        // Dividing by the power of ten can land a hair below 1 or at 1000: move to the neighbouring prefix.
        if (Math.Abs(mantissa) >= 1000 - 1e-9 && exponent3 + 3 <= SiPrefixes.LargestExponent)
        {
            exponent3 += 3;
            mantissa /= 1000;
        }
        if (avoidMega && exponent3 == 6)
        {
            exponent3 = 3;
            mantissa *= 1000;
        }
        return $"{Plain(mantissa, digits)} {SiPrefixes.Symbol(exponent3)}{symbol}";
    }

    /// <summary>Fixed notation between 1e-3 and 1e6, exponent outside; trailing zeros trimmed.</summary>
    private static string Plain(double value, int digits)
    {
        if (value == 0)
            return "0";
        var magnitude = Math.Abs(value);
        if (magnitude < 1e-3 || magnitude >= 1e6)
            return Scientific(value, digits);
        var rounded = RoundSignificant(value, digits);
        var integerDigits = (int)Math.Floor(Math.Log10(Math.Abs(rounded))) + 1;
        var decimals = Math.Clamp(digits - integerDigits, 0, 15);
        var text = rounded.ToString("F" + decimals.ToString(CultureInfo.InvariantCulture), CultureInfo.InvariantCulture);
        if (text.Contains('.'))
            text = text.TrimEnd('0').TrimEnd('.');
        return text == "-0" ? "0" : text;
    }

    private static string Scientific(double value, int digits)
    {
        var text = value.ToString("E" + (digits - 1).ToString(CultureInfo.InvariantCulture), CultureInfo.InvariantCulture);
        var e = text.IndexOf('E');
        var mantissa = text[..e];
        if (mantissa.Contains('.'))
            mantissa = mantissa.TrimEnd('0').TrimEnd('.');
        var exponent = int.Parse(text[(e + 1)..], CultureInfo.InvariantCulture);
        return $"{mantissa}e{exponent.ToString(CultureInfo.InvariantCulture)}";
    }

    private static double RoundSignificant(double value, int digits)
    {
        var text = value.ToString("E" + (digits - 1).ToString(CultureInfo.InvariantCulture), CultureInfo.InvariantCulture);
        return double.Parse(text, CultureInfo.InvariantCulture);
    }
}
