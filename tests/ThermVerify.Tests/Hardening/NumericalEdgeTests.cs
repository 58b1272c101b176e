using ThermVerify.Check;
using ThermVerify.Tests.Check;

namespace ThermVerify.Tests.Hardening;

/// <summary>
/// Values at the ends of what a design may hold: results stay finite, or the tool says why it cannot give one
/// (a code no sensor can produce is reported, never a NaN in a figure the user reads as a number).
/// </summary>
public class NumericalEdgeTests
{
    public static TheoryData<string, string> Extremes => new()
    {
        { "divider.fixed_resistor", "\"1 mohm\"" },
        { "divider.fixed_resistor", "\"1 Tohm\"" },
        { "adc.sampling_capacitance", "\"1 fF\"" },
        { "adc.sampling_capacitance", "\"1 F\"" },
        { "filter.reservoir_capacitor", "\"1 fF\"" },
        { "filter.reservoir_capacitor", "\"1 F\"" },
        { "adc.acquisition_time", "\"1 ns\"" },
        { "adc.bits", "8" },
        { "adc.bits", "24" },
        { "adc.pin_leakage", "\"1 mA\"" },
    };

    [Theory]
    [MemberData(nameof(Extremes))]
    public void Extreme_values_give_finite_figures_or_say_why(string key, string value)
    {
        var design = TestDesign.Make((key, value), ("adc.precharge", "\"discharged\""), ("check.range", "\"0 degC .. 50 degC\""), ("check.step", "\"10 K\""));
        var result = FrontEndCheck.Run(design);
        foreach (var p in result.Points)
        {
            Assert.True(double.IsFinite(p.DcPinVolts) && double.IsFinite(p.FirstSampleVolts) && double.IsFinite(p.SteadySampleVolts),
                $"{key} = {value}: non-finite voltage at {p.Celsius} °C");
            if (!double.IsFinite(p.ErrorKelvin))
                Assert.Contains(result.Findings, f => f.Id == "over-budget" && f.Cause.Contains("cannot come from a sensor"));
        }
    }

    [Fact]
    public void Acquisition_of_a_second_at_one_sample_a_second_and_more_runs()
    {
        var design = TestDesign.Make(("adc.sample_rate", "\"0.5 Hz\""), ("adc.acquisition_time", "\"1 s\""),
            ("adc.precharge", "\"discharged\""), ("check.range", "\"0 degC .. 50 degC\""), ("check.step", "\"25 K\""));
        var result = FrontEndCheck.Run(design);
        Assert.True(result.Passed, "a one-second acquisition of a 10 kΩ source settles completely");
    }
}
