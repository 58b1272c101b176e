using ThermVerify.Check;
using ThermVerify.FrontEnd;
using ThermVerify.Tests.Ngspice;

namespace ThermVerify.Tests.Check;

/// <summary>
/// The sampling waveform a report draws is the check's own: recorded at the worst point, by the engine the check ran
/// with, at the check's tolerances. Its first sample is the first conversion the check itself simulates there.
/// </summary>
public class CheckWaveformTests
{
    [Theory]
    [MemberData(nameof(ExampleDesigns.All), MemberType = typeof(ExampleDesigns))]
    public void The_recorded_first_sample_is_the_checks_first_conversion(string example)
    {
        var design = ExampleDesigns.Load(example);
        var result = FrontEndCheck.Run(design, new CheckOptions { ComputeRemedies = false, MaximumSamplingPoints = 3 });
        var waveform = result.Waveform;
        var worst = result.Worst;
        Assert.Equal(worst.Celsius, waveform.Celsius);
        Assert.Equal(worst.PrechargeVolts, waveform.PrechargeVolts);
        Assert.Equal(SamplingWaveform.DefaultConversions, waveform.Conversions.Count);

        var settleVolts = design.Check.SettleLimitLsb * result.Adc.LsbVolts;
        var first = SamplingRun.FirstSampleVolts(design, worst.Celsius, worst.PrechargeVolts, settleVolts);
        // The same run read at more instants (the plot's points are extra stops for the step control): within 0.01 LSB.
        Tolerance.AssertClose(first, waveform.Conversions[0].SampledVolts, 0, 0.01 * result.Adc.LsbVolts, example);
        foreach (var trace in waveform.Conversions)
        {
            Assert.Equal(trace.TimeFromStartSeconds.Length, trace.PinVolts.Length);
            Assert.Equal(design.Adc.AcquisitionTimeSeconds, trace.TimeFromStartSeconds[^1], 12);
            Assert.All(trace.HoldVolts, v => Assert.True(double.IsFinite(v)));
        }
    }

    /// <summary>
    /// Remedy proofs and search candidates skip the recording: the verdict, every point and every finding are those of
    /// the recorded check (the recording only reads the run again), and the waveform has no conversions.
    /// </summary>
    [Theory]
    [InlineData("buffered-cable-probe.toml")]
    [InlineData("cold-storage-logger.toml")]
    public void A_check_without_the_recording_has_the_same_points_and_findings(string example)
    {
        var design = ExampleDesigns.Load(example);
        var options = new CheckOptions { ComputeRemedies = false, MaximumSamplingPoints = 3 };
        var recorded = FrontEndCheck.Run(design, options);
        var bare = FrontEndCheck.Run(design, options with { RecordWaveform = false });
        Assert.Empty(bare.Waveform.Conversions);
        Assert.NotEmpty(recorded.Waveform.Conversions);
        Assert.Equal(recorded.Passed, bare.Passed);
        Assert.Equal(recorded.Points.Select(p => (p.Code, p.ErrorKelvin, p.SampleVolts)), bare.Points.Select(p => (p.Code, p.ErrorKelvin, p.SampleVolts)));
        Assert.Equal(recorded.Findings.Select(f => (f.Id, f.Severity, f.Title)), bare.Findings.Select(f => (f.Id, f.Severity, f.Title)));
    }
}
