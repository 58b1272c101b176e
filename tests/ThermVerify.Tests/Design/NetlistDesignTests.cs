using ThermVerify.Design;

namespace ThermVerify.Tests.Design;

/// <summary>[netlist] in a design file: the names it gives are checked against the netlist, positioned like every key, and written back.</summary>
public sealed class NetlistDesignTests : IDisposable
{
    private readonly DirectoryInfo folder = Directory.CreateTempSubdirectory("tv-netlist-design-");

    public void Dispose() => folder.Delete(recursive: true);

    internal const string Netlist = """
        * test front end
        Vexc exc 0 DC 3.3
        Rtop exc mid 10k
        Rntc mid 0 10k
        Rs mid pin 1k
        Cs pin 0 100n
        .end
        """;

    internal static readonly string[] Lines =
    [
        "name = \"netlist test\"",             // 1
        "[sensor]",                            // 2
        "model = \"beta\"",                    // 3
        "r25 = \"10 kohm\"",                   // 4
        "beta = 3435",                         // 5
        "[netlist]",                           // 6
        "file = \"front.cir\"",                // 7
        "sensor = \"Rntc\"",                   // 8
        "pin = \"pin\"",                       // 9
        "reference = \"exc\"",                 // 10
        "excitation = [\"Vexc\"]",             // 11
        "[[netlist.part]]",                    // 12
        "name = \"Rtop\"",                     // 13
        "tolerance = \"0.1 %\"",               // 14
        "tempco = \"25 ppm/K\"",               // 15
        "[adc]",                               // 16
        "bits = 12",                           // 17
        "reference = \"ratiometric\"",         // 18
        "sample_rate = \"10 kHz\"",            // 19
        "acquisition_time = \"2 us\"",         // 20
        "sampling_capacitance = \"5 pF\"",     // 21
        "switch_resistance = \"1 kohm\"",      // 22
        "[check]",                             // 23
        "range = \"-20 degC .. 80 degC\"",     // 24
        "budget = \"0.5 K\"",                  // 25
    ];

    private FrontEndDesign Load(string text, string netlist = Netlist)
    {
        File.WriteAllText(Path.Combine(folder.FullName, "front.cir"), netlist);
        var path = Path.Combine(folder.FullName, "design.toml");
        File.WriteAllText(path, text);
        return DesignLoader.Load(path);
    }

    private static string With(int line, string replacement)
    {
        var copy = (string[])Lines.Clone();
        copy[line - 1] = replacement;
        return string.Join("\n", copy) + "\n";
    }

    private static string Valid => string.Join("\n", Lines) + "\n";

    [Fact]
    public void The_names_are_read_against_the_netlist_and_the_reference_is_its_source()
    {
        var design = Load(Valid);
        var n = design.Netlist!;
        Assert.Equal(["Rntc"], n.SensorElements);
        Assert.Equal("pin", n.PinNode);
        Assert.Equal("exc", n.ReferenceNode);
        Assert.Equal(3.3, n.ReferenceVolts);
        Assert.Equal(3.3, design.NominalReferenceVolts);
        Assert.Equal(["Vexc"], n.Excitation);
        var part = Assert.Single(n.Parts);
        Assert.Equal(("Rtop", 0.001), (part.Name, part.Tolerance));
        Tolerance.AssertClose(25e-6, part.TempcoPerKelvin, 1e-12);
        Assert.Equal(6, n.Parsed.Elements.Count + 1);
        Assert.Contains(design.Source!.Files, f => f.Name == "front.cir");
    }

    [Fact]
    public void The_writer_writes_it_back_and_it_loads_the_same()
    {
        var design = Load(Valid);
        var again = Load(DesignWriter.ToToml(design));
        var (a, b) = (design.Netlist!, again.Netlist!);
        Assert.Equal((a.File, a.PinNode, a.ReferenceNode, a.ReferenceVolts), (b.File, b.PinNode, b.ReferenceNode, b.ReferenceVolts));
        Assert.Equal(a.SensorElements, b.SensorElements);
        Assert.Equal(a.Excitation, b.Excitation);
        Assert.Equal(a.Parts, b.Parts);
    }

    [Theory]
    [InlineData(8, "sensor = \"Rntx\"", 8, "Did you mean Rntc")]
    [InlineData(8, "sensor = \"Cs\"", 8, "not a resistor")]
    [InlineData(8, "sensor = [\"Rntc\", \"Rtop\"]", 8, "not supported yet")]
    [InlineData(9, "pin = \"pn\"", 9, "Did you mean pin")]
    [InlineData(9, "pin = \"0\"", 9, "ground")]
    [InlineData(10, "reference = \"mid\"", 10, "no DC voltage source drives node mid")]
    [InlineData(10, "", 18, "needs the netlist's reference node")]
    [InlineData(11, "excitation = [\"Rtop\"]", 11, "not a source")]
    [InlineData(11, "excitation = [\"Vexc\"]\nfixed = \"Cs\"", 12, "Cs is not a resistor")]
    [InlineData(11, "excitation = [\"Vexc\"]\nfixed = \"Rntc\"", 12, "Rntc is the sensor")]
    [InlineData(11, "excitation = [\"Vexc\"]\nfixed = \"Rtpo\"", 12, "Did you mean Rtop")]
    [InlineData(13, "name = \"Rntc\"", 13, "is the sensor")]
    [InlineData(13, "name = \"Cs\"", 15, "not a resistor")]
    [InlineData(14, "tolerence = \"1 %\"", 14, "tolerance")]
    [InlineData(5, "beta = 3435\n[divider]\nsensor_side = \"low\"\nfixed_resistor = \"10k\"\nexcitation = \"3.3 V\"", 6, "beside [netlist]")]
    public void Names_that_do_not_fit_the_netlist_are_refused_at_their_key(int line, string replacement, int errorLine, string words)
    {
        var e = Assert.Throws<DesignException>(() => Load(With(line, replacement)));
        Assert.Equal(errorLine, e.Line);
        Assert.Contains(words, e.Message);
    }

    [Fact]
    public void The_fixed_resistor_is_read_by_its_netlist_name_and_written_back()
    {
        var design = Load(With(11, "excitation = [\"Vexc\"]\nfixed = \"rtop\""));
        Assert.Equal("Rtop", design.Netlist!.FixedElement);
        Assert.Contains("fixed = \"Rtop\"", DesignWriter.ToToml(design));
        Assert.Equal(design.Netlist, Load(DesignWriter.ToToml(design)).Netlist);
        Assert.Null(Load(Valid).Netlist!.FixedElement);
    }

    [Fact]
    public void An_error_in_the_netlist_names_the_netlist_file_and_its_line()
    {
        var e = Assert.Throws<DesignException>(() => Load(Valid, Netlist.Replace("Cs pin 0 100n", "Cs pin 0 100n\n.control\nshell rm -rf x\n.endc")));
        Assert.Equal(("front.cir", 7, 1, "netlist.file"), (e.SourceName, e.Line, e.Column, e.KeyPath));
    }

    [Fact]
    public void A_netlist_node_with_a_name_of_the_converter_input_is_refused()
    {
        var e = Assert.Throws<DesignException>(() => Load(Valid, Netlist.Replace("Cs pin 0 100n", "Cs pin hold 100n\nRh hold 0 1k")));
        Assert.Equal(("front.cir", 6), (e.SourceName, e.Line));
        Assert.Contains("hold", e.Message);
    }
}
