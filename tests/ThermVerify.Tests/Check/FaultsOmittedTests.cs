using ThermVerify.Api;
using ThermVerify.Check;
using ThermVerify.Design;
using ThermVerify.Reporting.Text;

namespace ThermVerify.Tests.Check;

/// <summary>A check never leaves the fault thresholds out without saying why.</summary>
public class FaultsOmittedTests
{
    [Fact]
    public void A_design_without_fault_thresholds_says_why()
    {
        // A 0.5 Ω upper resistor over a Pt1000 puts every healthy code within a code of the rail an open sensor reads
        // (2^12·R_s/(R_s + 0.5 Ω)): no threshold with margin fits between them, and the check says so.
        var oven = DesignLoader.Load(Path.Combine(Repository.Netlists, "oven-pt1000.toml"));
        var design = oven with { Divider = oven.Divider! with { FixedResistorOhms = 0.5 } };
        var result = FrontEndCheck.Run(design, new CheckOptions { ComputeRemedies = false });
        var reason = result.FaultsOmitted!;
        Assert.Null(result.Faults);
        Assert.Contains("too close to the fault codes", reason);
        Assert.Contains("Fault thresholds: " + reason, CheckSummaryText.Render(result, RunStamp.Check(design)));
    }

    [Theory]
    [InlineData("oven-pt1000.toml")]
    [InlineData("mash-tun-pt100-current.toml")]
    [InlineData("attic-fan-leaky-pin-netlist.toml")]
    [InlineData("fermenter-pt1000-bridge.toml")]
    [InlineData("brine-chiller-bridge-differential.toml")]
    [InlineData("autoclave-pt100-bridge-inamp.toml")]
    [InlineData("kiln-bank-pt100-deltasigma.toml")]
    [InlineData("stability-chamber-pt100-pga.toml")]
    public void A_divider_current_source_netlist_or_bridge_design_has_its_thresholds_and_no_reason(string example)
    {
        var design = DesignLoader.Load(Path.Combine(Repository.Netlists, example));
        var result = FrontEndCheck.Run(design, new CheckOptions { ComputeRemedies = false });
        Assert.NotNull(result.Faults);
        Assert.Null(result.FaultsOmitted);
        Assert.Contains($"a code below {result.Faults.FaultBelowCode} or above {result.Faults.FaultAboveCode} is a fault", CheckSummaryText.Render(result, RunStamp.Check(design)));
    }
}
