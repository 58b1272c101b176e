using ThermVerify.Design;
using ThermVerify.Design.Subcircuits;

namespace ThermVerify.Tests.Design;

/// <summary>
/// The strict reader of a user's subcircuit file: the accepted subset comes back element by element (never as the
/// file's text), and everything else is refused with the file, line and column. The element syntax is SPICE's as the
/// ngspice manual gives it (R, C, L, V, I, D with .model, E, F, G, H with POLY, X; common practice, no source).
/// </summary>
public class SubcircuitParserTests
{
    private static SubcircuitLibrary Parse(string text, Func<string, (string, string)>? files = null) =>
        SubcircuitParser.Parse(text, "amp.lib", "buffer.subckt_file",
            (path, at, _) => files?.Invoke(path) ?? throw new DesignException("amp.lib", at.Line, at.Column, "", "no includes here", ""));

    private static DesignException Refused(string text) => Assert.Throws<DesignException>(() => Parse(text));

    private const string Amp = """
        * a five-pin op-amp with every accepted element
        .param gm = 100 rload = {1k*2}
        .model dclamp D (is=1e-14 n=1.5)
        .subckt amp inp inn vcc vee out params: cpole=1.59n
        Vos inp_os inp DC 1m AC 0
        Ibias inp 0 dc 10p
        G1 0 pole inp_os inn {gm}
        R1 pole 0 1k tc1=0
        C1 pole 0 {cpole}
        L1 pole lx 1u
        Rl lx 0 {rload}
        E1 drive 0 pole 0 1
        Esum s 0 poly(2) (pole,0) (drive,0) 0 0.5 0.5
        Vsense drive d2 0
        F1 0 s Vsense 1
        H1 h 0 Vsense 10
        Rh h 0 1meg
        Rs s 0 1k
        D1 d2 vcc dclamp
        D2 vee d2 dclamp 2
        Rout d2 out 100
        Xbuf out 0 bufcell
        .ends amp
        .subckt bufcell a b
        Rab a b 1e12
        .ends
        .end
        """;

    [Fact]
    public void Every_accepted_element_comes_back_in_plain_form_with_global_names_prefixed()
    {
        var library = Parse(Amp);
        Assert.Equal(5, library.Find("AMP")!.Pins.Count);
        var spice = library.Spice("amp.lib");
        Assert.Contains(".subckt u_amp inp inn vcc vee out params: cpole=1.59E-09", spice);
        Assert.Contains("Vos inp_os inp dc 0.001 ac 0", spice);
        Assert.Contains("G1 0 pole inp_os inn {u_gm}", spice);          // a global parameter, prefixed
        Assert.Contains("C1 pole 0 {cpole}", spice);                      // the subcircuit's own parameter, as written
        Assert.Contains(".param u_gm=100 u_rload={1000*2}", spice);
        Assert.Contains("Rh h 0 1000000", spice);                         // SPICE's "meg" read as 10^6 and written plainly
        Assert.Contains("Esum s 0 poly(2) pole 0 drive 0 0 0.5 0.5", spice);
        Assert.Contains("D1 d2 vcc u_dclamp", spice);
        Assert.Contains(".model u_dclamp d (is=1E-14 n=1.5)", spice);
        Assert.Contains("Xbuf out 0 u_bufcell", spice);
        Assert.DoesNotContain(".end\n", spice.Replace(".ends", ""));
        Assert.DoesNotContain("*  a five-pin", spice);                   // comments are not copied
    }

    [Theory]
    [InlineData(".control\nshell touch canary\n.endc", 1, 1, "'.control' is not accepted")]
    [InlineData(".subckt a 1 2\nR1 1 2 1k\n.ends\nshell touch canary", 4, 1, "outside a .subckt")]
    [InlineData(".subckt a 1 2\nB1 1 2 v={shell}\n.ends", 2, 1, "behavioural source")]
    [InlineData(".subckt a 1 2\nQ1 1 2 0 npn\n.ends", 2, 1, "bipolar transistor")]
    [InlineData(".subckt a 1 2\nR1 1 2 1k\n.ends\nR2 1 2 1k", 4, 1, "outside a .subckt")]
    [InlineData(".subckt a 1 2\nR1 1 2 \"1k\"\n.ends", 2, 8, "is not a value")]
    [InlineData(".subckt a 1 2\nR1 1 2 {exp(1)}\n.ends", 2, 12, "function call")]
    [InlineData(".subckt a 1 2\nR1 1 2 {2**3}\n.ends", 2, 10, "powers")]
    [InlineData(".subckt a 1 2\nR1 1 2 {k}\n.ends", 2, 8, "parameter k is not defined")]
    [InlineData(".subckt a 1 2\nE1 1 0 value={v(2)*2}\n.ends", 2, 8, "behavioural form")]
    [InlineData(".subckt a 1 2\nV1 1 2 PULSE(0 1 0 1n 1n 1u 2u)\n.ends", 2, 8, "only DC and AC")]
    [InlineData(".subckt a 1 2\nX1 1 2 nosuch\n.ends", 2, 8, "nosuch is not defined")]
    [InlineData(".subckt a 1 2\nX1 1 2 a\n.ends", 1, 1, "instantiates itself")]
    [InlineData(".subckt a 1 2\nD1 1 2 nomodel\n.ends", 2, 8, "no diode model nomodel")]
    [InlineData(".model q1 npn (bf=100)", 1, 11, "model type npn")]
    [InlineData(".subckt a 1 2\n.subckt b 1 2\n.ends\n.ends", 2, 1, ".subckt inside .subckt")]
    [InlineData(".subckt a 1 2\nR1 1 2 1k", 1, 1, "has no .ends")]
    [InlineData(".subckt a 1 2\nR1 1 2 1k\n.ends b", 3, 7, "closes .subckt a")]
    [InlineData(".subckt a 1 2\nR1 1 2 1k \u001b[31m\n.ends", 2, 11, "U+001B")]
    [InlineData(".subckt a 1 2\nR1 1 2 1k\n.ends\n.end\n.control", 5, 1, "after .end")]
    [InlineData(".lib other.lib typical", 1, 1, "'.lib' is not accepted")]
    [InlineData("+ R1 1 2 1k\n.subckt a 1 2\n.ends", 1, 1, "continuation line")]
    [InlineData(".subckt a 1 2\nR1 1 2+ 1k\n.ends", 2, 6, "is not usable as a node name")]
    public void Anything_outside_the_subset_is_refused_at_its_place(string text, int line, int column, string problem)
    {
        var e = Refused(text);
        Assert.Contains(problem, e.Problem);
        Assert.Equal((line, column), (e.Line, e.Column));
        Assert.Equal("amp.lib", e.SourceName);
    }

    [Fact]
    public void An_include_is_read_through_the_design_folders_rules_and_its_definitions_join_the_library()
    {
        var library = Parse(".include \"cell.lib\"\n.subckt top 1 2\nX1 1 2 cell\n.ends",
            path => path == "cell.lib" ? ("cell.lib", ".subckt cell a b\nR1 a b 1k\n.ends") : throw new InvalidOperationException(path));
        Assert.NotNull(library.Find("cell"));
        Assert.Contains("X1 1 2 u_cell", library.Spice("amp.lib"));
    }

    [Fact]
    public void Includes_nest_only_a_few_levels_deep()
    {
        var e = Assert.Throws<DesignException>(() => Parse(".include a.lib", _ => ("a.lib", ".include a.lib")));
        Assert.Contains("nested more than", e.Problem);
    }
}
