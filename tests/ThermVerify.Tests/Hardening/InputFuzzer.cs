using System.Text;

namespace ThermVerify.Tests.Hardening;

/// <summary>
/// A seeded mutation fuzzer: from each seed input it makes truncations, byte flips, deletions, duplications,
/// insertions of hostile tokens, and whole-input oddities (byte-order marks, invalid UTF-8, very long lines,
/// deep nesting, huge and tiny numbers). Deterministic for a seed, so a failure can be replayed.
/// </summary>
internal static class InputFuzzer
{
    private static readonly string[] HostileTokens =
    [
        "\"", "'", "[", "]", "[[", "]]", "{", "}", "=", "\n", "\r\n", "\t", "\0", "#", ".", "..", ",",
        "NaN", "nan", "inf", "-inf", "1e308", "1e-320", "-0", "1e999999", "0x7fffffff", "9999999999999999999999",
        "\"1e308 kohm\"", "\"1e-320 pF\"", "\"-5 kohm\"", "\"4k7k\"", "\"1 MF\"", "\"meg\"", "\"\"", "\"µ\"",
        "\u00b5", "\u2126", "\u00b0", "\ufeff", "\ud800", "é", "\u202e", "..", "\"-40 degC .. -50 degC\"",
    ];

    public static IEnumerable<byte[]> Mutations(byte[] seed, int count, int randomSeed)
    {
        var random = new Random(randomSeed);
        for (var cut = 0; cut < seed.Length; cut += Math.Max(1, seed.Length / 64))
            yield return seed[..cut];
        yield return [0xEF, 0xBB, 0xBF, .. seed];                       // UTF-8 byte-order mark
        yield return [0xFF, 0xFE, .. seed];                             // UTF-16 byte-order mark on UTF-8 text
        yield return [.. seed, 0xC3, 0x28, 0xA0, 0xA1, 0xFF];           // invalid UTF-8
        yield return Encoding.UTF8.GetBytes(new string('x', 1_000_000) + " = 1\n");
        yield return Encoding.UTF8.GetBytes("name = \"" + new string('n', 200_000) + "\"\n");
        yield return Encoding.UTF8.GetBytes("a = " + new string('[', 5_000) + new string(']', 5_000) + "\n");
        yield return Encoding.UTF8.GetBytes("a = " + string.Concat(Enumerable.Repeat("{b = ", 5_000)) + "1" + new string('}', 5_000) + "\n");
        yield return Encoding.UTF8.GetBytes(string.Concat(Enumerable.Repeat("[a.b.c.d.e.f.g]\n", 2_000)));
        for (var i = 0; i < count; i++)
        {
            var bytes = seed.ToList();
            var edits = 1 + random.Next(4);
            for (var e = 0; e < edits && bytes.Count > 0; e++)
            {
                var at = random.Next(bytes.Count);
                switch (random.Next(5))
                {
                    case 0: bytes[at] = (byte)random.Next(256); break;
                    case 1: bytes.RemoveRange(at, Math.Min(bytes.Count - at, 1 + random.Next(16))); break;
                    case 2: bytes.InsertRange(at, Encoding.UTF8.GetBytes(HostileTokens[random.Next(HostileTokens.Length)])); break;
                    case 3: bytes.InsertRange(at, bytes.GetRange(at, Math.Min(bytes.Count - at, 1 + random.Next(40)))); break;
                    default: bytes[at] = (byte)"0123456789.-+eEkMmunpRK \"=[]\n"[random.Next(29)]; break;
                }
            }
            yield return [.. bytes];
        }
    }

    public static IEnumerable<string> RandomStrings(int count, int randomSeed)
    {
        var random = new Random(randomSeed);
        const string alphabet = "0123456789.,-+eEkKMmGgunpfTRrµΩohmVAFsHzdegC°%ppm/K LSBWdB rtHz√.. \t\"'";
        for (var i = 0; i < count; i++)
        {
            var length = random.Next(0, 24);
            var chars = new char[length];
            for (var c = 0; c < length; c++) chars[c] = random.Next(20) == 0 ? (char)random.Next(0, 0xD7FF) : alphabet[random.Next(alphabet.Length)];
            yield return new string(chars);
        }
        foreach (var token in HostileTokens) yield return token.Trim('"');
    }
}
