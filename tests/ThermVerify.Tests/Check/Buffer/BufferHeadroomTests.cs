using ThermVerify.Check;
using ThermVerify.Check.Buffer;
using ThermVerify.FrontEnd;
using ThermVerify.Simulation;

namespace ThermVerify.Tests.Check.Buffer;

public class BufferHeadroomTests
{
    /// <summary>Beta model (from memory; the B-parameter form of the Steinhart–Hart article): T = 1/(1/T25 + ln(R/R25)/β).</summary>
    private static double BetaCelsius(double ohms) => 1 / (1 / 298.15 + Math.Log(ohms / 10e3) / 3435) - 273.15;

    [Fact]
    public void Clipped_output_is_reported_exactly_where_the_closed_form_crosses_the_swing_limits()
    {
        // 0.5 V swing from 0 V and 3.3 V rails: the output lives in 0.5 V .. 2.8 V. Low-side NTC: v = 3.3·R/(R + 10k),
        // so v = 2.8 V at R = 2.8·10k/0.5 = 56 kΩ and v = 0.5 V at R = 0.5·10k/2.8 (divider by Ohm's law).
        var design = BufferDesigns.Follower(("buffer.output_swing", "\"0.5 V\""));
        var temperatures = Enumerable.Range(0, 21).Select(i => -20.0 + 5 * i).ToArray();
        var headroom = BufferHeadroom.Run(design, temperatures);

        var high = Assert.Single(headroom.Violations, v => v.Limit == "output swing" && v.Side == "high");
        var low = Assert.Single(headroom.Violations, v => v.Limit == "output swing" && v.Side == "low");
        Tolerance.AssertClose(-20, high.FromCelsius, 0, 1e-9, "clipping starts at the range's low end");
        Tolerance.AssertClose(BetaCelsius(2.8 * 10e3 / 0.5), high.ToCelsius, 0, 1e-6, "high-limit crossing (°C)");
        Tolerance.AssertClose(BetaCelsius(0.5 * 10e3 / 2.8), low.FromCelsius, 0, 1e-6, "low-limit crossing (°C)");
        Tolerance.AssertClose(80, low.ToCelsius, 0, 1e-9, "clipping lasts to the range's high end");
        Assert.Equal((int)Math.Round(2.8 / (3.3 / 4096), MidpointRounding.AwayFromZero), high.ClippedCode);

        // The engine agrees: 1 K inside the crossing the op-amp's output follows the divider; 1 K beyond it sits at the limit.
        double Output(double celsius) => OperatingPoint.Solve(FrontEndCircuit.Dc(design, null) with { TemperatureCelsius = celsius }).Voltage(FrontEndNodes.BufferOutput);
        double Divider(double celsius) => 3.3 * (10e3 * Math.Exp(3435 * (1 / (celsius + 273.15) - 1 / 298.15))) / (10e3 * Math.Exp(3435 * (1 / (celsius + 273.15) - 1 / 298.15)) + 10e3);
        // (finite gain A0/(1 + A0) with A0 = 120 dB)
        Tolerance.AssertClose(1e6 / (1 + 1e6) * Divider(high.ToCelsius + 1), Output(high.ToCelsius + 1), 0, 1e-8, "follows inside (the clamp knee adds ~1 nV 22 mV from the limit)");
        Tolerance.AssertClose(2.8, Output(high.ToCelsius - 1), 0, 0.011, "clamped beyond (within the 10 mV knee)");
    }

    [Fact]
    public void Input_outside_the_common_mode_range_fails_the_check_with_its_range()
    {
        var design = BufferDesigns.Follower(("buffer.input_common_mode", "\"0 V .. 2 V\""));
        var result = FrontEndCheck.Run(design, new CheckOptions { ComputeRemedies = false, MaximumSamplingPoints = 3 });
        var finding = Assert.Single(result.Findings, f => f.Id == "buffer-input-range");
        Assert.Equal(Severity.Fail, finding.Severity);
        Assert.False(result.Passed);
        // v = 2 V at R = 2·10k/1.3 (Ohm's law on the divider).
        Tolerance.AssertClose(BetaCelsius(2 * 10e3 / 1.3), finding.ToCelsius, 0, 1e-6, "common-mode crossing (°C)");
    }
}
