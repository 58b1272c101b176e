using ThermVerify.Check;
using ThermVerify.Design;
using ThermVerify.FrontEnd;
using ThermVerify.Ngspice;
using ThermVerify.Tests.Design;
using ThermVerify.Tests.Ngspice;

namespace ThermVerify.Tests.FrontEnd;

/// <summary>
/// A netlist's switched excitation (`switch_on_lead`, a PULSE source or a DC source stepping on): the first sample after
/// switch-on against first-order RC charging and charge sharing in closed form, in both engines.
/// </summary>
public sealed class NetlistSwitchOnTests : IDisposable
{
    private readonly DirectoryInfo folder = Directory.CreateTempSubdirectory("tv-netlist-switch-on-");

    public void Dispose() => folder.Delete(recursive: true);

    private const double Volts = 3.3, Ohms = 10e3, Farads = 100e-9, SampleFarads = 5e-12, SwitchOhms = 1e3, AcquisitionSeconds = 2e-6;

    /// <summary>The divider of NetlistDesignTests without its series resistor: 10 k over 10 k into 100 nF at the pin.</summary>
    private FrontEndDesign Load(string source, double leadSeconds)
    {
        File.WriteAllText(Path.Combine(folder.FullName, "front.cir"), $"""
            * switched divider
            {source}
            Rtop exc pin 10k
            Rntc pin 0 10k
            Cres pin 0 100n
            .end
            """);
        var lines = (string[])NetlistDesignTests.Lines.Clone();
        lines[10] = $"excitation = [\"Vexc\"]\nswitch_on_lead = \"{leadSeconds * 1e3} ms\"";
        var path = Path.Combine(folder.FullName, "design.toml");
        File.WriteAllText(path, string.Join("\n", lines) + "\n");
        return DesignLoader.Load(path);
    }

    /// <summary>
    /// The sample at the end of the first acquisition window, the sampling capacitor empty, with the sensor at 25 °C
    /// (R25 = 10 kΩ). First-order charging (common practice): the pin charges towards the Thevenin voltage V/2 through
    /// R/2 with τ = (R/2)·C, so when the window opens it is V/2·(1 − e^(−L/τ)). In the window the pin and the sampling
    /// capacitor (through the switch's resistance) are a linear system of two states, x' = A·x + b, solved exactly:
    /// x(t) = x∞ + e^(A·t)·(x(0) − x∞), with e^(A·t) by Sylvester's formula for the 2×2 matrix's two real eigenvalues
    /// (textbook linear algebra, from memory).
    /// </summary>
    private static double ClosedForm(double leadSeconds)
    {
        var thevenin = Volts / 2;
        var atWindow = thevenin * (1 - Math.Exp(-leadSeconds / (Ohms / 2 * Farads)));
        double a11 = -2 / (Ohms * Farads) - 1 / (SwitchOhms * Farads), a12 = 1 / (SwitchOhms * Farads);
        double a21 = 1 / (SwitchOhms * SampleFarads), a22 = -1 / (SwitchOhms * SampleFarads);
        var (trace, det) = (a11 + a22, a11 * a22 - a12 * a21);
        var root = Math.Sqrt(trace * trace / 4 - det);
        var (l1, l2) = (trace / 2 + root, trace / 2 - root);
        // Both states end at V/2 (no current flows then); the sampling capacitor starts empty.
        var (d1, d2) = (atWindow - thevenin, 0 - thevenin);
        var (e1, e2) = (Math.Exp(l1 * AcquisitionSeconds), Math.Exp(l2 * AcquisitionSeconds));
        // Row 2 of e^(At) = [e1·(A − l2·I) − e2·(A − l1·I)] / (l1 − l2), applied to the start's distance from the end.
        var row21 = (e1 - e2) * a21 / (l1 - l2);
        var row22 = (e1 * (a22 - l2) - e2 * (a22 - l1)) / (l1 - l2);
        return thevenin + row21 * d1 + row22 * d2;
    }

    public static TheoryData<string, double> Sources => new()
    {
        { "Vexc exc 0 PULSE(0 3.3 0 0 0 10m 0)", 1e-3 },
        { "Vexc exc 0 PULSE(0 3.3 500u 0 0 10m 0)", 1e-3 },
        { "Vexc exc 0 PULSE(0 3.3 0 0 0 10m 0)", 0.3e-3 },
        { "Vexc exc 0 DC 3.3", 1e-3 },
    };

    [Theory]
    [MemberData(nameof(Sources))]
    public void The_first_sample_follows_first_order_charging_from_the_switch_on(string source, double leadSeconds)
    {
        var design = Load(source, leadSeconds);
        var lsb = AdcTransfer.Of(design).LsbVolts;
        // The lead counts from the switch-on: a PULSE's TD, or the DC source's step 1 ns after t = 0.
        var expected = ClosedForm(leadSeconds);
        // Precharged to 0 V, or holding the last sample: the operating point before the switch-on holds every node,
        // the sampling capacitor's included, at 0 V, so the two agree.
        foreach (var precharge in new double?[] { 0, null })
        {
            var sample = SwitchOnSettling.FirstSampleVolts(design, 25, precharge, 0.01 * lsb);
            Tolerance.AssertClose(sample, expected, 0, 2e-6, $"{source}, lead {leadSeconds} s, precharge {precharge}");
            // And it is far from settled: the check sees the switch-on, not the DC level.
            Assert.True(Volts / 2 - sample > 10 * lsb);
        }
    }

    [NgspiceTheory]
    [MemberData(nameof(Sources))]
    public void Ngspice_gives_the_same_first_sample(string source, double leadSeconds)
    {
        var design = Load(source, leadSeconds);
        var lsb = AdcTransfer.Of(design).LsbVolts;
        using var engine = new NgspiceEngine();
        // Holding the last sample: ngspice stops with "timestep too small" where the sampling switch closes on a
        // precharged capacitor after a long run (a limit of its step control, see EngineCrossCheckTests).
        var theirs = SwitchOnSettling.FirstSampleVolts(design, 25, null, 0.01 * lsb, engine);
        var ours = SwitchOnSettling.FirstSampleVolts(design, 25, null, 0.01 * lsb);
        // ngspice (an outside engine) reads the deck written from the parsed PULSE; its edges are 1 ps, ours ideal.
        Tolerance.AssertClose(theirs, ours, 0, 0.01 * lsb, source);
        Tolerance.AssertClose(theirs, ClosedForm(leadSeconds), 0, 0.01 * lsb, $"{source} against the closed form");
    }

    /// <summary>
    /// The soil probe as a netlist with its switch-on lead cut from 10 ms to 2 ms (2.4 time constants of 8.2 kΩ into
    /// 100 nF at -10 °C): the first conversion after switch-on fails its budget, and the finding's closed form,
    /// first-order charging (common practice), is the simulated shortfall within 1 %.
    /// </summary>
    [Fact]
    public void A_short_lead_fails_for_settling_after_the_switch_on()
    {
        File.Copy(Path.Combine(Repository.Netlists, "soil-probe-switched.cir"), Path.Combine(folder.FullName, "soil-probe-switched.cir"));
        var path = Path.Combine(folder.FullName, "short.toml");
        File.WriteAllText(path, File.ReadAllText(Path.Combine(Repository.Netlists, "soil-probe-switched-netlist.toml"))
            .Replace("switch_on_lead = \"10 ms\"", "switch_on_lead = \"2 ms\""));
        var result = FrontEndCheck.Run(DesignLoader.Load(path), new CheckOptions { ComputeRemedies = false });
        Assert.False(result.Passed);
        var settling = Assert.Single(result.Findings, f => f.Id == "settling");
        Assert.Equal(Severity.Fail, settling.Severity);
        Assert.Contains("after the excitation switches on", settling.Title);
        Tolerance.AssertClose(settling.SimulatedVolts!.Value, settling.EstimateVolts!.Value, 0.01, 0, "first-order charging against the simulation");
        // 10 ms (12 time constants) passes: the example itself.
        Assert.True(FrontEndCheck.Run(DesignLoader.Load(Path.Combine(Repository.Netlists, "soil-probe-switched-netlist.toml")), new CheckOptions { ComputeRemedies = false }).Passed);
    }

    /// <summary>
    /// The switch-on deck carries the PULSE re-written from its parsed numbers (a parameter evaluated), never the card's
    /// text (docs/netlists.md, the deck's safety).
    /// </summary>
    [Fact]
    public void The_switch_on_deck_writes_the_pulse_from_its_parsed_numbers()
    {
        var design = Load(".param td = {250u * 2}\nVexc exc 0 PULSE(0 {3.3} {td} 0 0 10m 0)", 1e-3);
        var (circuit, options) = SwitchOnSettling.Setup(design, 25, null, 1e-6);
        var deck = ThermVerify.Circuits.Spice.SpiceDeckWriter.Write(circuit, new ThermVerify.Circuits.Spice.TransientSweep(options.StopTimeSeconds, options.MaxStepSeconds));
        var line = Assert.Single(deck.Split('\n'), l => l.StartsWith("Vexc ", StringComparison.Ordinal));
        Assert.Equal("Vexc exc 0 PULSE(0 3.3 0.0005 1e-12 1e-12 0.01 0)", line);
        Assert.DoesNotContain("{", deck);
        Assert.DoesNotContain("td", deck.Split('\n').Where(l => !l.StartsWith('*')).SelectMany(l => l.Split(' ')));
    }
}
