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
        var theirs = FrontEndCheck.Run(design, options with { Engine = new NgspiceEngine(mode) });
        Assert.Equal(ours.Passed, theirs.Passed);
        for (var i = 0; i < ours.Points.Count; i++)
        {
            // A sample within 0.01 LSB of a code boundary could round differently; none of these designs has one.
            Assert.Equal(ours.Points[i].Code, theirs.Points[i].Code);
            Tolerance.AssertClose(theirs.Points[i].ErrorKelvin, ours.Points[i].ErrorKelvin, 0, 1e-9, $"{file} at {ours.Points[i].Celsius} °C");
        }
    }
}
