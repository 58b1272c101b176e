using System.Globalization;
using System.Text;

namespace ThermVerify.Quantities;

/// <summary>
/// Reads values the way engineers write them: "4.7 kΩ", "4k7", "100nF", "-40 degC", "20 nV/rtHz", "1 %",
/// and ranges "-40 degC .. 125 degC" or "-40..125 degC". Rules (see docs/design-file.md):
/// <list type="bullet">
/// <item>SI prefixes f p n u µ m k M G T (SI Brochure, 9th ed.); M is mega, m is milli; "meg" is rejected.</item>
/// <item>RKM codes per IEC 60062 (4k7, 2R2, R47, 4n7, 1u5, 1M0); a code and a prefix together are rejected.</item>
/// <item>A plain number is accepted only where <see cref="UnitKind.Dimensionless"/> is. A number with only a
/// prefix or RKM letter ("4k7", "100n") takes the unit when exactly one prefixed unit is accepted.</item>
/// <item>Resistance, capacitance, time, frequency, slew rate, noise density and dissipation constant are never negative.</item>
/// <item>"1 MF" is rejected: a megafarad is never meant, millifarad is written mF.</item>
/// </list>
/// Passing no accepted kinds accepts any kind.
/// </summary>
internal static class QuantityParser
{
    private const string RangeSeparator = "..";

    /// <summary>The smallest normal double (2.2e-308); below it digits are lost.</summary>
    private const double SmallestNormal = 2.2250738585072014E-308;

    public static Quantity Parse(string? text, params UnitKind[] accepted) => Read(text ?? "", accepted);

    public static bool TryParse(string? text, out Quantity quantity, params UnitKind[] accepted)
    {
        try
        {
            quantity = Read(text ?? "", accepted);
            return true;
        }
        catch (QuantityFormatException)
        {
            quantity = default;
            return false;
        }
    }

    /// <summary>Reads "low .. high"; a unit written only after the high end applies to both ends.</summary>
    public static QuantityRange ParseRange(string? text, params UnitKind[] accepted)
    {
        var whole = text ?? "";
        var at = whole.IndexOf(RangeSeparator, StringComparison.Ordinal);
        var example = accepted.Length > 0 ? ExampleRange(accepted[0]) : "\"-40 degC .. 125 degC\"";
        // "-40...125" would otherwise read as -40 .. .125: a third dot is refused, never guessed at.
        if (whole.Contains("...", StringComparison.Ordinal) || (at >= 0 && whole.IndexOf(RangeSeparator, at + RangeSeparator.Length, StringComparison.Ordinal) >= 0))
            throw new QuantityFormatException(whole, "a range has exactly one \"..\" (two dots) between its ends", $"Write e.g. {example}.");
        if (at < 0)
            throw new QuantityFormatException(whole, "not a range", $"Write the low and high ends separated by \"..\", e.g. {example}.");
        var lowText = whole[..at].Trim();
        var highText = whole[(at + RangeSeparator.Length)..].Trim();
        if (lowText.Length == 0 || highText.Length == 0)
            throw new QuantityFormatException(whole, "a range needs a value on each side of \"..\"", $"Write e.g. {example}.");
        var high = ReadEnd(whole, highText, "high", accepted);
        var lowLexed = Lex(lowText, lowText);
        var highLexed = Lex(highText, highText);
        if (lowLexed.UnitText.Length == 0 && lowLexed.RkmLetter is null && highLexed.UnitText.Length > 0)
            lowText = lowText + " " + highLexed.UnitText;
        var low = ReadEnd(whole, lowText, "low", accepted);
        if (low.Unit != high.Unit)
            throw new QuantityFormatException(whole, $"the ends have different units ({UnitSymbols.PrintedSymbol(low.Unit)} and {UnitSymbols.PrintedSymbol(high.Unit)})", "Write both ends in the same unit.");
        if (!(low.Value < high.Value))
            throw new QuantityFormatException(whole, "the low end is not below the high end", $"Write the lower value first, e.g. {example}.");
        return new QuantityRange(low.Value, high.Value, low.Unit);
    }

    private static Quantity ReadEnd(string whole, string endText, string which, UnitKind[] accepted)
    {
        try
        {
            return Read(endText, accepted);
        }
        catch (QuantityFormatException e)
        {
            throw new QuantityFormatException(whole, $"{which} end \"{endText}\": {e.Problem}", e.Hint);
        }
    }

    private static string ExampleRange(UnitKind kind) => kind switch
    {
        UnitKind.Celsius => "\"-40 degC .. 125 degC\"",
        UnitKind.Volt => "\"0 V .. 3.3 V\"",
        _ => "\"1 .. 2\" with a unit after each value",
    };

    /// <summary>The pieces of a written value: digits with an optional decimal point, a power of ten, an RKM letter, the unit text.</summary>
    private sealed record Lexed(bool Negative, string Digits, int Exponent, char? RkmLetter, string UnitText);

    private static Quantity Read(string text, UnitKind[] accepted)
    {
        var lexed = Lex(text.Trim(), text);
        var (kind, exponent, prefixExponent) = ResolveUnit(text, lexed, accepted);
        var totalExponent = lexed.Exponent + exponent;
        if (lexed.RkmLetter is { } letter && !RkmCode.Marks(kind, letter))
            throw new QuantityFormatException(text, $"an RKM code (a letter in place of the decimal point) marks only resistances and capacitances (IEC 60062), not {UnitSymbols.Describe(kind).Split(" (")[0]}",
                $"Write the number with a decimal point and its unit, e.g. \"{lexed.Digits} {UnitSymbols.PrintedSymbol(kind)}\" if that is what you mean.");
        var magnitude = double.Parse($"{lexed.Digits}e{totalExponent}", NumberStyles.Float, CultureInfo.InvariantCulture);
        if (!double.IsFinite(magnitude))
            throw new QuantityFormatException(text, "the value is too large to represent", "Check the exponent and prefix.");
        // 1e-400 would silently become 0 (and a subnormal loses its digits): refused, never rounded to nothing.
        if (magnitude < SmallestNormal && lexed.Digits.Any(c => c is >= '1' and <= '9'))
            throw new QuantityFormatException(text, "the value is too small to represent (it would become 0)", "Check the exponent and prefix.");
        if (kind == UnitKind.Farad && prefixExponent == 6)
            throw new QuantityFormatException(text, "\"M\" would make this megafarads", "M is mega in design files; write millifarads as mF (e.g. \"1 mF\").");
        // A minus sign on a value that cannot be negative is refused even on zero ("-0 ohm").
        if (lexed.Negative && UnitSymbols.IsNonNegative(kind))
            throw new QuantityFormatException(text, $"{UnitSymbols.Describe(kind).Split(" (")[0]} cannot be negative", "Remove the minus sign.");
        var value = lexed.Negative && magnitude != 0 ? -magnitude : magnitude;
        return new Quantity(value, kind);
    }

    private static Lexed Lex(string t, string original)
    {
        if (t.Length == 0)
            throw new QuantityFormatException(original, "empty value", "Write a number, with its unit where one is needed.");
        var lower = t.ToLowerInvariant();
        if (lower.Contains("nan") || lower.Contains("inf") || t.Contains('\u221E'))
            throw new QuantityFormatException(original, "NaN and infinity are not values", "Write a finite number.");
        var i = 0;
        var negative = false;
        if (t[i] is '+' or '-' or '\u2212')
        {
            negative = t[i] != '+';
            i++;
        }
        var digits = new StringBuilder();
        char? rkm = null;
        var exponent = 0;
        if (i + 1 < t.Length && RkmCode.IsLetter(t[i]) && char.IsAsciiDigit(t[i + 1]))
        {
            rkm = t[i++];
            digits.Append("0.");
            ReadDigits(t, ref i, digits);
        }
        else
        {
            var intDigits = ReadDigits(t, ref i, digits);
            var fractionDigits = 0;
            if (i < t.Length && t[i] == '.')
            {
                digits.Append('.');
                i++;
                fractionDigits = ReadDigits(t, ref i, digits);
                if (i + 1 < t.Length && RkmCode.IsLetter(t[i]) && char.IsAsciiDigit(t[i + 1]))
                    throw new QuantityFormatException(original, "a decimal point and an RKM letter together", "Write either \"4.7k\" or \"4k7\", not both.");
            }
            else if (intDigits > 0 && i + 1 < t.Length && RkmCode.IsLetter(t[i]) && char.IsAsciiDigit(t[i + 1]))
            {
                rkm = t[i++];
                digits.Append('.');
                ReadDigits(t, ref i, digits);
                if (i < t.Length && t[i] == '.')
                    throw new QuantityFormatException(original, "a decimal point and an RKM letter together", "Write either \"4.7k\" or \"4k7\", not both.");
            }
            else if (intDigits > 0 && i == t.Length - 1 && t[i] == 'R')
            {
                // "100R": the decimal point at the end, as schematics write whole ohms (common practice).
                rkm = t[i++];
            }
            if (intDigits + fractionDigits == 0)
                throw new QuantityFormatException(original, "no number found", "Start with a number, e.g. \"4.7 kohm\" or \"3.3 V\".");
            if (rkm is null && i < t.Length && t[i] is 'e' or 'E')
                exponent = ReadExponent(t, ref i);
        }
        var unitText = t[i..].Trim();
        if (unitText.Length > 0 && unitText[0] == ',' )
            throw new QuantityFormatException(original, "a comma in the number", "Use a decimal point (\"4.7\", not \"4,7\") and no thousands separators.");
        return new Lexed(negative, digits.ToString(), exponent, rkm, unitText);
    }

    private static int ReadDigits(string t, ref int i, StringBuilder into)
    {
        var start = i;
        while (i < t.Length && char.IsAsciiDigit(t[i]))
            into.Append(t[i++]);
        return i - start;
    }

    /// <summary>Reads e±NN if it is one; leaves i alone otherwise (so "1 e" fails later as a unit).</summary>
    private static int ReadExponent(string t, ref int i)
    {
        var j = i + 1;
        var negative = false;
        if (j < t.Length && t[j] is '+' or '-')
        {
            negative = t[j] == '-';
            j++;
        }
        var start = j;
        while (j < t.Length && char.IsAsciiDigit(t[j]))
            j++;
        if (j == start || j - start > 4)
            return 0;
        var value = int.Parse(t[start..j], CultureInfo.InvariantCulture);
        i = j;
        return negative ? -value : value;
    }

    /// <returns>The kind, the power of ten from RKM letter and unit, and the power of ten of the prefix or letter alone.</returns>
    private static (UnitKind Kind, int Exponent, int PrefixExponent) ResolveUnit(string text, Lexed lexed, UnitKind[] accepted)
    {
        var unit = lexed.UnitText;
        var rkmExponent = lexed.RkmLetter is { } letter ? RkmCode.Exponent(letter) : 0;
        if (unit.StartsWith("meg", StringComparison.OrdinalIgnoreCase))
            throw new QuantityFormatException(text, "\"meg\" is not a prefix here", "Design files use SI prefixes: write mega as M (e.g. \"1 Mohm\" or \"1M0\"); m is milli.");
        if (unit.Length == 0 || (unit.Length == 1 && SiPrefixes.TryGetExponent(unit[0], out _)))
        {
            var prefixExponent = rkmExponent;
            if (unit.Length == 1)
            {
                if (lexed.RkmLetter is not null)
                    throw new QuantityFormatException(text, "both an RKM letter and an SI prefix", "Write either \"4k7\" or \"4.7k\", not both.");
                SiPrefixes.TryGetExponent(unit[0], out prefixExponent);
            }
            if (unit.Length == 0 && lexed.RkmLetter is null)
            {
                if (accepted.Length == 0 || accepted.Contains(UnitKind.Dimensionless))
                    return (UnitKind.Dimensionless, 0, 0);
                throw new QuantityFormatException(text, "missing unit", $"Write {DescribeAccepted(accepted)}.");
            }
            return (ImpliedUnit(text, lexed, accepted), prefixExponent, prefixExponent);
        }
        if (unit == "K" && accepted.Length > 0 && !accepted.Contains(UnitKind.Kelvin) && !accepted.Contains(UnitKind.Celsius))
            throw UnknownUnit(text, unit, accepted);
        if (!UnitSymbols.TryRead(unit, out var kind, out var unitExponent, out var hasPrefix))
            throw UnknownUnit(text, unit, accepted);
        if (lexed.RkmLetter is not null && hasPrefix)
            throw new QuantityFormatException(text, "both an RKM letter and an SI prefix", "Write either \"4k7 ohm\" or \"4.7 kohm\", not both.");
        if (lexed.RkmLetter == 'R' && kind != UnitKind.Ohm)
            throw new QuantityFormatException(text, "the RKM letter R means ohms", $"Write {DescribeAccepted(accepted)}.");
        CheckAccepted(text, kind, accepted);
        var prefix = hasPrefix ? unitExponent - UnitSymbols.StorageExponent(kind) : rkmExponent;
        return (kind, rkmExponent + unitExponent, prefix);
    }

    /// <summary>"4k7" or "100n" without a unit: the one accepted kind that takes a prefix, if there is exactly one.</summary>
    private static UnitKind ImpliedUnit(string text, Lexed lexed, UnitKind[] accepted)
    {
        if (lexed.RkmLetter == 'R')
        {
            CheckAccepted(text, UnitKind.Ohm, accepted);
            return UnitKind.Ohm;
        }
        var candidates = accepted.Where(UnitSymbols.TakesPrefix).Distinct().ToArray();
        if (candidates.Length == 1)
            return candidates[0];
        throw new QuantityFormatException(text, "missing unit", $"Write {DescribeAccepted(accepted)}.");
    }

    private static void CheckAccepted(string text, UnitKind kind, UnitKind[] accepted)
    {
        if (accepted.Length == 0 || accepted.Contains(kind))
            return;
        var hint = (kind, accepted.Contains(UnitKind.Celsius), accepted.Contains(UnitKind.Kelvin)) switch
        {
            (UnitKind.Kelvin, true, _) => "An absolute temperature is written in degC (e.g. \"25 degC\"); K is only for temperature differences.",
            (UnitKind.Celsius, _, true) => "A temperature difference is written in K (a difference of 1 \u00B0C is 1 K).",
            _ => $"Write {DescribeAccepted(accepted)}.",
        };
        throw new QuantityFormatException(text, $"wrong unit: {UnitSymbols.Describe(kind).Split(" (")[0]} where {DescribeAccepted(accepted).Split(" (")[0]} is expected", hint);
    }

    private static QuantityFormatException UnknownUnit(string text, string unit, UnitKind[] accepted)
    {
        if (unit.Length > 1 && unit[0] == 'K' && UnitSymbols.TryRead("k" + unit[1..], out _, out _, out _))
            return new QuantityFormatException(text, $"unknown unit \"{unit}\"", $"The prefix kilo is a lowercase k: write \"k{unit[1..]}\".");
        if (unit == "K")
            return new QuantityFormatException(text, "K is kelvin here", $"The prefix kilo is a lowercase k; write {DescribeAccepted(accepted)}.");
        return new QuantityFormatException(text, $"unknown unit \"{unit}\"", $"Write {DescribeAccepted(accepted)}.");
    }

    private static string DescribeAccepted(UnitKind[] accepted) => accepted.Length == 0
        ? "a number with a unit (e.g. \"4.7 kohm\")"
        : string.Join(" or ", accepted.Distinct().Select(UnitSymbols.Describe));
}
