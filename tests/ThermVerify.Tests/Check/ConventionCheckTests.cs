using ThermVerify.Check;

namespace ThermVerify.Tests.Check;

/// <summary>
/// The check converts and reads codes with the design's convention. With nothing loading the divider the sample is
/// the closed form V = 3.3·R/(R + 10 kΩ) (Ohm's law); a truncating converter (first transition at 1 LSB, common
/// practice, no source) gives floor(V/Q), and firmware reading the middle of the bin reports the Beta model's
/// temperature at (code + ½)·Q (1/T = 1/T0 + ln(R/R0)/β, the model's definition).
/// </summary>
public class ConventionCheckTests
{
    private static double Ohms(double celsius) => 10e3 * Math.Exp(3435 * (1 / (celsius + 273.15) - 1 / 298.15));

    private static double Celsius(double volts)
    {
        var ohms = 10e3 * volts / (3.3 - volts);
        return 1 / (1 / 298.15 + Math.Log(ohms / 10e3) / 3435) - 273.15;
    }

    [Theory]
    [InlineData("half-lsb", "bin-middle", 0.5, 0.0)]
    [InlineData("half-lsb", "bin-edge", 0.5, -0.5)]
    [InlineData("one-lsb", "bin-middle", 0.0, 0.5)]
    [InlineData("one-lsb", "bin-edge", 0.0, 0.0)]
    public void Codes_and_readings_follow_the_design_keys(string first, string inverse, double roundingShift, double readShift)
    {
        var design = TestDesign.Make(("adc.first_transition", $"\"{first}\""), ("adc.firmware_inverse", $"\"{inverse}\""));
        var q = 3.3 / 4096;
        foreach (var p in FrontEndCheck.Run(design, new CheckOptions { ComputeRemedies = false, MaximumSamplingPoints = 3 }).Points)
        {
            var volts = 3.3 * Ohms(p.Celsius) / (Ohms(p.Celsius) + 10e3);
            // On a transition itself (25 °C puts V/Q at exactly 2048) either code is right within the solver's 1 µV.
            if (Math.Abs(volts / q + roundingShift - Math.Round(volts / q + roundingShift)) < 1e-3) continue;
            var code = (int)Math.Floor(volts / q + roundingShift);
            Assert.Equal(code, p.Code);
            Tolerance.AssertClose(Celsius((code + readShift) * q), p.ReportedCelsius, 0, 1e-9, $"reading at {p.Celsius} °C");
        }
    }
}
