using ThermVerify.Cli;

namespace ThermVerify.Tests.Cli;

/// <summary>The command line with a delta-sigma design: check, worstcase and montecarlo run it; the analyses that do not model it refuse it with exit code 2.</summary>
public class DeltaSigmaCommandTests
{
    private static string Example(string name) =>
        Path.Combine(AppContext.BaseDirectory, "..", "..", "..", "..", "..", "netlists", name);

    [Fact]
    public void Table_deck_and_choose_fixed_take_a_delta_sigma_design()
    {
        // They refused it before (exit code 2): the table inverts the converter's static transfer, the deck writes the
        // channel-switch transient, choose-fixed checks each candidate with the delta-sigma check.
        var table = CliRunner.Run("table", Example("kiln-bank-pt100-deltasigma.toml"), "--bound", "0.01 K");
        Assert.Equal(ExitCodes.Success, table.ExitCode);
        Assert.Contains("fault thresholds: code <", table.Output);
        var deck = CliRunner.Run("deck", Example("kiln-bank-pt100-deltasigma.toml"), "--analysis", "tran", "--conversions", "2");
        Assert.Equal(ExitCodes.Success, deck.ExitCode);
        Assert.Contains(".meas tran last_sample_2 find v(ds_in)", deck.Output);
        // A buffered input's deck is the circuit of the check's single pole: the input current stepped on at the switch.
        var buffered = CliRunner.Run("deck", Example("stability-chamber-pt100-pga.toml"), "--analysis", "tran", "--conversions", "1");
        Assert.Equal(ExitCodes.Success, buffered.ExitCode);
        Assert.Contains("Ids_in pin 0 PULSE(", buffered.Output);
    }

    [Theory]
    [InlineData("worstcase")]
    [InlineData("montecarlo", "-n", "20", "--seed", "3")]
    public void Worstcase_and_montecarlo_run_a_delta_sigma_design_and_say_its_units_are_static_readings(string command, params string[] more)
    {
        // They refused it before (exit code 2); now the units go through the tolerance machinery, read statically, and
        // the terminal, the report page and the run's settings say so.
        var folder = Directory.CreateTempSubdirectory("tv-ds-tol-").FullName;
        try
        {
            var run = CliRunner.Run([command, Example("kiln-bank-pt100-deltasigma.toml"), .. more, "--report", Path.Combine(folder, "report")]);
            Assert.True(run.ExitCode is ExitCodes.Success or ExitCodes.CheckFailed, run.Error);
            Assert.Contains("delta-sigma: each unit is read through the converter's static transfer", run.Output);
            // worstcase reads its corners statically; montecarlo simulates each unit's channel switch as well.
            Assert.Contains(command == "worstcase" ? "unit-settling static" : "unit-settling channel-switch", run.Output);
            if (command == "montecarlo") Assert.Contains("its first reading used after a channel switch is simulated with its own parts", run.Output);
            Assert.DoesNotContain("refused rather than treated as the other kind", run.Error);
            Assert.Contains("Delta-sigma: each unit is read through the converter's static transfer", File.ReadAllText(Path.Combine(folder, "report", "report.md")));
        }
        finally
        {
            Directory.Delete(folder, recursive: true);
        }
    }

    [Fact]
    public void Check_fails_the_kiln_example_on_its_channel_switch()
    {
        var run = CliRunner.Run("check", Example("kiln-bank-pt100-deltasigma.toml"), "--no-remedies");
        Assert.Equal(ExitCodes.CheckFailed, run.ExitCode);
        Assert.Contains("FAIL channel-switch", run.Output);
        Assert.Contains("readings_discarded = ", run.Output);
    }

    [Fact]
    public void Check_writes_its_report_and_json_and_baseline_takes_it()
    {
        var folder = Directory.CreateTempSubdirectory("tv-ds-").FullName;
        try
        {
            var run = CliRunner.Run("check", Example("kiln-bank-pt100-deltasigma.toml"), "--no-remedies", "--report", Path.Combine(folder, "report"),
                "--json", Path.Combine(folder, "check.json"));
            Assert.Equal(ExitCodes.CheckFailed, run.ExitCode);
            var html = File.ReadAllText(Path.Combine(folder, "report", "report.html"));
            Assert.Contains("Readings after a channel switch", html);
            // The sampling figure shows the channel switch (no acquisition window to draw): the pin's samples and the readings.
            Assert.Contains("samples of the pin", html);
            Assert.Contains("filter readings", File.ReadAllText(Path.Combine(folder, "report", "plots", "sampling.svg")));
            Assert.Contains("\"pinSamples\"", File.ReadAllText(Path.Combine(folder, "check.json")));
            Assert.Contains("\"deltaSigma\"", File.ReadAllText(Path.Combine(folder, "check.json")));
            var baseline = CliRunner.Run("baseline", Example("kiln-bank-pt100-deltasigma.toml"), "--out", Path.Combine(folder, "baseline.json"));
            Assert.Equal(ExitCodes.Success, baseline.ExitCode);
        }
        finally
        {
            Directory.Delete(folder, recursive: true);
        }
    }
}
