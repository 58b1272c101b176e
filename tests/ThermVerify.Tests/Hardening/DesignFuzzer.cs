using System.Globalization;
using System.Text.RegularExpressions;

namespace ThermVerify.Tests.Hardening;

/// <summary>
/// Seeded designs for the full check: an example's values replaced, a few at a time, by values drawn around and far
/// beyond what a front end uses (every decade from 1e-30 to 1e30, zero, negative zero, signs, RKM codes, NaN,
/// underflows, wrong units, ranges turned round), plus lines dropped or doubled. The text stays TOML-shaped so most
/// designs reach the check; deterministic for a seed, so any failure can be replayed from its number.
/// </summary>
internal static partial class DesignFuzzer
{
    private static readonly string[] Units =
        ["ohm", "kohm", "V", "mV", "A", "nA", "pA", "F", "nF", "pF", "s", "us", "Hz", "kHz", "MHz", "K", "mK", "degC", "%", "ppm",
         "ppm/K", "dB", "mW/K", "V/us", "nV/rtHz", "pA/rtHz", "LSB", "uV/K", "deg", ""];

    private static readonly string[] Oddities =
        ["0", "-0", "nan", "-inf", "1e-400", "1e400", "0K5", "4k7", "1M0", "R47", "meg", "1 MF", "..", "-40...125 degC", "1e-320", "", " "];

    private static readonly string[] Words =
        ["beta", "steinhart-hart", "table", "rtd", "low", "high", "follower", "non-inverting", "ratiometric", "last-sample",
         "other-channel", "discharged", "uniform", "normal", "AA", "B", "X"];

    /// <summary>The design text for fuzz case <paramref name="number"/>, from one of <paramref name="seeds"/>.</summary>
    public static string Design(IReadOnlyList<string> seeds, int number)
    {
        var random = new Random(number);
        var lines = seeds[random.Next(seeds.Count)].Split('\n').ToList();
        var edits = 1 + random.Next(2);
        for (var e = 0; e < edits; e++)
        {
            var candidates = lines.Select((l, i) => (l, i)).Where(x => Assignment().IsMatch(x.l)).Select(x => x.i).ToList();
            if (candidates.Count == 0) break;
            var at = candidates[random.Next(candidates.Count)];
            var m = Assignment().Match(lines[at]);
            switch (random.Next(20))
            {
                case 0:
                    lines.RemoveAt(at);
                    break;
                case 1:
                    lines.Insert(at, lines[at]);
                    break;
                default:
                    lines[at] = $"{m.Groups["key"].Value} = {Value(random, m.Groups["value"].Value)}";
                    break;
            }
        }
        return string.Join('\n', lines);
    }

    private static string Value(Random random, string current)
    {
        var unit = UnitOf(current);
        // Three times in four the value keeps its unit and moves by up to four decades either way: most such designs load,
        // so the check itself meets the extremes; the rest are far-out numbers, oddities and wrong units.
        if (random.Next(4) != 0 && Scaled(random, current) is { } scaled) return scaled;
        return random.Next(12) switch
        {
            0 => $"\"{Oddities[random.Next(Oddities.Length)]}\"",
            1 => $"\"{Words[random.Next(Words.Length)]}\"",
            2 => $"\"{Number(random)} {Units[random.Next(Units.Length)]}\"",
            3 => $"\"{Number(random)} {unit} .. {Number(random)} {unit}\"",
            4 => random.Next(40).ToString(CultureInfo.InvariantCulture),
            5 => Number(random),
            _ => current.Contains("..", StringComparison.Ordinal)
                ? $"\"{Number(random)} {unit} .. {Number(random)} {unit}\""
                : current.StartsWith('"') ? $"\"{Number(random)} {unit}\"" : Number(random),
        };
    }

    /// <summary>Every number in <paramref name="current"/> multiplied by one factor 10^u, u in [-4, 4] (a range keeps its order).</summary>
    private static string? Scaled(Random random, string current)
    {
        var factor = Math.Pow(10, random.NextDouble() * 8 - 4);
        var any = false;
        var result = NumberInText().Replace(current, m =>
        {
            if (!double.TryParse(m.Value, NumberStyles.Float, CultureInfo.InvariantCulture, out var v)) return m.Value;
            any = true;
            return (v * factor).ToString("G4", CultureInfo.InvariantCulture);
        });
        return any ? result : null;
    }

    /// <summary>A number of any sign and any decade from 1e-30 to 1e30, sometimes near the ordinary (1 to 1000).</summary>
    private static string Number(Random random)
    {
        var sign = random.Next(6) == 0 ? "-" : "";
        var exponent = random.Next(3) == 0 ? random.Next(-30, 31) : random.Next(-3, 4);
        var mantissa = 1 + random.NextDouble() * 9;
        return sign + mantissa.ToString("0.###", CultureInfo.InvariantCulture) + "e" + exponent.ToString(CultureInfo.InvariantCulture);
    }

    private static string UnitOf(string value)
    {
        var m = UnitPattern().Match(value);
        return m.Success ? m.Groups[1].Value : "";
    }

    [GeneratedRegex(@"-?\d+(\.\d+)?([eE][-+]?\d+)?")]
    private static partial Regex NumberInText();

    [GeneratedRegex(@"^(?<key>[a-z_0-9]+)\s*=\s*(?<value>[^#\n]+?)\s*(#.*)?$")]
    private static partial Regex Assignment();

    [GeneratedRegex(@"[0-9.]\s*([A-Za-z%°µ/√]+[A-Za-z/√]*)\s*""?\s*$")]
    private static partial Regex UnitPattern();
}
