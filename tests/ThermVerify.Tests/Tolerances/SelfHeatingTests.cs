using ThermVerify.FrontEnd;
using ThermVerify.Tests.Check;
using ThermVerify.Tolerances;

namespace ThermVerify.Tests.Tolerances;

public class SelfHeatingTests
{
    /// <summary>
    /// A sensor R fed from V through an equal fixed R dissipates (V/2)²/R = V²/(4R), the most it can take from that
    /// divider (maximum power transfer), and warms by ΔT = P/δ with δ the dissipation constant (IEC 60539-1 terms;
    /// the "maximum power transfer" result of circuit theory). At 25 °C the 10 kΩ NTC equals the 10 kΩ fixed resistor.
    /// </summary>
    [Fact]
    public void EqualResistancesDissipateVSquaredOverFourR()
    {
        var design = TestDesign.Make(("sensor.dissipation_constant", "\"2 mW/K\""));
        var profile = SelfHeating.Profile(design);
        var i = profile.Celsius.ToList().IndexOf(25);
        var expected = 3.3 * 3.3 / (4 * 10e3) / 2e-3;
        Tolerance.AssertClose(3.3 * 3.3 / (4 * 10e3), profile.PowerWatts[i], 1e-9, what: "power");
        Tolerance.AssertClose(expected, profile.RiseKelvin[i], 1e-9, what: "ΔT");
        // Away from equality the sensor takes less (maximum power transfer).
        Assert.All(profile.PowerWatts, p => Assert.True(p <= 3.3 * 3.3 / (4 * 10e3) * (1 + 1e-12)));
    }

    /// <summary>Exciting the divider for the lead and one conversion in each reading interval scales the mean power by that duty cycle.</summary>
    [Fact]
    public void SwitchedExcitationScalesTheRiseByTheDutyCycle()
    {
        var design = TestDesign.Make(("sensor.dissipation_constant", "\"2 mW/K\""),
            ("divider.switch_on_lead", "\"900 us\""), ("divider.reading_interval", "\"100 ms\""));
        var duty = (900e-6 + 1 / 10e3) / 100e-3;
        Tolerance.AssertClose(duty, SelfHeating.DutyCycle(design), 1e-12);
        var profile = SelfHeating.Profile(design);
        var i = profile.Celsius.ToList().IndexOf(25);
        Tolerance.AssertClose(duty * 3.3 * 3.3 / (4 * 10e3) / 2e-3, profile.RiseKelvin[i], 1e-9);
    }

    /// <summary>
    /// A warmer sensor reads high by its warming: the Monte Carlo's nominal unit, with only self-heating added, reads
    /// the rise at every temperature (unquantised). The rise enters as the first-order voltage shift ΔT·dV/dT; the
    /// neglected second-order term is about ½·ΔT·|d ln(dV/dT)/dT| ≈ 0.2 % of ΔT for 0.1 K on this NTC divider.
    /// </summary>
    [Fact]
    public void SelfHeatingShowsInTheReadingAsTheRise()
    {
        var design = TestDesign.Make(("sensor.dissipation_constant", "\"1 mW/K\""), ("adc.bits", "16"));
        var evaluator = new UnitEvaluator(design);
        var plain = new UnitEvaluator(TestDesign.Make(("adc.bits", "16"))).Evaluate([]);
        var heated = evaluator.Evaluate([]);
        for (var k = 0; k < heated.ErrorKelvin.Length; k++)
            Tolerance.AssertClose(plain.UnquantisedErrorKelvin[k] + heated.SelfHeatingKelvin[k], heated.UnquantisedErrorKelvin[k], 5e-3, 1e-5,
                $"reading at {evaluator.Temperatures[k]} °C");
        // The largest rise is where the NTC equals the fixed resistor (25 °C): V²/(4R)/δ = 0.272 K.
        Tolerance.AssertClose(3.3 * 3.3 / (4 * 10e3) / 1e-3, heated.SelfHeatingKelvin.Max(), 1e-9, what: "largest rise");
    }
}
