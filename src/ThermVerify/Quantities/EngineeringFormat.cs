using System.Globalization;

namespace ThermVerify.Quantities;

/// <summary>
/// Prints SI values the way <see cref="QuantityParser"/> reads them back: "4.7 kΩ", "100 nF", "-40 °C",
/// "1.5 µs", "12.3 mV", "1 %", "25 ppm/K", "0.5 V/µs". The mantissa lies in [1, 1000) where a prefix applies;
/// outside the prefixes f..T the number is printed with an exponent.
/// </summary>
public static class EngineeringFormat
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
            return Prefixed(valueSi, symbol, significantDigits);
        var written = valueSi / Math.Pow(10, UnitSymbols.StorageExponent(unit));
        var number = Plain(written, significantDigits);
        return symbol.Length == 0 ? number : $"{number} {symbol}";
    }

    public static string FormatRange(double minSi, double maxSi, UnitKind unit, int significantDigits = 4) =>
        $"{Format(minSi, unit, significantDigits)} .. {Format(maxSi, unit, significantDigits)}";

    private static string Prefixed(double value, string symbol, int digits)
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
