using ThermVerify.Check;
using ThermVerify.Ngspice;

namespace ThermVerify.Tests.Ngspice;

/// <summary>The whole check through ngspice (the reference engine) reports what the built-in engine reports.</summary>
public class NgspiceCheckTests
{
    [NgspiceTheory]
    [InlineData("table-sensor-freezer.toml", NgspiceMode.SharedLibrary)]
    [InlineData("buffered-cable-probe.toml", NgspiceMode.ChildProcess)]
    public void Check_through_ngspice_reports_the_same_codes_and_verdict(string file, NgspiceMode mode)
    {
        var design = ExampleDesigns.Load(file);
        var options = new CheckOptions { MaximumSamplingPoints = 3, ComputeRemedies = false };
        var ours = FrontEndCheck.Run(design, options);
        using var engine = new NgspiceEngine(mode);
        var progress = new List<ThermVerify.Limits.RunProgress>();
        var theirs = FrontEndCheck.Run(design, options with { Engine = engine, Progress = new Progress(progress) });
        // Every sampling transient through ngspice was reported: three grid temperatures for each precharge case.
        Assert.Equal(new ThermVerify.Limits.RunProgress(3 * theirs.PrechargeCases.Count, 3 * theirs.PrechargeCases.Count), progress.MaxBy(p => p.Done));
        Assert.Equal(ours.Passed, theirs.Passed);
        // The provenance names ngspice and the version its own program reports (`ngspice -v`, the same build as the library here).
        var stamp = ThermVerify.Api.RunStamp.Check(design, options with { Engine = engine });
        Assert.Equal(mode == NgspiceMode.SharedLibrary ? "ngspice" : "ngspice (child process)", stamp.Engine);
        Assert.Equal(VersionFromProgram(), stamp.EngineVersion);
        for (var i = 0; i < ours.Points.Count; i++)
        {
            // A sample within 0.01 LSB of a code boundary could round differently; none of these designs has one.
            Assert.Equal(ours.Points[i].Code, theirs.Points[i].Code);
            Tolerance.AssertClose(theirs.Points[i].ErrorKelvin, ours.Points[i].ErrorKelvin, 0, 1e-9, $"{file} at {ours.Points[i].Celsius} °C");
        }
    }

    private static string VersionFromProgram()
    {
        var text = ExternalProgram.Run("ngspice", ["-v"], Path.GetTempPath());
        var match = System.Text.RegularExpressions.Regex.Match(text, @"ngspice-(\S+)");
        Assert.True(match.Success, $"ngspice -v printed no version: {text}");
        return match.Groups[1].Value;
    }

    /// <summary>Keeps the reports (they come from worker threads).</summary>
    private sealed class Progress(List<ThermVerify.Limits.RunProgress> reports) : IProgress<ThermVerify.Limits.RunProgress>
    {
        public void Report(ThermVerify.Limits.RunProgress value)
        {
            lock (reports) reports.Add(value);
        }
    }
}
