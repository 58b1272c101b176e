using ThermVerify.Check;
using ThermVerify.Design;
using ThermVerify.FrontEnd;
using ThermVerify.Ngspice;

namespace ThermVerify.Tests.Ngspice;

/// <summary>
/// Every bundled netlist example checked by ngspice as well as the built-in engine (ngspice is the outside reference:
/// an independent SPICE engine reading the deck written from the parsed netlist): the same verdict, and every sample
/// within 0.01 LSB and the static pin within 1 µV (0.05 LSB with diodes, see below).
/// </summary>
public class NetlistNgspiceTests
{
    public static TheoryData<string> NetlistExamples => [.. Directory.GetFiles(Repository.Netlists, "*.toml")
        .Where(f => File.ReadAllText(f).Contains("[netlist]")).Select(f => Path.GetFileName(f)).Order()];

    [NgspiceTheory]
    [MemberData(nameof(NetlistExamples))]
    public void Ngspice_gives_the_same_check(string example)
    {
        var design = DesignLoader.Load(Path.Combine(Repository.Netlists, example));
        // A design that states no precharge is checked for every case ("worst"); ngspice stops with "timestep too small"
        // at the sampling switch of the precharged soil-probe transients (a limit of that engine's step control, as in
        // EngineCrossCheckTests), so such a design is compared holding the last sample.
        if (design.Adc.Precharge == PrechargeMode.Worst)
            design = design with { Adc = design.Adc with { Precharge = PrechargeMode.LastSample } };
        var ours = FrontEndCheck.Run(design, new CheckOptions { ComputeRemedies = false });
        using var engine = new NgspiceEngine();
        var theirs = FrontEndCheck.Run(design, new CheckOptions { ComputeRemedies = false, Engine = engine });
        Assert.Equal(ours.Passed, theirs.Passed);
        var lsb = ours.Adc.LsbVolts;
        // A linear netlist agrees to 1 µV and 0.01 LSB. With diodes the leakage follows exp(EG/(n·Vt)·(T/T0 − 1)), and
        // ngspice's k/q (an older value than CODATA's, from memory) moves that exponent by about 3e-5 relative: 1.5e-4 of
        // the leakage, 9 µV of the boiler's 90 mV at the hot end. There: 0.05 LSB.
        var diodes = design.Netlist!.Parsed.Elements.Any(e => e.Kind == 'D');
        for (var i = 0; i < ours.Points.Count; i++)
        {
            var (a, b) = (ours.Points[i], theirs.Points[i]);
            Tolerance.AssertClose(b.StaticPinVolts, a.StaticPinVolts, 0, diodes ? 0.05 * lsb : 1e-6, $"{example}: static pin at {a.Celsius} °C");
            Tolerance.AssertClose(b.SampleVolts / lsb, a.SampleVolts / lsb, 0, diodes ? 0.05 : 0.01, $"{example}: sample (LSB) at {a.Celsius} °C");
        }
    }
}
