using ThermVerify.Check;
using ThermVerify.Reporting;
using ThermVerify.Tests.Check;

namespace ThermVerify.Tests.Reporting;

/// <summary>
/// One failing check shared by the report tests (a check and its figures take a second): the plain test front end
/// read by a multiplexed ADC whose sampling capacitor arrives discharged and gets too short an acquisition.
/// </summary>
public sealed class ReportFixture
{
    public ReportFixture()
    {
        Result = FrontEndCheck.Run(TestDesign.Make(("adc.precharge", "\"discharged\""), ("adc.acquisition_time", "\"100 ns\""),
            ("adc.sample_rate", "\"50 kHz\""), ("check.step", "\"10 K\"")), new CheckOptions { Threads = 2, ComputeRemedies = false });
        Report = CheckReport.Build(Result, TestRun.Provenance, "test.toml");
    }

    public CheckResult Result { get; }
    public CheckReport Report { get; }

    public static string NewTempFolder()
    {
        var folder = Path.Combine(Path.GetTempPath(), "thermverify-tests", Guid.NewGuid().ToString("N"));
        Directory.CreateDirectory(folder);
        return folder;
    }
}
