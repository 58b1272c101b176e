using ThermVerify.Design;

namespace ThermVerify.Tests.Design;

/// <summary>
/// A netlist's switched excitation in the design file: switch_on_lead and reading_interval in [netlist], a PULSE on an
/// excitation source; each misuse refused at its key or at the netlist's card, and the keys written back.
/// </summary>
public sealed class NetlistSwitchOnDesignTests : IDisposable
{
    private readonly DirectoryInfo folder = Directory.CreateTempSubdirectory("tv-netlist-switch-on-design-");

    public void Dispose() => folder.Delete(recursive: true);

    private const string Pulsed = "Vexc exc 0 PULSE(0 3.3 1m 1u 1u 20m 60)";

    private FrontEndDesign Load(string excitationLine, string source = Pulsed)
    {
        File.WriteAllText(Path.Combine(folder.FullName, "front.cir"), NetlistDesignTests.Netlist.Replace("Vexc exc 0 DC 3.3", source));
        var lines = (string[])NetlistDesignTests.Lines.Clone();
        lines[10] = excitationLine;
        var path = Path.Combine(folder.FullName, "design.toml");
        File.WriteAllText(path, string.Join("\n", lines) + "\n");
        return DesignLoader.Load(path);
    }

    [Fact]
    public void A_pulsed_excitation_is_read_at_its_pulsed_level_and_written_back()
    {
        var design = Load("excitation = [\"Vexc\"]\nswitch_on_lead = \"5 ms\"\nreading_interval = \"30 s\"");
        var n = design.Netlist!;
        Assert.Equal((5e-3, 30.0), (n.SwitchOnLeadSeconds, n.ReadingIntervalSeconds));
        // The reference follows the source while it measures: the pulse's second level.
        Assert.Equal(3.3, n.ReferenceVolts);
        var toml = DesignWriter.ToToml(design);
        Assert.Contains("switch_on_lead = \"5 ms\"", toml);
        Assert.Equal(n, Load(DesignWriter.ToToml(design).Split('\n').First(l => l.StartsWith("excitation")) +
                                "\nswitch_on_lead = \"5 ms\"\nreading_interval = \"30 s\"").Netlist);
        // A DC excitation may be switched too: it steps on from 0.
        Assert.Equal(5e-3, Load("excitation = [\"Vexc\"]\nswitch_on_lead = \"5 ms\"", "Vexc exc 0 DC 3.3").Netlist!.SwitchOnLeadSeconds);
    }

    /// <summary>A delta-sigma converter's channel settling does not follow a netlist's switch-on yet: refused, not ignored.</summary>
    [Fact]
    public void A_switched_netlist_read_by_a_delta_sigma_converter_is_refused()
    {
        File.WriteAllText(Path.Combine(folder.FullName, "front.cir"), NetlistDesignTests.Netlist);
        var lines = NetlistDesignTests.Lines.Take(16).ToList();
        lines[10] = "excitation = [\"Vexc\"]\nswitch_on_lead = \"5 ms\"";
        lines.AddRange(["kind = \"delta-sigma\"", "bits = 24", "reference = \"ratiometric\"", "modulator_rate = \"256 kHz\"", "data_rate = \"20 Hz\"",
            "input = \"buffered\"", "filter = \"sinc3\"", .. NetlistDesignTests.Lines.Skip(22)]);
        var path = Path.Combine(folder.FullName, "design.toml");
        File.WriteAllText(path, string.Join("\n", lines) + "\n");
        var e = Assert.Throws<DesignException>(() => DesignLoader.Load(path));
        Assert.Equal(("netlist.switch_on_lead", 12), (e.KeyPath, e.Line));
        Assert.Contains("delta-sigma", e.Message);
    }

    [Theory]
    // A PULSE needs the lead that says when the converter samples after it: refused at the card, under the key to add.
    [InlineData("excitation = [\"Vexc\"]", Pulsed, "front.cir", 2, "netlist.switch_on_lead", "does not say when the converter samples")]
    // Only an excitation source may be switched.
    [InlineData("excitation = []\nswitch_on_lead = \"5 ms\"", Pulsed, "design.toml", 12, "netlist.switch_on_lead", "without an excitation source")]
    [InlineData("excitation = [\"Vexc\"]\nswitch_on_lead = \"5 ms\"", "Vexc exc 0 DC 3.3\nIb pin 0 PULSE(0 1u 0 0 0 1 0)", "front.cir", 3, "netlist.excitation", "not an excitation source")]
    // The pulse must be at its level through the first sample.
    [InlineData("excitation = [\"Vexc\"]\nswitch_on_lead = \"0.5 us\"", Pulsed, "front.cir", 2, "netlist.switch_on_lead", "still rising")]
    [InlineData("excitation = [\"Vexc\"]\nswitch_on_lead = \"25 ms\"", Pulsed, "front.cir", 2, "netlist.switch_on_lead", "ends before the first sample")]
    // reading_interval belongs to a switched excitation and is longer than the lead.
    [InlineData("excitation = [\"Vexc\"]\nreading_interval = \"1 s\"", "Vexc exc 0 DC 3.3", "design.toml", 12, "netlist.reading_interval", "without switch_on_lead")]
    [InlineData("excitation = [\"Vexc\"]\nswitch_on_lead = \"5 ms\"\nreading_interval = \"1 ms\"", Pulsed, "design.toml", 13, "netlist.reading_interval", "not longer than")]
    public void A_misused_switch_on_is_refused_where_it_is_written(string excitationLine, string source, string file, int line, string key, string words)
    {
        var e = Assert.Throws<DesignException>(() => Load(excitationLine, source));
        Assert.Equal((file, line, key), (Path.GetFileName(e.SourceName), e.Line, e.KeyPath));
        Assert.Contains(words, e.Message);
    }
}

/// <summary>negative_pin: the node a differential input's negative side reads, read against the netlist and [adc] input.</summary>
public sealed class NetlistNegativePinDesignTests : IDisposable
{
    private readonly DirectoryInfo folder = Directory.CreateTempSubdirectory("tv-netlist-negative-pin-");

    public void Dispose() => folder.Delete(recursive: true);

    private FrontEndDesign Load(string pinLine, string input)
    {
        File.WriteAllText(Path.Combine(folder.FullName, "front.cir"), NetlistDesignTests.Netlist.Replace("Cs pin 0 100n", "Cs pin 0 100n\nRa exc ref 10k\nRb ref 0 10k"));
        var lines = (string[])NetlistDesignTests.Lines.Clone();
        lines[8] = pinLine;
        lines[17] = "reference = \"ratiometric\"" + input;
        var path = Path.Combine(folder.FullName, "design.toml");
        File.WriteAllText(path, string.Join("\n", lines) + "\n");
        return DesignLoader.Load(path);
    }

    [Fact]
    public void The_negative_pin_is_read_and_written_back()
    {
        var design = Load("pin = \"pin\"\nnegative_pin = \"REF\"", "\ninput = \"differential\"");
        Assert.Equal("ref", design.Netlist!.NegativePinNode);
        Assert.Contains("negative_pin = \"ref\"", DesignWriter.ToToml(design));
        Assert.Equal(design.Netlist, Load("pin = \"pin\"\nnegative_pin = \"ref\"", "\ninput = \"differential\"").Netlist);
    }

    [Theory]
    [InlineData("pin = \"pin\"\nnegative_pin = \"rfe\"", "\ninput = \"differential\"", 10, "Did you mean ref")]
    [InlineData("pin = \"pin\"\nnegative_pin = \"pin\"", "\ninput = \"differential\"", 10, "the same node as pin")]
    [InlineData("pin = \"pin\"\nnegative_pin = \"ref\"", "", 10, "single-ended")]
    [InlineData("pin = \"pin\"", "\ninput = \"pseudo-differential\"", 9, "needs the node its negative input reads")]
    public void A_negative_pin_that_does_not_fit_is_refused_at_its_key(string pinLine, string input, int line, string words)
    {
        var e = Assert.Throws<DesignException>(() => Load(pinLine, input));
        Assert.Equal(line, e.Line);
        Assert.Contains(words, e.Message);
    }
}
