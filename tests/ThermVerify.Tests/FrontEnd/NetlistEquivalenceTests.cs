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
    /// switch_on_lead, each first sample taken after the switch-on; and the brine chiller's bridge read by a differential
    /// converter, the netlist naming its second output as negative_pin.
    /// </summary>
    [Theory]
    [InlineData("attic-fan-leaky-pin.toml", "attic-fan-leaky-pin-netlist.toml", false)]
    [InlineData("soil-probe-switched.toml", "soil-probe-switched-netlist.toml", true)]
    [InlineData("brine-chiller-bridge-differential.toml", "brine-chiller-bridge-netlist.toml", true)]
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

    /// <summary>
    /// The common-mode finding on a netlist read differentially: the brine chiller's inputs sit near 0.3 V, below a
    /// range that starts at 0.5 V, and the netlist and the built-in bridge report the same finding, the closed form
    /// beside it half the sum of the two pins in the netlist's ideal transfer.
    /// </summary>
    [Fact]
    public void The_common_mode_finding_is_the_bridge_s_on_a_differential_netlist()
    {
        var folder = Directory.CreateTempSubdirectory("tv-netlist-common-mode-");
        try
        {
            Finding Run(string file)
            {
                foreach (var name in new[] { file, "brine-chiller-bridge.cir" })
                    File.WriteAllText(Path.Combine(folder.FullName, name),
                        File.ReadAllText(Path.Combine(Repository.Netlists, name)).Replace("common_mode_range = \"0.1 V .. 3.2 V\"", "common_mode_range = \"0.5 V .. 3.2 V\""));
                var result = FrontEndCheck.Run(DesignLoader.Load(Path.Combine(folder.FullName, file)), new CheckOptions { ComputeRemedies = false });
                return Assert.Single(result.Findings, f => f.Id == CommonModeRule.Id);
            }
            var (shape, netlist) = (Run("brine-chiller-bridge-differential.toml"), Run("brine-chiller-bridge-netlist.toml"));
            Assert.Equal((Severity.Fail, shape.WorstCelsius), (netlist.Severity, netlist.WorstCelsius));
            Tolerance.AssertClose(shape.SimulatedVolts!.Value, netlist.SimulatedVolts!.Value, 0, Microvolt, "simulated common mode");
            Tolerance.AssertClose(shape.EstimateVolts!.Value, netlist.EstimateVolts!.Value, 0, Microvolt, "closed-form common mode");
            Tolerance.AssertClose(shape.SizeVolts, netlist.SizeVolts, 0, Microvolt, "below the range");
        }
        finally
        {
            folder.Delete(recursive: true);
        }
    }
}
