using System.Globalization;
using System.Text.RegularExpressions;
using ThermVerify.Circuits;
using ThermVerify.Circuits.Spice;
using ThermVerify.Tests.Cli;

namespace ThermVerify.Tests.Ngspice;

/// <summary>The decks themselves: what every SPICE engine needs to read them the same way (common practice, no source).</summary>
public partial class DeckWriterTests
{
    public static TheoryData<string, string> DesignsAndAnalyses()
    {
        var data = new TheoryData<string, string>();
        foreach (var design in ExampleDesigns.All())
            foreach (var analysis in new[] { "dc", "tran", "ac", "noise" })
                data.Add(design, analysis);
        return data;
    }

    [Theory]
    [MemberData(nameof(DesignsAndAnalyses))]
    public void Deck_command_writes_a_deck_with_explicit_temperatures_and_plain_numbers(string design, string analysis)
    {
        var file = Path.Combine(Path.GetTempPath(), $"thermverify-deck-{Guid.NewGuid():N}.cir");
        try
        {
            var run = CliRunner.Run("deck", Path.Combine(ExampleDesigns.Folder(), design), "--analysis", analysis, "--out", file);
            Assert.Equal(0, run.ExitCode);
            var lines = File.ReadAllLines(file);
            Assert.Contains(lines, l => l.StartsWith(".options tnom=25 ", StringComparison.Ordinal));
            Assert.Contains(lines, l => l.StartsWith(".temp ", StringComparison.Ordinal));
            Assert.Contains(lines, l => l.StartsWith("* design: ", StringComparison.Ordinal));
            // The deck names its nodes: the divider's, or a netlist's pin.
            var named = ExampleDesigns.Load(design).Netlist is { } netlist ? $"* node {netlist.PinNode}: " : "* node div: ";
            Assert.Contains(lines, l => l.StartsWith(named, StringComparison.Ordinal));
            Assert.Equal(".end", lines[^1]);
            var expected = analysis switch { "dc" => ".dc temp ", "tran" => ".tran ", "ac" => ".ac dec ", _ => ".noise v(" };
            Assert.Single(lines, l => l.StartsWith(expected, StringComparison.Ordinal));
            foreach (var line in lines.Where(l => l.Length > 0 && l[0] is not '*' and not '.' and not '+'))
                foreach (var token in line.Split(' ').Skip(1))
                    Assert.False(SuffixedNumber().IsMatch(token), $"'{token}' in '{line}' carries a scale suffix");
        }
        finally
        {
            File.Delete(file);
        }
    }

    [Fact]
    public void Numbers_round_trip_in_plain_exponent_form()
    {
        foreach (var value in new[] { 1e6, 4.7e-9, 0.001, -3.3, 1.0 / 3, 2.2e-16 })
        {
            var text = SpiceNumber.Format(value);
            Assert.DoesNotMatch("[A-DF-Za-df-z]", text);
            Assert.Equal(value, double.Parse(text, CultureInfo.InvariantCulture));
        }
    }

    [Fact]
    public void Temperature_sweep_overshoots_the_last_point_by_half_a_step()
    {
        var circuit = new CircuitBuilder().Resistor("R1", "a", "0", 1e3).CurrentSource("I1", "0", "a", 1e-3).Build();
        double[] temperatures = [-40, -39.9, -39.8];
        var deck = SpiceDeckWriter.Write(circuit, DcTemperatureSweep.From(temperatures));
        // SPICE accumulates the step and may drop the last point (measured with ngspice 39): stop half a step beyond it.
        var step = (temperatures[^1] - temperatures[0]) / 2;
        Assert.Contains($".dc temp -40 {SpiceNumber.Format(-40 + 2.5 * step)} {SpiceNumber.Format(step)}", deck);
    }

    [Fact]
    public void Unevenly_spaced_temperatures_are_refused_with_the_offending_point()
    {
        var error = Assert.Throws<EngineUnsupportedException>(() => DcTemperatureSweep.From([0, 1, 3]));
        Assert.Contains("#2", error.Message);
    }

    // A digit followed by a letter other than the exponent's e: 1k, 4n7, 1M, 1meg.
    [GeneratedRegex(@"^-?[0-9.]+(e[-+]?[0-9]+)?[a-df-zA-DF-Z]")]
    private static partial Regex SuffixedNumber();
}
