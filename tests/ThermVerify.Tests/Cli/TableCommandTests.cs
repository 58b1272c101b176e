using ThermVerify.Cli;

namespace ThermVerify.Tests.Cli;

public sealed class TableCommandTests : IDisposable
{
    private readonly string _folder = Directory.CreateTempSubdirectory("tv-table-").FullName;

    private static string Example(string name) =>
        Path.Combine(AppContext.BaseDirectory, "..", "..", "..", "..", "..", "netlists", name);

    [Fact]
    public void Table_made_from_a_design_verifies_against_it()
    {
        var csv = Path.Combine(_folder, "probe.csv");
        var header = Path.Combine(_folder, "probe.h");
        var made = CliRunner.Run("table", Example("buffered-cable-probe.toml"), "--csv", csv, "--header", header, "--bound", "0.05 K");
        Assert.Equal(ExitCodes.Success, made.ExitCode);
        Assert.Contains("#define BUFFERED_CABLE_PROBE_FAULT_BELOW_CODE", File.ReadAllText(header));

        var verified = CliRunner.Run("verify-table", Example("buffered-cable-probe.toml"), csv);
        Assert.Equal(ExitCodes.Success, verified.ExitCode);
        Assert.StartsWith("PASS", verified.Output);
    }

    [Fact]
    public void Table_for_the_sensor_on_the_other_side_is_caught_and_named()
    {
        // The same divider with the sensor moved to the low side: every code maps to another temperature.
        var design = File.ReadAllText(Example("buffered-cable-probe.toml")).Replace("sensor_side = \"high\"", "sensor_side = \"low\"");
        var swapped = Path.Combine(_folder, "swapped.toml");
        File.WriteAllText(swapped, design);
        var csv = Path.Combine(_folder, "swapped.csv");
        Assert.Equal(ExitCodes.Success, CliRunner.Run("table", swapped, "--csv", csv).ExitCode);

        var verified = CliRunner.Run("verify-table", Example("buffered-cable-probe.toml"), csv);
        Assert.Equal(ExitCodes.CheckFailed, verified.ExitCode);
        Assert.Contains("matches the sensor on the low side", verified.Output);
    }

    [Fact]
    public void Existing_output_is_not_replaced_without_force()
    {
        var csv = Path.Combine(_folder, "kept.csv");
        File.WriteAllText(csv, "keep me");
        var run = CliRunner.Run("table", Example("buffered-cable-probe.toml"), "--csv", csv);
        Assert.Equal(ExitCodes.BadInput, run.ExitCode);
        Assert.Equal("keep me", File.ReadAllText(csv));
    }

    public void Dispose() => Directory.Delete(_folder, recursive: true);
}

public class CheckFaultThresholdTests
{
    [Fact]
    public void Check_reports_fault_thresholds_in_text_and_json()
    {
        var json = Path.Combine(Path.GetTempPath(), $"tv-{Guid.NewGuid():N}.json");
        try
        {
            var example = Path.Combine(AppContext.BaseDirectory, "..", "..", "..", "..", "..", "netlists", "oven-pt1000.toml");
            var run = CliRunner.Run("check", example, "--json", json, "--no-remedies");
            Assert.Equal(ExitCodes.Success, run.ExitCode);
            Assert.Contains("Fault thresholds", run.Output);
            using var document = System.Text.Json.JsonDocument.Parse(File.ReadAllText(json));
            var faults = document.RootElement.GetProperty("faultThresholds");
            // Ohm's law: an open sensor on the low side pulls the pin to the excitation, i.e. full scale for a ratiometric ADC.
            var open = faults.GetProperty("faults").EnumerateArray().Single(f => f.GetProperty("kind").GetString() == "sensor open");
            Assert.Equal(4095, open.GetProperty("minCode").GetInt32());
            Assert.True(faults.GetProperty("faultAboveCode").GetInt32() > faults.GetProperty("highestValidCode").GetInt32());
        }
        finally
        {
            File.Delete(json);
        }
    }
}

public class CheckOutputProtectionTests
{
    [Fact]
    public void Check_refuses_to_replace_a_json_file_without_force_and_leaves_it_untouched()
    {
        var json = Path.Combine(Path.GetTempPath(), $"tv-{Guid.NewGuid():N}.json");
        File.WriteAllText(json, "keep me");
        try
        {
            var example = Path.Combine(AppContext.BaseDirectory, "..", "..", "..", "..", "..", "netlists", "oven-pt1000.toml");
            var refused = CliRunner.Run("check", example, "--json", json, "--no-remedies");
            Assert.Equal(ExitCodes.BadInput, refused.ExitCode);
            Assert.Equal("keep me", File.ReadAllText(json));
            Assert.Equal(ExitCodes.Success, CliRunner.Run("check", example, "--json", json, "--no-remedies", "--force").ExitCode);
            Assert.StartsWith("{", File.ReadAllText(json));
        }
        finally
        {
            File.Delete(json);
        }
    }
}
