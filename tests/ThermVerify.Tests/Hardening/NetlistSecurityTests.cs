using ThermVerify.Api;
using ThermVerify.Cli;
using ThermVerify.Tests.Cli;
using ThermVerify.Tests.Ngspice;

namespace ThermVerify.Tests.Hardening;

/// <summary>
/// A netlist's text never reaches ngspice: the deck is written from the parsed elements, names are held to a safe
/// character set, and everything else is refused at load. Control sections, shell lines, includes out of the folder or
/// by absolute path, and newline and continuation tricks are each refused with their place, and the canary an attack
/// would create never exists, in either ngspice mode.
/// </summary>
public sealed class NetlistSecurityTests : IDisposable
{
    private readonly HostileFolder folder = new();

    public void Dispose() => folder.Dispose();

    private static string DesignText() =>
        string.Join("\n", Design.NetlistDesignTests.Lines).Replace("range = \"-20 degC .. 80 degC\"", "range = \"20 degC .. 30 degC\"\nstep = \"10 K\"") + "\n";

    private string Hostile(string netlist)
    {
        folder.Write("front.cir", netlist);
        return folder.Write("design.toml", DesignText());
    }

    private static readonly string Good = Design.NetlistDesignTests.Netlist;

    public static TheoryData<string, string, string> Attacks(string canary) => new()
    {
        { Good.Replace(".end", $".control\nshell touch {canary}\n.endc\n.end"), "front.cir:7:1", "control section" },
        { Good.Replace(".end", $"shell touch {canary}"), "front.cir:7:1", "switch" },
        { Good.Replace("Cs pin 0 100n", $"Cs pin 0 100n\n+ .control\n+ shell touch {canary}"), "front.cir:7:3", "'.control' where" },
        { Good.Replace("Cs pin 0 100n", "Cs pin 0 100n ; \n.control"), "front.cir:7:1", "control section" },
        { Good.Replace(".end", ".include ../outside/evil.cir"), "front.cir:7:10", ".include" },
        { Good.Replace(".end", $".include {canary}.cir"), "front.cir:7:10", "must be relative" },
        { Good.Replace(".end", ".lib /etc/passwd"), "front.cir:7:1", ".lib" },
        { Good.Replace("Rs mid pin 1k", "Rs mid pin {1k}\nB1 pin 0 V={system(\"touch x\")}"), "front.cir:6:1", "behavioural source" },
        { ".control\n" + Good, "front.cir:1:1", "title" },
        { Good.Replace("Rntc mid 0 10k", "Rntc mid 0 10k\nR`id mid 0 1k"), "front.cir:5:1", "not usable" },
        { Good.Replace("Rntc mid 0 10k", "Rntc mid 0 10k\nRx mid\u2028.control 1k"), "front.cir:5:", "not accepted" },
    };

    public static TheoryData<string, string, string, string> AttacksInModes()
    {
        var data = new TheoryData<string, string, string, string>();
        foreach (var mode in new[] { "library", "process" })
            foreach (var row in Attacks("CANARY"))
                data.Add(mode, (string)row[0], (string)row[1], (string)row[2]);
        return data;
    }

    [Theory]
    [MemberData(nameof(Attacks), "CANARY")]
    public void Every_attack_is_refused_at_load_with_its_place(string netlist, string place, string words)
    {
        folder.Write("../outside/evil.cir", $"* evil\n.control\nshell touch {folder.Canary}\n.endc\n");
        var e = Assert.Throws<global::ThermVerify.Design.DesignException>(() => Verifier.LoadDesign(Hostile(netlist.Replace("CANARY", folder.Canary))));
        Assert.StartsWith(place, $"{e.SourceName}:{e.Line}:{e.Column}");
        Assert.Contains(words, e.Message);
        Assert.False(File.Exists(folder.Canary));
    }

    [NgspiceTheory]
    [MemberData(nameof(AttacksInModes))]
    public void With_ngspice_no_attack_runs(string mode, string netlist, string place, string words)
    {
        _ = words;
        folder.Write("../outside/evil.cir", $"* evil\n.control\nshell touch {folder.Canary}\n.endc\n");
        string[] engine = mode == "process" ? ["--engine", "ngspice", "--ngspice-process"] : ["--engine", "ngspice"];
        var run = CliRunner.Run(["check", Hostile(netlist.Replace("CANARY", folder.Canary)), "-q", "--no-remedies", .. engine]);
        Assert.Equal(ExitCodes.BadInput, run.ExitCode);
        Assert.Contains(place, run.Error);
        Assert.False(File.Exists(folder.Canary));
    }

    [Fact]
    public void The_deck_holds_the_parsed_elements_rewritten_and_nothing_of_the_file()
    {
        var netlist = "* title that is never copied: shell touch x\n.param r = 1k ; a comment never copied\n" +
                      Good[(Good.IndexOf('\n') + 1)..].Replace("Rs mid pin 1k", "Rs mid pin {r}   $ trailing comment");
        var design = Verifier.LoadDesign(Hostile(netlist));
        foreach (var analysis in Enum.GetValues<global::ThermVerify.FrontEnd.DeckAnalysis>())
        {
            var deck = Verifier.Deck(design, analysis);
            Assert.DoesNotContain("shell", deck);
            Assert.DoesNotContain("comment", deck);
            Assert.DoesNotContain(".param", deck);
            Assert.DoesNotContain("{r}", deck);
            Assert.Contains("Rs mid pin 1000", deck);        // the value as evaluated, in plain form
            Assert.DoesNotContain(".control", deck);
            Assert.DoesNotContain(".include", deck);
        }
    }
}
