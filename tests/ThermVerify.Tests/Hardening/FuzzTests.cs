using System.Diagnostics;
using ThermVerify.Cli;
using ThermVerify.Design;
using ThermVerify.Firmware;
using ThermVerify.Quantities;
using ThermVerify.Sensors;
using ThermVerify.Tests.Cli;
using Xunit.Abstractions;

namespace ThermVerify.Tests.Hardening;

/// <summary>
/// Seeded fuzzing of the loader, the quantity parser, the table readers and the whole check: every input ends in a
/// result or a documented error (a design error with its position, exit codes 1 to 3), never an internal error
/// (exit code 4). No test here has a time limit: the bounds on the work and the check's own --timeout keep each
/// input short, and the long run (<see cref="LongRun"/>) is a documented command, not part of CI.
/// </summary>
public sealed class FuzzTests(ITestOutputHelper log)
{
    private static string Netlists => Path.Combine(AppContext.BaseDirectory, "..", "..", "..", "..", "..", "netlists");

    [Fact]
    public void Design_loader_survives_mutations_of_every_example() =>
        log.WriteLine(FuzzLoader(mutationsPerExample: 250));

    [Fact]
    public void Quantity_parser_accepts_or_refuses_with_a_quoted_message() =>
        log.WriteLine(FuzzQuantities(20_000));

    [Fact]
    public void Table_readers_survive_mutations()
    {
        var rt = File.ReadAllBytes(Path.Combine(Netlists, "table-47k-rt.csv"));
        var firmware = System.Text.Encoding.UTF8.GetBytes("code,temperature_celsius\n100,-20.5\n200,0.25\n300,25\n400,60.1\n");
        var tried = 0;
        foreach (var bytes in InputFuzzer.Mutations(rt, 1000, randomSeed: 11))
        {
            tried++;
            try { TableThermistor.Parse(System.Text.Encoding.UTF8.GetString(bytes), "rt.csv"); }
            catch (SensorTableException e) { Assert.True(e.Line >= 0); }
        }
        foreach (var bytes in InputFuzzer.Mutations(firmware, 1000, randomSeed: 13))
        {
            tried++;
            try { TableCsvReader.Parse(System.Text.Encoding.UTF8.GetString(bytes), "table.csv"); }
            catch (TableFormatException e) { Assert.True(e.Line >= 0); }
        }
        log.WriteLine($"table readers: {tried} inputs tried");
    }

    /// <summary>A fast subset of the full-check fuzzing for CI; the long run does thousands.</summary>
    [Fact]
    public void Full_checks_of_fuzzed_designs_never_end_in_an_internal_error() =>
        log.WriteLine(FuzzChecks(first: 1, count: 8, limitSeconds: 60, reportEvery: 4).Summary);

    /// <summary>
    /// The long run (documented in docs/errors.md, not part of CI): set THERMVERIFY_LONG_FUZZ=1 and run
    /// <c>dotnet test tests/ThermVerify.Tests --filter "FullyQualifiedName~FuzzTests.LongRun" --logger "console;verbosity=detailed"</c>.
    /// THERMVERIFY_LONG_FUZZ_CHECKS sets the number of full checks (10,000 by default), THERMVERIFY_LONG_FUZZ_INPUTS the
    /// loader and quantity-parser inputs (1,000,000 each by default), THERMVERIFY_LONG_FUZZ_FIRST the first case (1,000).
    /// </summary>
    [LongFuzzFact]
    public void LongRun()
    {
        var checks = int.TryParse(Environment.GetEnvironmentVariable("THERMVERIFY_LONG_FUZZ_CHECKS"), out var n) ? n : 10_000;
        var inputs = int.TryParse(Environment.GetEnvironmentVariable("THERMVERIFY_LONG_FUZZ_INPUTS"), out var m) ? m : 1_000_000;
        var first = int.TryParse(Environment.GetEnvironmentVariable("THERMVERIFY_LONG_FUZZ_FIRST"), out var f) ? f : 1_000;
        log.WriteLine(FuzzLoader(mutationsPerExample: inputs / 9));
        log.WriteLine(FuzzQuantities(inputs));
        var outcome = FuzzChecks(first, count: checks, limitSeconds: 60, reportEvery: 50);
        log.WriteLine(outcome.Summary);
        Assert.Equal(0, outcome.InternalErrors);
    }

    private static string FuzzLoader(int mutationsPerExample)
    {
        var folder = Directory.CreateTempSubdirectory("tv-fuzz-");
        try
        {
            File.Copy(Path.Combine(Netlists, "table-47k-rt.csv"), Path.Combine(folder.FullName, "table-47k-rt.csv"));
            var tried = 0;
            var accepted = 0;
            var path = Path.Combine(folder.FullName, "fuzzed.toml");
            foreach (var example in Directory.GetFiles(Netlists, "*.toml").Order())
                foreach (var bytes in InputFuzzer.Mutations(File.ReadAllBytes(example), count: mutationsPerExample, randomSeed: Path.GetFileName(example).Length))
                {
                    File.WriteAllBytes(path, bytes);
                    tried++;
                    try
                    {
                        var design = DesignLoader.Load(path);
                        design.Sensor.Build();
                        accepted++;
                    }
                    catch (DesignException e)
                    {
                        Assert.True(e.Line >= 1 && e.Column >= 1, $"no position in: {e.Message}");
                        Assert.DoesNotContain('\u001b', e.Message);
                    }
                }
            Assert.True(tried > 9 * mutationsPerExample, $"only {tried} inputs");
            return $"design loader: {tried} inputs, {accepted} loaded, the rest refused with a positioned design error";
        }
        finally
        {
            folder.Delete(recursive: true);
        }
    }

    private static string FuzzQuantities(int count)
    {
        var tried = 0;
        var accepted = 0;
        foreach (var text in InputFuzzer.RandomStrings(count, randomSeed: 7))
        {
            tried++;
            try
            {
                var q = QuantityParser.Parse(text);
                Assert.True(double.IsFinite(q.Value), $"\"{text}\" parsed to a non-finite value");
                accepted++;
            }
            catch (QuantityFormatException e)
            {
                Assert.Contains($"\"{text}\"", e.Message);
            }
            try
            {
                var range = QuantityParser.ParseRange(text);
                Assert.True(range.Min < range.Max);
            }
            catch (QuantityFormatException)
            {
            }
        }
        return $"quantity parser: {tried} inputs, {accepted} read, the rest refused with the text quoted";
    }

    internal sealed record ChecksOutcome(int Tried, int Refused, int Passed, int Failed, int SimulationFailed, int StoppedByLimit,
        int InternalErrors, int PastLimit, double SlowestSeconds, string Summary);

    /// <summary>
    /// Full `check` runs of fuzzed designs through the command line (JSON and JUnit every time, the report with its
    /// plots every <paramref name="reportEvery"/>th), each under --timeout. Exit code 4 is a bug, and so is exit code 2
    /// for anything but the design (the outputs are valid): the case is named.
    /// A run that takes longer than its limit and a few seconds is counted, as a figure, not failed on.
    /// </summary>
    private static ChecksOutcome FuzzChecks(int first, int count, int limitSeconds, int reportEvery)
    {
        var seeds = Directory.GetFiles(Netlists, "*.toml").Order().Select(File.ReadAllText).ToList();
        var folder = Directory.CreateTempSubdirectory("tv-fuzz-check-");
        try
        {
            File.Copy(Path.Combine(Netlists, "table-47k-rt.csv"), Path.Combine(folder.FullName, "table-47k-rt.csv"));
            int refused = 0, passed = 0, failed = 0, simulation = 0, stopped = 0, pastLimit = 0;
            var slowest = 0.0;
            var internalErrors = new List<string>();
            for (var number = first; number < first + count; number++)
            {
                var path = Path.Combine(folder.FullName, "fuzzed.toml");
                File.WriteAllText(path, DesignFuzzer.Design(seeds, number));
                string[] outputs = ["--json", Path.Combine(folder.FullName, "c.json"), "--junit", Path.Combine(folder.FullName, "c.xml"), "--force"];
                if (number % reportEvery == 0) outputs = [.. outputs, "--report", Path.Combine(folder.FullName, "report")];
                var clock = Stopwatch.StartNew();
                var run = CliRunner.Run(["check", path, "-q", "--threads", "1", "--sampling-points", "3", "--timeout", limitSeconds.ToString(), .. outputs,
                    .. (number % 3 == 0 ? Array.Empty<string>() : ["--no-remedies"])]);
                var seconds = clock.Elapsed.TotalSeconds;
                slowest = Math.Max(slowest, seconds);
                if (seconds > limitSeconds + 5) pastLimit++;
                switch (run.ExitCode)
                {
                    case ExitCodes.Success: passed++; break;
                    case ExitCodes.CheckFailed: failed++; break;
                    case ExitCodes.BadInput when run.Error.Contains(path): refused++; break; // a design error names the design
                    case ExitCodes.SimulationFailed when run.Error.Contains("time limit"): stopped++; break;
                    case ExitCodes.SimulationFailed: simulation++; break;
                    default: internalErrors.Add($"case {number}: exit {run.ExitCode}: {run.Error.Trim()}"); break;
                }
                Assert.DoesNotContain("\u001b", run.Output + run.Error);
            }
            var summary = $"full checks: {count} fuzzed designs (cases {first}..{first + count - 1}): {refused} refused (exit 2), {passed} passed, " +
                          $"{failed} failed the budget (exit 1), {simulation} could not be simulated (exit 3), {stopped} stopped at the {limitSeconds} s limit (exit 3), " +
                          $"{internalErrors.Count} internal errors (exit 4), {pastLimit} ran past the limit by more than 5 s; slowest {slowest:0.0} s";
            Assert.True(internalErrors.Count == 0, summary + "\n" + string.Join("\n", internalErrors));
            return new ChecksOutcome(count, refused, passed, failed, simulation, stopped, internalErrors.Count, pastLimit, slowest, summary);
        }
        finally
        {
            folder.Delete(recursive: true);
        }
    }
}

/// <summary>The long fuzz run: skipped with its reason unless THERMVERIFY_LONG_FUZZ=1 asks for it (it takes hours).</summary>
public sealed class LongFuzzFactAttribute : FactAttribute
{
    public LongFuzzFactAttribute()
    {
        if (Environment.GetEnvironmentVariable("THERMVERIFY_LONG_FUZZ") != "1")
            Skip = "the long fuzz run takes hours; set THERMVERIFY_LONG_FUZZ=1 to run it (docs/errors.md)";
    }
}
