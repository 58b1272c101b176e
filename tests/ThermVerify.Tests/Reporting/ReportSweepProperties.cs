using System.Globalization;
using FsCheck;
using FsCheck.Fluent;
using FsCheck.Xunit;
using ThermVerify.Cli;
using ThermVerify.Tests.Cli;

namespace ThermVerify.Tests.Reporting;

/// <summary>
/// `check --report` completes on front ends across sample rates of 100 Hz to 1 MHz and acquisition times of 0.1 µs to
/// 100 µs (each shorter than the period), whatever the verdict: the report draws the waveform the check recorded at its
/// worst point, and every sample instant, run end and window end comes from one formula (the sampling switch's own
/// edge), so no read falls a rounding outside a run. Two sensors: a Pt100 behind a 10 nF reservoir and a 100 kΩ NTC
/// without one, as design files written from the docs.
/// </summary>
public class ReportSweepProperties
{
    private const string Pt100 = """
        name = "pt100 sweep"
        [sensor]
        model = "rtd"
        r0 = "100 ohm"
        [divider]
        sensor_side = "low"
        fixed_resistor = "1 kohm"
        excitation = "3.3 V"
        [filter]
        reservoir_capacitor = "10 nF"
        [adc]
        bits = 12
        reference = "ratiometric"
        sample_rate = "RATE"
        acquisition_time = "ACQ"
        sampling_capacitance = "8 pF"
        switch_resistance = "1 kohm"
        [check]
        range = "0 degC .. 100 degC"
        step = "50 K"
        budget = "1 K"
        """;

    private const string Ntc100k = """
        name = "100k NTC sweep"
        [sensor]
        model = "beta"
        r25 = "100 kohm"
        beta = 4190
        [divider]
        sensor_side = "low"
        fixed_resistor = "100 kohm"
        excitation = "3.3 V"
        [adc]
        bits = 12
        reference = "ratiometric"
        sample_rate = "RATE"
        acquisition_time = "ACQ"
        sampling_capacitance = "8 pF"
        switch_resistance = "1.5 kohm"
        [check]
        range = "-20 degC .. 20 degC"
        step = "20 K"
        budget = "0.5 K"
        """;

    /// <summary>Exponents of ten: the rate in [2, 6], the acquisition in [−7, −4] seconds.</summary>
    private static Arbitrary<(double Rate, double Acquisition, bool Ntc)> Cases =>
        (from r in Gen.Choose(0, 1000)
         from a in Gen.Choose(0, 1000)
         from ntc in Gen.Elements(false, true)
         select (Math.Pow(10, 2 + 4 * r / 1000.0), Math.Pow(10, -7 + 3 * a / 1000.0), ntc)).ToArbitrary();

    [Property(MaxTest = 8)]
    public Property Check_report_completes_across_sample_rates_and_acquisition_times() =>
        Prop.ForAll(Cases, c =>
        {
            // The acquisition must fit the period: at most 0.9 of it.
            var acquisition = Math.Min(c.Acquisition, 0.9 / c.Rate);
            var outcome = RunWithReport(c.Ntc ? Ntc100k : Pt100, c.Rate, acquisition);
            return (outcome.ExitCode is ExitCodes.Success or ExitCodes.CheckFailed)
                .Label($"{(c.Ntc ? "NTC" : "Pt100")} at {c.Rate:G4} Hz, acquisition {acquisition:G4} s: exit {outcome.ExitCode} {outcome.Error}");
        });

    [Theory]
    [InlineData(1e3, 10e-6, false)]   // the cases the report used to stop on
    [InlineData(3e3, 10e-6, false)]
    [InlineData(10e3, 2e-6, true)]
    [InlineData(1e6, 0.1e-6, true)]
    [InlineData(100, 100e-6, false)]
    public void Check_report_completes_on_the_cases_that_used_to_stop(double rate, double acquisition, bool ntc)
    {
        var outcome = RunWithReport(ntc ? Ntc100k : Pt100, rate, acquisition);
        Assert.True(outcome.ExitCode is ExitCodes.Success or ExitCodes.CheckFailed, $"exit {outcome.ExitCode}: {outcome.Error}");
    }

    private static CliRunner.Outcome RunWithReport(string template, double rate, double acquisition)
    {
        var folder = Directory.CreateTempSubdirectory("thermverify-report-sweep-");
        try
        {
            var design = Path.Combine(folder.FullName, "design.toml");
            File.WriteAllText(design, template
                .Replace("RATE", rate.ToString("R", CultureInfo.InvariantCulture) + " Hz")
                .Replace("ACQ", (acquisition * 1e6).ToString("R", CultureInfo.InvariantCulture) + " us"));
            var outcome = CliRunner.Run("check", design, "--report", Path.Combine(folder.FullName, "report"), "--no-remedies", "--sampling-points", "2", "-q");
            if (outcome.ExitCode is ExitCodes.Success or ExitCodes.CheckFailed)
                Assert.True(File.Exists(Path.Combine(folder.FullName, "report", "report.html")), "report.html written");
            return outcome;
        }
        finally
        {
            folder.Delete(recursive: true);
        }
    }
}
