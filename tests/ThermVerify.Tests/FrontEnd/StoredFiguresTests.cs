using System.Globalization;
using ThermVerify.Tests.Check;

namespace ThermVerify.Tests.FrontEnd;

/// <summary>
/// Every bundled example's simulated figures against the figures stored before the engine's speed-ups (exact sampling
/// where the circuit allows it, time stepping at relative tolerance 1e-8 elsewhere): the DC pin voltage, the first,
/// steady and converted sample at every check point, each within 0.01 LSB of the stored value. A change of method or
/// tolerance may move the figures by rounding and integration error, not by anything a reading could see.
/// THERMVERIFY_REWRITE_FIGURES=1 writes the files anew (and fails, so that a rewrite is never silent); do that only
/// for a change meant to move the figures, and say why in the commit.
/// </summary>
public class StoredFiguresTests
{
    private const double AllowedLsb = 0.01;

    public static TheoryData<string> Examples => [.. Directory.GetFiles(Repository.Netlists, "*.toml").Select(f => Path.GetFileName(f)).Order()];

    [Theory]
    [MemberData(nameof(Examples))]
    public void Figures_stay_within_a_hundredth_of_an_lsb_of_the_stored_ones(string example)
    {
        var result = ExampleVerdictTests.Checked(example);
        var lines = result.Points.Select(p => string.Join(",",
            new[] { p.Celsius, p.DcPinVolts, p.FirstSampleVolts, p.SteadySampleVolts, p.SampleVolts }.Select(v => v.ToString("R", CultureInfo.InvariantCulture))));
        var text = "celsius,dc_pin_volts,first_sample_volts,steady_sample_volts,sample_volts\n" + string.Join("\n", lines) + "\n";
        var path = Path.Combine(Repository.Root, "tests", "ThermVerify.Tests", "FrontEnd", "ExampleFigures", Path.ChangeExtension(example, ".csv"));
        if (Environment.GetEnvironmentVariable("THERMVERIFY_REWRITE_FIGURES") == "1" || !File.Exists(path))
        {
            File.WriteAllText(path, text);
            Assert.Fail($"{path} written; run the test again");
        }

        var stored = File.ReadAllLines(path).Skip(1).Select(l => l.Split(',').Select(f => double.Parse(f, CultureInfo.InvariantCulture)).ToArray()).ToArray();
        Assert.Equal(stored.Length, result.Points.Count);
        var lsb = result.Adc.LsbVolts;
        var worst = 0.0;
        for (var i = 0; i < stored.Length; i++)
        {
            var p = result.Points[i];
            Assert.Equal(stored[i][0], p.Celsius);
            double[] now = [p.DcPinVolts, p.FirstSampleVolts, p.SteadySampleVolts, p.SampleVolts];
            for (var j = 0; j < now.Length; j++)
            {
                worst = Math.Max(worst, Math.Abs(now[j] - stored[i][j + 1]) / lsb);
                Tolerance.AssertClose(stored[i][j + 1], now[j], 0, AllowedLsb * lsb, $"{example} at {p.Celsius} °C, column {j + 2}");
            }
        }
        Console.WriteLine($"{example}: largest move {worst:G3} LSB");
    }
}
