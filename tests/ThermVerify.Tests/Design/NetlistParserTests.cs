using ThermVerify.Design;
using ThermVerify.Design.Netlists;

namespace ThermVerify.Tests.Design;

/// <summary>
/// The strict netlist reader: the Berkeley SPICE subset comes back flat with its values as SPICE reads them (the
/// element syntax, scale factors and the title line are SPICE's as the ngspice manual gives them; from memory), and
/// everything else is refused at its file, line and column with the card quoted.
/// </summary>
public class NetlistParserTests
{
    internal static ParsedNetlist Parse(string text, IReadOnlyDictionary<string, string>? files = null) =>
        NetlistParser.Parse(text, "front.cir", "netlist.file", (path, at, errors, _) =>
            files is not null && files.TryGetValue(path, out var t) ? (path, t) : throw errors.At(at, "no such file here", ""));

    private static DesignException Refused(string text, IReadOnlyDictionary<string, string>? files = null) =>
        Assert.Throws<DesignException>(() => Parse(text, files));

    private const string Front = """
        * kiln vent front end
        .param rtop = 10k  half = {rtop/2}
        Vexc exc 0 DC 3.3 AC 1
        Rtop exc mid {rtop} tc1=100u
        Rntc mid 0 10K
        Rf mid a 4.7kOhm
        Cf a 0 100n
        Xf2 a pin0 rcstage r=1k c={10n*2}
        D1 pin0 clamp dclamp
        Vclamp clamp gnd 3.3
        Ebuf e1 0 pin0 0 1
        Gl e1 0 pin0 0 1u
        Rl e1 0 1meg
        L1 e1 l 1uH
        Rl2 l 0 1MEG
        Iq 0 e1 PULSE(0 1m 1u 1n 1n 5u 10u)
        .model dclamp D (IS=1e-12 N=1.8 RS=5)
        .subckt rcstage in out params: r=100 c=1n
        R1 in mid {r}
        C1 mid 0 {c}
        R2 mid out {r*half/half}
        .ends rcstage
        .end
        """;

    [Fact]
    public void The_subset_comes_back_flat_with_values_as_spice_reads_them()
    {
        var n = Parse(Front);
        Assert.Equal("kiln vent front end", n.Title);
        Assert.Equal(3.3, n.Find("vexc")!.Value);
        var top = n.Find("Rtop")!;
        Assert.Equal(10e3, top.Value);
        Assert.Equal(100e-6, top.Parameters["tc1"], 15);
        Assert.Equal(10e3, n.Find("Rntc")!.Value);
        Assert.Equal(4.7e3, n.Find("Rf")!.Value, 9);                    // trailing letters ignored, as SPICE does
        Assert.Equal(1e6, n.Find("Rl")!.Value);                          // "meg"
        Assert.Equal(1e6, n.Find("Rl2")!.Value);
        Assert.Equal(1e-6, n.Find("L1")!.Value, 15);                     // "uH": micro
        Assert.Equal(["exc", "mid"], n.Find("Rtop")!.Nodes);
        Assert.Equal(["clamp", "0"], n.Find("Vclamp")!.Nodes);           // gnd is ground
        // The instance: pins mapped, internal node named instance.node, instance parameters over the defaults.
        var r1 = n.Find("Xf2.R1")!;
        Assert.Equal(["a", "xf2.mid"], r1.Nodes);
        Assert.Equal(1e3, r1.Value);
        Assert.Equal(20e-9, n.Find("Xf2.C1")!.Value, 1e-22);
        Assert.Equal(["xf2.mid", "pin0"], n.Find("Xf2.R2")!.Nodes);
        var d = n.Find("D1")!;
        Assert.Equal(1e-12, d.Parameters["is"]);
        Assert.Equal(1.8, d.Parameters["n"]);
        var pulse = n.Find("Iq")!.Pulse!;
        double[] expected = [0, 1e-3, 1e-6, 1e-9, 1e-9, 5e-6, 10e-6];
        double[] actual = [pulse.Initial, pulse.Pulsed, pulse.DelaySeconds, pulse.RiseSeconds, pulse.FallSeconds, pulse.WidthSeconds, pulse.PeriodSeconds];
        for (var k = 0; k < expected.Length; k++)
            Tolerance.AssertClose(expected[k], actual[k], 1e-15);
        Assert.Equal(16, n.Elements.Count);
    }

    [Fact]
    public void An_include_is_read_through_the_callback_and_its_errors_name_its_file()
    {
        var files = new Dictionary<string, string> { ["parts.lib"] = "* parts\n.subckt rr a b\nR1 a b 2k\n.ends\n" };
        var n = Parse("* top\n.include parts.lib\nX1 in 0 rr\nV1 in 0 1\n", files);
        Assert.Equal(2e3, n.Find("X1.R1")!.Value);
        files["bad.lib"] = "* parts\nQ1 c b e npn\n";
        var e = Refused("* top\n.include bad.lib\nV1 in 0 1\n", files);
        Assert.Equal(("bad.lib", 2, 1), (e.SourceName, e.Line, e.Column));
    }

    [Theory]
    [InlineData("* t\nV1 a 0 1\n.control\nshell touch canary\n.endc", 3, 1, "control section")]
    [InlineData("* t\nV1 a 0 1\n.tran 1u 1m", 3, 1, "analysis '.tran'")]
    [InlineData("* t\nV1 a 0 1\n.paramm x=1", 3, 1, "Did you mean .param")]
    [InlineData("* t\nV1 a 0 1\nR1 a 0 1k\nF1 a 0 V2 2", 4, 8, "senses the current of V2, which the netlist does not have")]
    [InlineData("* t\nV1 a 0 1\nR1 a 0 1k\nF1 a 0 V2 2", 4, 8, "Did you mean V1")]
    [InlineData("* t\nV1 a 0 1\nR1 a 0 1k\nH1 a 0 R1 2", 4, 8, "which is not a voltage source")]
    [InlineData("* t\nV1 a 0 1\nR1 a 0 1k\nH1 a 0 2", 4, 8, "names no voltage source")]
    [InlineData("* t\nV1 a 0 1\nR1 a 0 1k\nF1 b 0 V1", 4, 8, "needs one gain after its source")]
    [InlineData("* t\nV1 a 0 1\nR1 a 0 1k\nF1 a a V1 2", 4, 6, "both outputs")]
    [InlineData("* t\nV1 a 0 1\nR1 a 0 1k\nH1 a 0 poly(1) V1 0 1", 4, 8, "POLY form")]
    [InlineData("* t\n.subckt s a b\nF1 a b Vin 2\n.ends\nV1 a 0 1\nVin b 0 0\nX1 a 0 s", 3, 8, "(in this subcircuit)")]
    [InlineData("* t\nV1 a 0 1\nQ1 a b 0 npn", 3, 1, "bipolar transistor is not supported yet")]
    [InlineData("* t\nV1 a 0 1\nS1 a 0 b 0 sw", 3, 1, "switch is not supported yet")]
    [InlineData("* t\nV1 a 0 1\nB1 a 0 V={shell}", 3, 1, "behavioural source")]
    [InlineData("* t\nV1 a 0 1\nR1 a 0 {rr}", 3, 9, "parameter rr is not defined")]
    [InlineData("* t\n.param rtop=1k\nV1 a 0 1\nR1 a 0 {rtp}", 4, 9, "Did you mean rtop")]
    [InlineData("* t\nV1 a 0 1\nR1 a 0 rtop", 3, 8, "{rtop}")]
    [InlineData("* t\nV1 a 0 1\nR1 a 0 {2**3}", 3, 10, "powers")]
    [InlineData("* t\nV1 a 0 1\nR1 a 0 {exp(1)}", 3, 12, "function call")]
    [InlineData("* t\nV1 a 0 1\nR1 a 0 -1k", 3, 8, "greater than zero")]
    [InlineData("* t\nV1 a 0 1\nR1 a a 1k", 3, 6, "both terminals")]
    [InlineData("* t\nV1 a 0 1\nR1 a 0 1k\nr1 a 0 2k", 4, 1, "appears twice")]
    [InlineData("* t\nV1 a 0 SIN(0 1 1k)", 2, 8, "SIN is not supported yet")]
    [InlineData("* t\nV1 a 0 1\nD1 a 0 dx", 3, 8, "not defined")]
    [InlineData("* t\nV1 a 0 1\nD1 a 0 dx\n.model dx D (IS=1f CJO=2p)", 4, 20, "CJO is not modelled")]
    [InlineData("* t\nV1 a 0 1\nX1 a 0 nothere", 3, 8, "not defined")]
    [InlineData("* t\n.subckt s a b\nR1 a b 1k\n.ends\nV1 a 0 1\nX1 a s", 6, 6, "1 nodes")]
    [InlineData("* t\n.subckt s a b\nX1 a b s\n.ends\nV1 a 0 1\nX1 a 0 s", 3, 8, "uses itself")]
    [InlineData("* t\n.subckt s a b\nR1 a b 1k\nV1 a 0 1", 2, 9, "has no .ends")]
    [InlineData("* t\nV1 a 0 1\nE1 a 0 poly(1) b 0 0 1", 3, 8, "POLY form")]
    [InlineData("* t\nV1 a-b 0 1", 2, 4, "not usable as a node name")]
    [InlineData("R1 a 0 1k\nV1 a 0 1", 1, 1, "title")]
    [InlineData(".include x.lib\nV1 a 0 1", 1, 1, "title")]
    [InlineData("* t\nV1 a 0 1\n.include /etc/passwd", 3, 10, "no such file")]
    [InlineData("* t\nV1 a 0 1\n.end\nR1 a 0 1k", 4, 1, "after .end")]
    [InlineData("* t\n+ R1 a 0 1k", 2, 1, "continuation")]
    [InlineData("* t\nV1 a 0 1\nR1 a 0 {1/0}", 3, 9, "not a finite number")]
    public void Everything_else_is_refused_at_its_place(string text, int line, int column, string words)
    {
        var e = Refused(text);
        Assert.Equal("front.cir", e.SourceName);
        Assert.Equal((line, column), (e.Line, e.Column));
        Assert.Contains(words, e.Message);
    }

    [Fact]
    public void F_and_H_name_the_source_they_sense_as_the_flat_netlist_names_it()
    {
        // SPICE's F NODE+ NODE- VSOURCE GAIN and H NODE+ NODE- VSOURCE TRANSRESISTANCE (the ngspice manual, from memory);
        // inside a subcircuit the sensed source is the instance's own, and it may come after the card that senses it.
        var n = Parse("* t\nFcopy 0 out vsense {2*1.5}\nVexc a 0 1\nRa a b 1k\nVsense b 0 0\nRo out 0 1k\nHm m 0 VSENSE 1k\nRm m 0 1k\n" +
                      "X1 a 0 meter\n.subckt meter p q\nVs p s 0\nRs s q 10k\nFi 0 o Vs 1\nRo o 0 1k\n.ends\n");
        var f = n.Find("Fcopy")!;
        Assert.Equal(('F', 3.0, "Vsense"), (f.Kind, f.Value, f.Control));
        Assert.Equal(["0", "out"], f.Nodes);
        var h = n.Find("Hm")!;
        Assert.Equal(('H', 1e3, "Vsense"), (h.Kind, h.Value, h.Control));
        Assert.Equal("X1.Vs", n.Find("X1.Fi")!.Control);
    }

    [Fact]
    public void A_refused_element_card_is_quoted()
    {
        var e = Refused("* t\nV1 a 0 1\nQ1 a b 0 npn");
        Assert.Contains("(in the card 'Q1 a b 0 npn')", e.Message);
    }

    [Fact]
    public void Continuation_lines_and_end_of_line_comments_are_read_as_spice_reads_them()
    {
        var n = Parse("* t\nV1 a 0 ; a comment\n+ DC 2.5\nR1 a\n+ 0 1k $ another\n* R2 a 0 1k\n");
        Assert.Equal(2.5, n.Find("V1")!.Value);
        Assert.Equal(1e3, n.Find("R1")!.Value);
        Assert.Null(n.Find("R2"));
    }
}
