using System.Text;
using ThermVerify.Design;
using ThermVerify.Design.Netlists;
using Xunit.Abstractions;

namespace ThermVerify.Tests.Hardening;

/// <summary>
/// Seeded mutations of every bundled netlist, byte by byte and card by card (a token dropped, lines swapped, a dot
/// card or an element letter changed, a continuation split): the reader returns a netlist or a design error at a
/// line and column of the file, never anything else; and the design that names the netlist loads or is refused the
/// same way.
/// </summary>
public sealed class NetlistFuzzTests(ITestOutputHelper log)
{
    public static TheoryData<string> Netlists => [.. Directory.GetFiles(Repository.Netlists, "*.cir").Select(f => Path.GetFileName(f)).Order()];

    private static readonly string[] Inserts =
    [
        ".control", ".endc", ".tran 1u 1m", ".include x.lib", ".include ../x.lib", ".param", ".param x=", ".subckt", ".ends",
        ".model d1 D (IS=)", "+", "+ 1k", "X1", "X1 a b", "R1", "R1 a", "C9 a 0 {", "V1 a 0 PULSE(", "E1 a 0 b", "}", "'", "\"",
        "Rbad a 0 {1/0}", "Rbad a 0 {x*}", "Rz a 0 0", "Q1 a b c", ".end", "* comment", "; comment", "shell rm -rf /",
    ];

    [Theory]
    [MemberData(nameof(Netlists))]
    public void Every_mutation_reads_or_is_refused_at_a_place(string file)
    {
        var text = File.ReadAllText(Path.Combine(Repository.Netlists, file));
        var (tried, read) = (0, 0);
        foreach (var mutated in Mutations(text, file.Length).Concat(InputFuzzer.Mutations(Encoding.UTF8.GetBytes(text), 300, file.Length * 7)
                     .Select(b => Encoding.UTF8.GetString(b))))
        {
            tried++;
            try
            {
                var netlist = NetlistParser.Parse(mutated, file, "netlist.file",
                    (path, at, errors, _) => throw errors.At(at, $"no include in this test ({path})", ""));
                Assert.NotEmpty(netlist.Elements);
                read++;
            }
            catch (DesignException e)
            {
                Assert.Equal(file, e.SourceName);
                Assert.True(e.Line >= 1 && e.Column >= 1, $"no position in: {e.Message}");
                Assert.True(e.Line <= mutated.Count(c => c == '\n') + 1, $"line {e.Line} beyond the file: {e.Message}");
                Assert.DoesNotContain('\u001b', e.Message);
            }
        }
        log.WriteLine($"{file}: {tried} mutations, {read} read, the rest refused at a place");
        Assert.True(tried >= 600);
    }

    [Fact]
    public void Designs_that_name_a_mutated_netlist_load_or_are_refused_at_a_place()
    {
        var folder = Directory.CreateTempSubdirectory("tv-netlist-fuzz-");
        try
        {
            foreach (var design in Directory.GetFiles(Repository.Netlists, "*.toml").Where(f => File.ReadAllText(f).Contains("[netlist]")))
            {
                var toml = File.ReadAllText(design);
                var cir = Path.GetFileName(Path.ChangeExtension(design, ".cir"));
                if (!File.Exists(Path.Combine(Repository.Netlists, cir)))
                    cir = toml.Split('\n').First(l => l.StartsWith("file = ", StringComparison.Ordinal)).Split('"')[1];
                File.WriteAllText(Path.Combine(folder.FullName, "design.toml"), toml);
                foreach (var mutated in Mutations(File.ReadAllText(Path.Combine(Repository.Netlists, cir)), 3).Take(150))
                {
                    File.WriteAllText(Path.Combine(folder.FullName, cir), mutated);
                    try
                    {
                        DesignLoader.Load(Path.Combine(folder.FullName, "design.toml"));
                    }
                    catch (DesignException e)
                    {
                        Assert.True(e.Line >= 1 && e.Column >= 1, $"no position in: {e.Message}");
                    }
                }
            }
        }
        finally
        {
            folder.Delete(recursive: true);
        }
    }

    /// <summary>Card-aware mutations: a token dropped or doubled, two lines swapped, a line inserted from <see cref="Inserts"/>, a letter changed.</summary>
    private static IEnumerable<string> Mutations(string text, int seed)
    {
        var random = new Random(seed);
        var lines = text.Split('\n');
        for (var k = 0; k < 400; k++)
        {
            var copy = lines.ToList();
            var at = random.Next(copy.Count);
            switch (random.Next(5))
            {
                case 0:
                {
                    var tokens = copy[at].Split(' ').ToList();
                    if (tokens.Count > 1) tokens.RemoveAt(random.Next(tokens.Count));
                    copy[at] = string.Join(' ', tokens);
                    break;
                }
                case 1:
                {
                    var other = random.Next(copy.Count);
                    (copy[at], copy[other]) = (copy[other], copy[at]);
                    break;
                }
                case 2:
                    copy.Insert(at, Inserts[random.Next(Inserts.Length)]);
                    break;
                case 3:
                    if (copy[at].Length > 0)
                    {
                        var c = copy[at].ToCharArray();
                        c[random.Next(c.Length)] = "RCLVIDEGFHXQMSB.+*;{}()=,0aZ9 \t"[random.Next(31)];
                        copy[at] = new string(c);
                    }
                    break;
                default:
                {
                    var tokens = copy[at].Split(' ').ToList();
                    if (tokens.Count > 1) tokens.Insert(random.Next(tokens.Count), tokens[random.Next(tokens.Count)]);
                    copy[at] = string.Join(' ', tokens);
                    break;
                }
            }
            yield return string.Join('\n', copy);
        }
    }
}
