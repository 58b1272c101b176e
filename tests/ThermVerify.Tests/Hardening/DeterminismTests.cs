using ThermVerify.Design;
using ThermVerify.Reporting;
using ThermVerify.Verification;

namespace ThermVerify.Tests.Hardening;

public class DeterminismTests
{
    private static string Example(string name) =>
        Path.Combine(AppContext.BaseDirectory, "..", "..", "..", "..", "..", "netlists", name);

    [Theory]
    [InlineData("cold-storage-logger-reservoir.toml")]
    [InlineData("buffered-cable-probe.toml")]
    public void Check_gives_identical_results_at_1_2_and_8_threads(string example)
    {
        // Each temperature is simulated on its own, so the thread count must not change a single bit of the result.
        var design = DesignLoader.Load(Example(example));
        string Run(int threads) => CheckJson.Write(FrontEndCheck.Run(design, new CheckOptions { Threads = threads, ComputeRemedies = false }));
        var one = Run(1);
        Assert.Equal(one, Run(2));
        Assert.Equal(one, Run(8));
    }
}
