using ThermVerify.Api;
using ThermVerify.Check;
using ThermVerify.Design;
using ThermVerify.Reporting.Text;

namespace ThermVerify.Tests.Check;

/// <summary>A check never leaves the fault thresholds out without saying why.</summary>
public class FaultsOmittedTests
{
    [Theory]
    [InlineData("mash-tun-pt100-current.toml", "not computed yet for a current-excited sensor")]
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
    [InlineData("attic-fan-leaky-pin-netlist.toml")]
    public void A_divider_or_netlist_design_has_its_thresholds_and_no_reason(string example)
    {
        var design = DesignLoader.Load(Path.Combine(Repository.Netlists, example));
        var result = FrontEndCheck.Run(design, new CheckOptions { ComputeRemedies = false });
        Assert.NotNull(result.Faults);
        Assert.Null(result.FaultsOmitted);
    }
}
