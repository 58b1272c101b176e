using ThermVerify.Api;
using ThermVerify.Check;
using ThermVerify.Design;
using ThermVerify.Reporting.Text;

namespace ThermVerify.Tests.Check;

/// <summary>A check never leaves the fault thresholds out without saying why.</summary>
public class FaultsOmittedTests
{
    [Theory]
    [InlineData("autoclave-pt100-bridge-inamp.toml", "not computed yet for a bridge behind an amplifier")]
    public void A_design_without_fault_thresholds_says_why(string example, string reason)
    {
        var design = DesignLoader.Load(Path.Combine(Repository.Netlists, example));
        var result = FrontEndCheck.Run(design, new CheckOptions { ComputeRemedies = false });
        Assert.Null(result.Faults);
        Assert.Equal(reason, result.FaultsOmitted);
        Assert.Contains("Fault thresholds: " + reason, CheckSummaryText.Render(result, RunStamp.Check(design)));
    }

    [Theory]
    [InlineData("oven-pt1000.toml")]
    [InlineData("mash-tun-pt100-current.toml")]
    [InlineData("attic-fan-leaky-pin-netlist.toml")]
    [InlineData("fermenter-pt1000-bridge.toml")]
    [InlineData("brine-chiller-bridge-differential.toml")]
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
