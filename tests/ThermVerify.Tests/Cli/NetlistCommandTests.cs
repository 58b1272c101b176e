using ThermVerify.Cli;

namespace ThermVerify.Tests.Cli;

/// <summary>The analyses built on the check run on a netlist design from the command line instead of refusing it.</summary>
public class NetlistCommandTests
{
    private static string Example(string name) => Path.Combine(Repository.Netlists, name);

    [Fact]
    public void Worstcase_and_montecarlo_run_on_a_netlist_and_name_its_parts()
    {
        // The attic fan fails its budget for DC loading at every corner (exit 1), as the built-in shape does.
        var worst = CliRunner.Run("worstcase", Example("attic-fan-leaky-pin-netlist.toml"));
        Assert.Equal(ExitCodes.CheckFailed, worst.ExitCode);
        Assert.Contains("netlist.part.Rfixed.tolerance", worst.Output);
        Assert.Contains("netlist.part.Rfixed.tempco", worst.Output);
        var mc = CliRunner.Run("montecarlo", Example("kiln-vent-two-stage.toml"), "-n", "50", "--threads", "2");
        Assert.Equal(ExitCodes.Success, mc.ExitCode);
        Assert.Contains("netlist.part.Rlin.tolerance", mc.Output);
    }

    [Fact]
    public void Table_runs_on_a_netlist_with_its_fault_thresholds()
    {
        var run = CliRunner.Run("table", Example("kiln-vent-two-stage.toml"), "--bound", "0.05 K");
        Assert.Equal(ExitCodes.Success, run.ExitCode);
        Assert.Contains("fault thresholds: code < 250 or code > 2889 is a fault", run.Output);
    }
}
