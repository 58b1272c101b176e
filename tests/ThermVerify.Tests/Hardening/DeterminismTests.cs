using ThermVerify.Check;
using ThermVerify.Design;
using ThermVerify.Reporting;

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
        string Run(int threads) => CheckJson.Write(FrontEndCheck.Run(design, new CheckOptions { Threads = threads, ComputeRemedies = false }), TestRun.Provenance);
        var one = Run(1);
        Assert.Equal(one, Run(2));
        Assert.Equal(one, Run(8));
    }
}

public class DesignPathTests
{
    [Fact]
    public void A_link_that_leads_outside_the_design_folder_is_refused()
    {
        var outside = Directory.CreateTempSubdirectory("tv-outside-");
        var inside = Directory.CreateTempSubdirectory("tv-inside-");
        try
        {
            File.WriteAllText(Path.Combine(outside.FullName, "rt.csv"), "celsius,ohms\n-50,300000\n0,30000\n50,4000\n130,300\n");
            File.CreateSymbolicLink(Path.Combine(inside.FullName, "rt.csv"), Path.Combine(outside.FullName, "rt.csv"));
            var text = "name = \"x\"\n[sensor]\nmodel = \"table\"\nfile = \"rt.csv\"\n[divider]\nsensor_side = \"low\"\nfixed_resistor = \"10k\"\n" +
                       "excitation = \"3.3 V\"\n[adc]\nbits = 12\nreference = \"ratiometric\"\nsample_rate = \"1 kHz\"\nacquisition_time = \"1 us\"\n" +
                       "sampling_capacitance = \"5 pF\"\nswitch_resistance = \"1 kohm\"\n[check]\nrange = \"0 degC .. 50 degC\"\nbudget = \"1 K\"\n";
            var e = Assert.Throws<DesignException>(() => DesignLoader.Parse(text, "x.toml", inside.FullName));
            Assert.Contains("leads outside", e.Problem);
            Assert.Equal(4, e.Line);
        }
        finally
        {
            outside.Delete(recursive: true);
            inside.Delete(recursive: true);
        }
    }
}
