using ThermVerify.Check;
using ThermVerify.Design;
using ThermVerify.Firmware;
using ThermVerify.Tests.Check;
using ThermVerify.Tolerances;

namespace ThermVerify.Tests.Tolerances;

/// <summary>
/// A divider excited by one voltage and read by a converter with a reference of its own (a different voltage): the
/// reference's tolerance and tempco count in the worst case, Monte Carlo, the check (its tempco, at the board) and the
/// fault thresholds. The reference is outside the circuit: the converter's code is V/Q with Q = V_ref/2^N (IEEE Std
/// 1241), so a reference off by a fraction δ reads a sample V as V/(1 + δ); the temperature it stands for follows
/// from the divider (Ohm's law) and the β equation 1/T = 1/T₀ + ln(R/R₀)/β (IEC 60539-1 terms), written out here.
/// </summary>
public class SeparateReferenceTests
{
    private const double Excitation = 3.3, Fixed = 10e3, R25 = 10e3, Beta = 3435;

    private static FrontEndDesign Design(params (string, string?)[] more) =>
        TestDesign.Make([("adc.reference", "\"4.096 V\""), .. more]);

    /// <summary>The divider's low-side voltage at a temperature, by hand.</summary>
    private static double Volts(double celsius)
    {
        var r = Rs(celsius);
        return Excitation * r / (r + Fixed);
    }

    private static double Rs(double celsius) => R25 * Math.Exp(Beta * (1 / (celsius + 273.15) - 1 / 298.15));

    /// <summary>The temperature a divider voltage stands for, by hand: R_s = R_f·V/(E − V), then the β equation.</summary>
    private static double Celsius(double volts)
    {
        var r = Fixed * volts / (Excitation - volts);
        return 1 / (1 / 298.15 + Math.Log(r / R25) / Beta) - 273.15;
    }

    /// <summary>dT/dδ at δ = 0 for a reference off by δ: −V/(dV/dT), dV/dT = E·R_f/(R_s + R_f)²·dR_s/dT, dR_s/dT = −β·R_s/T².</summary>
    private static double KelvinPerFraction(double celsius)
    {
        var r = Rs(celsius);
        var kelvin = celsius + 273.15;
        var slope = Excitation * Fixed / Math.Pow(r + Fixed, 2) * (-Beta * r / (kelvin * kelvin));
        return -Volts(celsius) / slope;
    }

    [Fact]
    public void Worst_case_sensitivity_to_the_reference_tolerance_is_the_closed_form()
    {
        var result = WorstCase.Run(Design(("adc.reference_tolerance", "\"0.5 %\"")), new WorstCaseOptions { Threads = 1 });
        var sensitivity = Assert.Single(result.Sensitivities, s => s.Parameter.Kind == ToleranceKind.Reference);
        for (var k = 0; k < result.Points.Count; k++)
        {
            var t = result.Points[k].Celsius;
            // Central differences over ±0.5 %: a second-order term of about 1e-4 relative; 2e-3 leaves room for it.
            Tolerance.AssertClose(KelvinPerFraction(t), sensitivity.KelvinPerUnit[k], 2e-3, 1e-9, $"dT/dδ at {t} °C");
            // The reference alone: the linear sum is |s|·a.
            Tolerance.AssertClose(Math.Abs(KelvinPerFraction(t)) * 0.005, result.Points[k].LinearSumKelvin, 2e-3, 1e-9, $"linear sum at {t} °C");
        }
    }

    [Fact]
    public void Worst_case_sensitivity_to_the_reference_tempco_is_the_closed_form_at_the_board()
    {
        // The reference at 60 °C: δ = tc·35 K, so dT/dtc = 35 K·dT/dδ.
        var result = WorstCase.Run(Design(("adc.reference_tempco", "\"50 ppm/K\""), ("check.board_temperature", "\"60 degC\"")),
            new WorstCaseOptions { Threads = 1 });
        var sensitivity = Assert.Single(result.Sensitivities, s => s.Parameter.Kind == ToleranceKind.ReferenceTempco);
        for (var k = 0; k < result.Points.Count; k++)
        {
            var t = result.Points[k].Celsius;
            Tolerance.AssertClose(35 * KelvinPerFraction(t), sensitivity.KelvinPerUnit[k], 2e-3, 1e-9, $"dT/dtc at {t} °C");
        }
    }

    [Fact]
    public void Check_reads_a_drifted_reference_as_the_closed_form_says()
    {
        // +50 ppm/K written with its sign, the board at 65 °C: the reference is 0.2 % high and every sample reads
        // as V/1.002; the converter's column is T(V/1.002) − T(V), computed here by hand.
        var result = FrontEndCheck.Run(Design(("adc.reference_tempco", "\"+50 ppm/K\""), ("check.board_temperature", "\"65 degC\"")),
            new CheckOptions { ComputeRemedies = false, MaximumSamplingPoints = 3 });
        const double drift = 50e-6 * 40;
        foreach (var p in result.Points)
            Tolerance.AssertClose(Celsius(p.SampleVolts / (1 + drift)) - Celsius(p.SampleVolts), p.Contributions.ConverterKelvin, 1e-6, 1e-9,
                $"converter column at {p.Celsius} °C");
        var converter = Assert.Single(result.Findings, f => f.Id == "converter");
        Assert.Contains("the reference at 65 °C is +0.2 % off", converter.Cause);
    }

    [Fact]
    public void Monte_carlo_spreads_the_reading_by_the_references_tolerance()
    {
        // Uniform ±0.5 % on the reference alone: σ_T = |dT/dδ|·a/√3 (the uniform distribution's standard deviation,
        // any statistics handbook). 2000 seeded units: the sample σ is within about 1.6 % (1/√(2N)); 6 % leaves room.
        var result = MonteCarlo.Run(Design(("adc.reference_tolerance", "\"0.5 %\"")),
            new MonteCarloOptions { Units = 2000, Seed = 7, Threads = 1, SimulateSettling = false });
        foreach (var p in result.Envelope)
            Tolerance.AssertClose(Math.Abs(KelvinPerFraction(p.Celsius)) * 0.005 / Math.Sqrt(3), p.StandardDeviationKelvin, 0.06, 0.002, $"σ at {p.Celsius} °C");
        var share = Assert.Single(result.Contributors, c => c.Kind == ToleranceKind.Reference);
        Assert.True(share.Share > 0.95, $"the reference's share {share.Share}");
    }

    [Fact]
    public void Ratiometric_divider_stays_ratiometric_whatever_the_excitation_does()
    {
        // Reference = excitation: the excitation's 2 % cancels in V/Q (E·R_s/(R_s + R_f))/(E/2^N) (common practice).
        var result = WorstCase.Run(TestDesign.Make(("divider.excitation_tolerance", "\"2 %\"")), new WorstCaseOptions { Threads = 1 });
        Assert.All(result.Points, p => Tolerance.AssertClose(0, p.LinearSumKelvin, 0, 1e-9, $"at {p.Celsius} °C"));
        // With a separate reference of the same voltage the excitation no longer cancels: a unit reads V·(1 + ε), and the
        // analysis's central difference over ±2 % is (T(1.02·V) − T(0.98·V))/0.04, by hand (1e-5: the firmware's reading
        // is linear between codes, which bends from the exact inverse by a few microkelvin over one LSB).
        var separate = WorstCase.Run(TestDesign.Make(("divider.excitation_tolerance", "\"2 %\""), ("adc.reference", "\"3.3 V\"")),
            new WorstCaseOptions { Threads = 1 });
        var s = Assert.Single(separate.Sensitivities, x => x.Parameter.Kind == ToleranceKind.Excitation);
        for (var k = 0; k < separate.Points.Count; k++)
        {
            var v = Volts(separate.Points[k].Celsius);
            Tolerance.AssertClose((Celsius(1.02 * v) - Celsius(0.98 * v)) / 0.04, s.KelvinPerUnit[k], 1e-5, 1e-9, $"dT/dε at {separate.Points[k].Celsius} °C");
        }
    }

    [Fact]
    public void Fault_thresholds_widen_by_the_references_drift()
    {
        // Fixed reference, 0.5 % and 50 ppm/K, the board at 65 °C: the band is 0.5 % + 50e-6·40 = 0.7 % (arithmetic);
        // without a board temperature the reference drifts over the range, farthest at 80 °C (55 K from 25 °C).
        var atBoard = FirmwareFromDesign.Tolerances(Design(("adc.reference_tolerance", "\"0.5 %\""), ("adc.reference_tempco", "\"50 ppm/K\""),
            ("check.board_temperature", "\"65 degC\"")));
        Tolerance.AssertClose(0.007, atBoard.ReferenceFraction, 1e-12);
        var swept = FirmwareFromDesign.Tolerances(Design(("adc.reference_tolerance", "\"0.5 %\""), ("adc.reference_tempco", "\"-50 ppm/K\"")));
        Tolerance.AssertClose(0.005 + 50e-6 * 55, swept.ReferenceFraction, 1e-12);
        // Ratiometric: nothing to add, the reference is the excitation.
        Assert.Equal(0, FirmwareFromDesign.Tolerances(TestDesign.Make()).ReferenceFraction);
    }
}
