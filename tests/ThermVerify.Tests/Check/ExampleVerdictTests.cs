using System.Collections.Concurrent;
using ThermVerify.Check;
using ThermVerify.Design;

namespace ThermVerify.Tests.Check;

/// <summary>
/// Each bundled example exists to show one verdict; if a change to the engine or the rules moves it, the example
/// (and the README's table of examples) must be looked at again.
/// </summary>
public class ExampleVerdictTests
{
    private static string Example(string name) =>
        Path.Combine(AppContext.BaseDirectory, "..", "..", "..", "..", "..", "netlists", name);

    private static readonly ConcurrentDictionary<string, Lazy<CheckResult>> Results = new();

    /// <summary>The example's check as `check --no-remedies` runs it, made once for this class and the README's table.</summary>
    internal static CheckResult Checked(string example) =>
        Results.GetOrAdd(example, e => new Lazy<CheckResult>(() => FrontEndCheck.Run(DesignLoader.Load(Example(e)), new CheckOptions { ComputeRemedies = false }))).Value;

    [Theory]
    [InlineData("buffered-cable-probe.toml", true, null)]
    [InlineData("oven-pt1000.toml", true, null)]
    [InlineData("mash-tun-pt100-current.toml", true, null)]
    [InlineData("greenhouse-pt1000-4wire.toml", true, null)]
    [InlineData("fermenter-pt1000-bridge.toml", true, null)]
    [InlineData("cheese-vat-pt1000-bridge-3wire.toml", true, null)]
    [InlineData("brine-chiller-bridge-differential.toml", true, null)]
    [InlineData("brine-chiller-bridge-netlist.toml", true, null)]
    [InlineData("autoclave-pt100-bridge-inamp.toml", true, null)]
    [InlineData("table-sensor-freezer.toml", true, null)]
    [InlineData("cold-storage-logger-buffered.toml", true, null)]
    [InlineData("soil-probe-switched.toml", true, null)]
    [InlineData("soil-probe-switched-netlist.toml", true, null)]
    [InlineData("dosing-pump-ntc-rc.toml", true, null)]
    [InlineData("attic-fan-leaky-pin.toml", false, "dc-loading")]
    [InlineData("attic-fan-leaky-pin-netlist.toml", false, "dc-loading")]
    [InlineData("kiln-vent-two-stage.toml", true, null)]
    [InlineData("seed-tray-multiplexed.toml", true, null)]
    [InlineData("boiler-flue-protected.toml", false, "dc-loading")]
    [InlineData("collector-pump-clamped.toml", false, "dc-loading")]
    [InlineData("cold-storage-logger.toml", false, "settling")]
    [InlineData("cold-storage-logger-reservoir.toml", false, "reservoir-recovery")]
    [InlineData("cold-storage-logger-bare-opamp.toml", false, "buffer-stability")]
    [InlineData("kiln-bank-pt100-deltasigma.toml", false, "channel-switch")]
    [InlineData("stability-chamber-pt100-pga.toml", true, null)]
    public void Example_shows_its_verdict(string example, bool passes, string? failingFinding)
    {
        var result = Checked(example);
        Assert.Equal(passes, result.Passed);
        if (failingFinding is not null)
            Assert.Contains(result.Findings, f => f.Id == failingFinding && f.Severity == Severity.Fail);
    }

    [Fact]
    public void Every_example_has_a_stated_verdict()
    {
        var stated = typeof(ExampleVerdictTests).GetMethod(nameof(Example_shows_its_verdict))!
            .GetCustomAttributes(typeof(InlineDataAttribute), false).Cast<InlineDataAttribute>()
            .Select(a => (string)a.GetData(null!).First()[0]).ToHashSet();
        var present = Directory.GetFiles(Path.GetDirectoryName(Example("x"))!, "*.toml").Select(Path.GetFileName).ToHashSet();
        Assert.Equal(present.Order(), stated.Order());
    }
}
