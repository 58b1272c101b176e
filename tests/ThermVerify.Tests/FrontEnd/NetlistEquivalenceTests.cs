using ThermVerify.Check;
using ThermVerify.Design;

namespace ThermVerify.Tests.FrontEnd;

/// <summary>
/// A built-in-shape example re-drawn as a netlist gives the same check: attic-fan-leaky-pin.toml (divider, reservoir,
/// leaky pin) against attic-fan-leaky-pin-netlist.toml with the same parts in attic-fan-leaky-pin.cir. The netlist's
/// closed form comes from its own ideal solves (NetlistTransfer), the built-in one from the divider formula, so this is
/// the two routes through the same check agreeing (issue acceptance: 1 µV and 0.01 LSB).
/// </summary>
public class NetlistEquivalenceTests
{
    private const double Microvolt = 1e-6;

    /// <summary>
    /// The attic fan (a leaky pin behind a high-impedance divider), and the soil probe whose divider the firmware
    /// switches on only to measure: the built-in shape's GPIO switch against the netlist's PULSE source with
    /// switch_on_lead, each first sample taken after the switch-on.
    /// </summary>
    [Theory]
    [InlineData("attic-fan-leaky-pin.toml", "attic-fan-leaky-pin-netlist.toml", false)]
    [InlineData("soil-probe-switched.toml", "soil-probe-switched-netlist.toml", true)]
    public void A_built_in_example_as_a_netlist_gives_the_same_figures_and_verdict(string shapeFile, string netlistFile, bool passes)
    {
        var options = new CheckOptions { ComputeRemedies = false };
        var shape = FrontEndCheck.Run(DesignLoader.Load(Path.Combine(Repository.Netlists, shapeFile)), options);
        var netlist = FrontEndCheck.Run(DesignLoader.Load(Path.Combine(Repository.Netlists, netlistFile)), options);
        Assert.Equal(shape.Passed, netlist.Passed);
        Assert.Equal(passes, netlist.Passed);
        Assert.Equal(shape.Findings.Select(f => (f.Id, f.Severity)), netlist.Findings.Select(f => (f.Id, f.Severity)));
        var lsb = shape.Adc.LsbVolts;
        Assert.Equal(shape.Points.Count, netlist.Points.Count);
        for (var i = 0; i < shape.Points.Count; i++)
        {
            var (a, b) = (shape.Points[i], netlist.Points[i]);
            var at = $"at {a.Celsius} °C";
            foreach (var (what, x, y) in new[]
                     {
                         ("ideal", a.IdealVolts, b.IdealVolts), ("static pin", a.StaticPinVolts, b.StaticPinVolts),
                         ("first sample", a.FirstSampleVolts, b.FirstSampleVolts), ("steady sample", a.SteadySampleVolts, b.SteadySampleVolts),
                         ("sample", a.SampleVolts, b.SampleVolts), ("sensor voltage", a.DividerVolts, b.DividerVolts),
                     })
            {
                Tolerance.AssertClose(x, y, 0, Microvolt, $"{what} {at}");
                Tolerance.AssertClose(x / lsb, y / lsb, 0, 0.01, $"{what} in LSB {at}");
            }
            Assert.Equal(a.Code, b.Code);
            Tolerance.AssertClose(a.ErrorKelvin, b.ErrorKelvin, 0, 1e-6, $"error {at}");
            Tolerance.AssertClose(a.Contributions.DcLoadingKelvin, b.Contributions.DcLoadingKelvin, 0, 1e-6, $"DC loading {at}");
            Tolerance.AssertClose(a.Estimates.SourceOhms, b.Estimates.SourceOhms, 1e-9, 0, $"Thevenin {at}");
            if (a.Noise is { } n && b.Noise is { } m)
                Tolerance.AssertClose(n.SingleRmsVolts, m.SingleRmsVolts, 1e-6, 0, $"noise {at}");
        }
    }
}
