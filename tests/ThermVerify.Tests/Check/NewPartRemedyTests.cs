using ThermVerify.Check;
using ThermVerify.Design;
using ThermVerify.Tests.FrontEnd;

namespace ThermVerify.Tests.Check;

/// <summary>
/// Remedies that know the gain stage, the charge injection and the wiring of a current-excited sensor: each value is
/// found by bisection and proven by a check of the whole changed design (RemedyFinder), and each is checked again
/// here, whole, against its closed form where it has one.
/// </summary>
public class NewPartRemedyTests
{
    private static readonly CheckOptions Options = new() { MaximumSamplingPoints = 3 };
    private static readonly CheckOptions NoRemedies = Options with { ComputeRemedies = false };

    private static FrontEndDesign Applied(FrontEndDesign design, Remedy remedy) => remedy.Key switch
    {
        "adc.gain" => design with { Adc = design.Adc with { GainStage = design.Adc.GainStage! with { Gain = remedy.Value!.Value } } },
        "adc.pga_input_current" => design with { Adc = design.Adc with { GainStage = design.Adc.GainStage! with { InputCurrentAmperes = remedy.Value!.Value } } },
        "adc.charge_injection" => design with { Adc = design.Adc with { ChargeInjectionCoulombs = -remedy.Value!.Value } },
        "wiring.wires" => design with { Wiring = design.Wiring! with { Wires = (int)remedy.Value!.Value } },
        _ => throw new InvalidOperationException(remedy.Key),
    };

    [Fact]
    public void The_largest_gain_that_keeps_the_amplified_signal_in_range()
    {
        // 16·1 mA·R_s leaves 2.5 V at 200 °C; the gain that just fits is 2.5 V/(1 mA·R(200 °C)) = 14.22 (IEC 60751 by hand).
        var design = CurrentDesigns.Pt100(("adc.gain", "16"), ("check.budget", "\"2 K\""));
        var finding = Assert.Single(FrontEndCheck.Run(design, Options).Findings, f => f.Id == GainRangeRule.Id);
        var remedy = Assert.Single(finding.Remedies, r => r.Key == "adc.gain");
        var limit = 2.5 / (1e-3 * CurrentDesigns.Ohms(200));
        Assert.InRange(remedy.Value!.Value, 0.99 * limit, limit);
        var again = FrontEndCheck.Run(Applied(design, remedy), NoRemedies);
        Assert.DoesNotContain(again.Findings, f => f.Id == GainRangeRule.Id);
    }

    [Fact]
    public void The_largest_input_current_and_series_resistor_the_half_LSB_allows()
    {
        // +10 nA through 10 kΩ + R_s: ½ LSB at the pin (2.5 V/(8·2^16)/2 = 2.38 µV) allows I·(10 kΩ + R_s) ≤ 2.38 µV (Ohm's law):
        // at most 0.23 nA, or a series resistor of at most 2.38 µV/10 nA − R_s = 62 Ω at 200 °C.
        var design = CurrentDesigns.Pt100(("adc.gain", "8"), ("filter.series_resistor", "\"10 kohm\""), ("adc.pga_input_current", "\"+10 nA\""),
            ("check.budget", "\"2 K\""));
        var result = FrontEndCheck.Run(design, Options);
        var finding = Assert.Single(result.Findings, f => f.Id == "dc-loading");
        var current = Assert.Single(finding.Remedies, r => r.Key == "adc.pga_input_current");
        var worstOhms = 10e3 + CurrentDesigns.Ohms(finding.WorstCelsius);
        var halfLsb = 2.5 / 8 / 65536 / 2;
        Assert.InRange(current.Value!.Value, 0.98 * halfLsb / worstOhms, halfLsb / worstOhms * 1.0001);
        var series = Assert.Single(finding.Remedies, r => r.Key == "filter.series_resistor");
        var largest = halfLsb / 10e-9 - CurrentDesigns.Ohms(200);
        Assert.InRange(series.Value!.Value, 0.97 * largest, largest * 1.0001);
        Assert.DoesNotContain(FrontEndCheck.Run(Applied(design, current), NoRemedies).Findings, f => f.Id == "dc-loading");
    }

    [Fact]
    public void Two_wires_to_a_current_excited_sensor_are_remedied_by_three()
    {
        // 2·1 mA·1 Ω = 2 mV on a Pt100 at 1 mA (0.39 mV/K) is about 5 K: the fewest wires that clear it is 3 (the
        // second, matched current cancels the leads; common practice for RTDs).
        var design = CurrentDesigns.Pt100(("wiring.wires", "2"), ("wiring.lead_resistance", "\"1 ohm\""));
        var finding = Assert.Single(FrontEndCheck.Run(design, Options).Findings, f => f.Id == "dc-loading");
        var remedy = Assert.Single(finding.Remedies, r => r.Key == "wiring.wires");
        Assert.Equal(3, remedy.Value!.Value);
        Assert.Contains(finding.Remedies, r => r.Key == "wiring.lead_resistance");
        Assert.DoesNotContain(FrontEndCheck.Run(Applied(design, remedy), NoRemedies).Findings, f => f.Id == "dc-loading");
    }

    [Fact]
    public void The_largest_charge_injection_the_half_LSB_allows()
    {
        var design = TestDesign.Make(("sensor.r25", "\"1 Mohm\""), ("divider.fixed_resistor", "\"1 Mohm\""), ("filter.reservoir_capacitor", "\"10 nF\""),
            ("adc.charge_injection", "\"-1 pC\""), ("check.range", "\"0 degC .. 50 degC\""), ("check.step", "\"25 K\""), ("check.budget", "\"0.1 K\""));
        var finding = Assert.Single(FrontEndCheck.Run(design, Options).Findings, f => f.Id == ChargeInjectionRule.Id);
        var remedy = Assert.Single(finding.Remedies, r => r.Key == "adc.charge_injection");
        Assert.InRange(remedy.Value!.Value, 1e-15, 1e-12);
        Assert.DoesNotContain(FrontEndCheck.Run(Applied(design, remedy), NoRemedies).Findings, f => f.Id == ChargeInjectionRule.Id);
    }
}
