using System.Text.Json;
using ThermVerify.Check;
using ThermVerify.Tests.Cli;

namespace ThermVerify.Tests.Check.Buffer;

public class BufferOutputTests
{
    private static string Example(string name) =>
        Path.Combine(AppContext.BaseDirectory, "..", "..", "..", "..", "..", "netlists", name);

    [Fact]
    public void Check_json_carries_the_buffer_object_and_the_stability_failure_with_its_remedy()
    {
        var json = Path.Combine(Path.GetTempPath(), $"tv-{Guid.NewGuid():N}.json");
        var run = CliRunner.Run("check", Example("cold-storage-logger-bare-opamp.toml"), "--json", json);
        Assert.Equal(1, run.ExitCode);
        Assert.Contains("Buffer stability:", run.Output);
        using var doc = JsonDocument.Parse(File.ReadAllText(json));
        var stability = doc.RootElement.GetProperty("buffer").GetProperty("stability");
        Assert.False(stability.GetProperty("passed").GetBoolean());
        var finding = doc.RootElement.GetProperty("findings").EnumerateArray().Single(f => f.GetProperty("id").GetString() == "buffer-stability");
        Assert.Equal("fail", finding.GetProperty("severity").GetString());
        Assert.Equal(JsonValueKind.Null, finding.GetProperty("sizeVolts").ValueKind);

        // Single-pole textbook estimate (from memory): follower, GBW 2 MHz, r_o 50 Ω, R_iso into 100 nF + 5 pF pin + 8 pF
        // sampling; PM = 90° − atan(f_c/f_p) + atan(f_c/f_z), f_p = 1/(2π(r_o + R_iso)C), f_z = 1/(2π R_iso C).
        const double gbw = 2e6, ro = 50, c = 100e-9 + 13e-12;
        double Margin(double riso)
        {
            double fp = 1 / (2 * Math.PI * (ro + riso) * c), fz = 1 / (2 * Math.PI * riso * c);
            double lo = 1, hi = 1e9;
            for (var i = 0; i < 200; i++)
            {
                var f = Math.Sqrt(lo * hi);
                if (gbw / f * Math.Sqrt((1 + f * f / (fz * fz)) / (1 + f * f / (fp * fp))) >= 1) lo = f; else hi = f;
            }
            var fc = Math.Sqrt(lo * hi);
            return 90 - (Math.Atan(fc / fp) - Math.Atan(fc / fz)) * 180 / Math.PI;
        }
        double a = 1e-3, b = 1e4;
        for (var i = 0; i < 200; i++)
        {
            var m = Math.Sqrt(a * b);
            if (Margin(m) >= 60) b = m; else a = m;
        }
        Tolerance.AssertClose(b, stability.GetProperty("isolationForTargetOhms").GetDouble(), 0.01, 0, "isolation resistor for 60° (Ω)");
        File.Delete(json);
    }

    [Fact]
    public void Html_and_markdown_reports_carry_the_buffer_sections_and_an_unbuffered_design_has_none()
    {
        var buffered = ThermVerify.Check.FrontEndCheck.Run(BufferDesigns.Follower(("filter.reservoir_capacitor", "\"10 nF\""), ("buffer.isolation_resistor", "\"47 ohm\"")),
            new ThermVerify.Check.CheckOptions { ComputeRemedies = false, MaximumSamplingPoints = 3 });
        var report = new ThermVerify.Reporting.CheckReport(buffered, "test.toml", "", [], null, ThermVerify.Api.RunStamp.Check(buffered.Design));
        var html = ThermVerify.Reporting.CheckHtml.Render(report);
        var md = ThermVerify.Reporting.CheckMarkdown.Render(report);
        foreach (var id in new[] { "buffer-stability", "buffer-headroom", "buffer-static", "buffer-recovery", "buffer-noise" })
            Assert.Contains($"<section id=\"{id}\">", html);
        Assert.Contains("## Buffer stability", md);
        Assert.Contains("## Noise at the ADC", md);

        var plain = ThermVerify.Check.FrontEndCheck.Run(Check.TestDesign.Make(), new ThermVerify.Check.CheckOptions { ComputeRemedies = false, MaximumSamplingPoints = 3 });
        Assert.Null(plain.Buffer);
        Assert.DoesNotContain("buffer-stability", ThermVerify.Reporting.CheckHtml.Render(new ThermVerify.Reporting.CheckReport(plain, "t.toml", "", [], null, ThermVerify.Api.RunStamp.Check(plain.Design))));
        Assert.Contains("\"buffer\": null", ThermVerify.Reporting.CheckJson.Write(plain, ThermVerify.Api.RunStamp.Check(plain.Design)));
    }

    [Fact]
    public void Compare_puts_an_unbuffered_and_a_buffered_design_side_by_side()
    {
        var run = CliRunner.Run("compare", Example("cold-storage-logger.toml"), Example("cold-storage-logger-buffered.toml"), "--no-remedies");
        Assert.Equal(1, run.ExitCode); // the unbuffered design fails
        Assert.Contains("A = cold-storage logger, unbuffered, B = cold-storage logger, buffered", run.Output);
        Assert.Contains("  A  FAIL", run.Output);
        Assert.Contains("  B  PASS", run.Output);
        var margin = run.Output.Split('\n').Single(l => l.StartsWith("phase margin", StringComparison.Ordinal));
        Assert.Contains("no buffer", margin);
    }
}
