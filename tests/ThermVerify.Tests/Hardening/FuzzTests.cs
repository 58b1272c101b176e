using System.Diagnostics;
using ThermVerify.Design;
using ThermVerify.Firmware;
using ThermVerify.Quantities;
using ThermVerify.Sensors;
using Xunit.Abstractions;

namespace ThermVerify.Tests.Hardening;

/// <summary>
/// Every input ends in success or a documented error with a position, within a time bound, never an unhandled
/// exception. The time bound is a hang guard (a generous wall-clock limit per input), not a performance figure.
/// </summary>
public sealed class FuzzTests(ITestOutputHelper log)
{
    private static readonly TimeSpan HangGuard = TimeSpan.FromSeconds(10);

    private static string Netlists => Path.Combine(AppContext.BaseDirectory, "..", "..", "..", "..", "..", "netlists");

    [Fact]
    public void Design_loader_survives_mutations_of_every_example()
    {
        var folder = Directory.CreateTempSubdirectory("tv-fuzz-");
        try
        {
            File.Copy(Path.Combine(Netlists, "table-47k-rt.csv"), Path.Combine(folder.FullName, "table-47k-rt.csv"));
            var tried = 0;
            var accepted = 0;
            foreach (var example in Directory.GetFiles(Netlists, "*.toml").Order())
                foreach (var bytes in InputFuzzer.Mutations(File.ReadAllBytes(example), count: 250, randomSeed: Path.GetFileName(example).Length))
                {
                    var path = Path.Combine(folder.FullName, "fuzzed.toml");
                    File.WriteAllBytes(path, bytes);
                    tried++;
                    if (Guarded(() => Outcome(() => DesignLoader.Load(path).Sensor.Build()), bytes)) accepted++;
                }
            log.WriteLine($"design loader: {tried} inputs tried, {accepted} loaded, the rest refused with a positioned DesignException");
            Assert.True(tried > 1500, $"only {tried} inputs");
        }
        finally
        {
            folder.Delete(recursive: true);
        }
    }

    [Fact]
    public void Quantity_parser_accepts_or_refuses_with_a_quoted_message()
    {
        var tried = 0;
        foreach (var text in InputFuzzer.RandomStrings(20_000, randomSeed: 7))
        {
            tried++;
            try
            {
                var q = QuantityParser.Parse(text);
                Assert.True(double.IsFinite(q.Value), $"\"{text}\" parsed to a non-finite value");
            }
            catch (QuantityFormatException e)
            {
                Assert.Contains($"\"{text}\"", e.Message);
            }
            try
            {
                QuantityParser.ParseRange(text);
            }
            catch (QuantityFormatException)
            {
            }
        }
        log.WriteLine($"quantity parser: {tried} inputs tried");
    }

    [Fact]
    public void Table_readers_survive_mutations()
    {
        var rt = File.ReadAllBytes(Path.Combine(Netlists, "table-47k-rt.csv"));
        var firmware = System.Text.Encoding.UTF8.GetBytes("code,temperature_celsius\n100,-20.5\n200,0.25\n300,25\n400,60.1\n");
        var tried = 0;
        foreach (var bytes in InputFuzzer.Mutations(rt, 1000, randomSeed: 11))
        {
            tried++;
            Guarded(() =>
            {
                try { TableThermistor.Parse(System.Text.Encoding.UTF8.GetString(bytes), "rt.csv"); return true; }
                catch (SensorTableException e) { Assert.True(e.Line >= 0); return false; }
            }, bytes);
        }
        foreach (var bytes in InputFuzzer.Mutations(firmware, 1000, randomSeed: 13))
        {
            tried++;
            Guarded(() =>
            {
                try { TableCsvReader.Parse(System.Text.Encoding.UTF8.GetString(bytes), "table.csv"); return true; }
                catch (TableFormatException e) { Assert.True(e.Line >= 0); return false; }
            }, bytes);
        }
        log.WriteLine($"table readers: {tried} inputs tried");
    }

    /// <summary>True when the design loaded; a refusal must be a DesignException with a position.</summary>
    private static bool Outcome(Func<object> load)
    {
        try
        {
            load();
            return true;
        }
        catch (DesignException e)
        {
            Assert.True(e.Line >= 1 && e.Column >= 1, $"no position in: {e.Message}");
            return false;
        }
    }

    private static bool Guarded(Func<bool> run, byte[] input)
    {
        var watch = Stopwatch.StartNew();
        var task = Task.Run(run);
        if (!task.Wait(HangGuard))
            Assert.Fail($"input of {input.Length} bytes did not finish within {HangGuard.TotalSeconds} s");
        _ = watch.Elapsed;
        return task.Result;
    }
}
