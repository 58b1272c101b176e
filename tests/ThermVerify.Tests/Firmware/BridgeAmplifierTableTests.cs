using ThermVerify.Api;
using ThermVerify.Design;
using ThermVerify.Firmware;

namespace ThermVerify.Tests.Firmware;

/// <summary>
/// The firmware table of a bridge read through an in-amp (netlists/autoclave-pt100-bridge-inamp.toml): a code stands for
/// the amplifier's output V_out = code·Q (bin middle, IEEE Std 1241; Q = E/2^16, ratiometric), the bridge for
/// V_d = V_out/G − V_os (the amplifier's gain and the offset the design declares with a sign), the sensor's half for
/// V+ = V_d + E·R_low/(R_high + R_low) (the bridge equation, Kirchhoff's laws on two dividers), the sensor for
/// R_s = R_f·V+/(E − V+) (sensor low, Ohm's law) and the temperature for IEC 60751's Callendar–Van Dusen equation
/// (from memory: A = 3.9083e-3, B = −5.775e-7; the range is above 0 °C, where C is not used), all by hand here.
/// </summary>
public class BridgeAmplifierTableTests
{
    private const double A = 3.9083e-3, B = -5.775e-7;
    private const double E = 2.5, Fixed = 2000, High = 2000, Low = 100, Gain = 20;

    private static FrontEndDesign Autoclave() => DesignLoader.Load(Path.Combine(Repository.Netlists, "autoclave-pt100-bridge-inamp.toml"));

    /// <summary>IEC 60751 R(t) for a Pt100 at t ≥ 0 °C, and its inverse (the quadratic's root).</summary>
    private static double Pt100(double t) => 100 * (1 + A * t + B * t * t);

    private static double InversePt100(double ohms) => (-A + Math.Sqrt(A * A - 4 * B * (1 - ohms / 100))) / (2 * B);

    private static double HandCelsius(int code, double gain = Gain, double offsetVolts = 0)
    {
        var plus = code * E / 65536 / gain - offsetVolts + E * Low / (High + Low);
        return InversePt100(Fixed * plus / (E - plus));
    }

    [Fact]
    public void The_table_reads_each_code_through_the_gain_the_bridge_equation_and_Callendar_Van_Dusen()
    {
        var run = Verifier.Table(Autoclave());
        var t = run.Table;
        Assert.Equal(t.Span.Count, t.Codes.Count);
        foreach (var code in new[] { 1200, 5000, 12000, 20000, 31000 })
            // The table's unit is 0.01 K: each entry is the true temperature rounded to it.
            Tolerance.AssertClose(HandCelsius(code), t.Scale.ToCelsius(t.Values[code - t.Span.FirstCode]), 0, 0.5 * t.Scale.UnitKelvin + 1e-9, $"code {code}");
        // The span's ends: 5 °C and 140 °C amplified, code = 2^16·G·V_d/E.
        double Code(double celsius) => 65536 * Gain * (Pt100(celsius) / (Pt100(celsius) + Fixed) - Low / (High + Low));
        Assert.Equal((int)Math.Ceiling(Code(5)), t.Span.FirstCode);
        Assert.Equal((int)Math.Floor(Code(140)), t.Span.LastCode);
    }

    [Fact]
    public void A_gain_error_and_offset_written_with_a_sign_are_taken_as_the_firmware_knows_them()
    {
        // "+0.5 %" and "+200 uV" are known values: V_out = G·(1 + ε)·(V_d + V_os), inverted with both.
        var design = Autoclave() with
        {
            Amplifier = Autoclave().Amplifier! with { GainError = 0.005, GainErrorSigned = true, OffsetVolts = 200e-6, OffsetSigned = true, OffsetDriftVoltsPerKelvin = 0 },
        };
        var t = Verifier.Table(design).Table;
        foreach (var code in new[] { 2000, 15000, 30000 })
            Tolerance.AssertClose(HandCelsius(code, Gain * 1.005, 200e-6), t.Scale.ToCelsius(t.Values[code - t.Span.FirstCode]), 0,
                0.5 * t.Scale.UnitKelvin + 1e-9, $"code {code}");
    }

    [Fact]
    public void Verify_table_passes_the_example_within_its_budget_and_catches_a_table_made_for_another_gain()
    {
        var design = Autoclave();
        var csv = TableCsvRenderer.Render(Verifier.Table(design, new TableRequest { BoundKelvin = 0.05 }).Table);
        var verified = Verifier.VerifyTable(design, csv, "table.csv");
        Assert.True(verified.Passes);
        // A table made for a gain 1 % higher reads V_d 1 % low: about 1 % of 135 K at the top, over the 0.5 K budget.
        var other = design with { Amplifier = design.Amplifier! with { Gain = 20.2 } };
        Assert.False(Verifier.VerifyTable(design, TableCsvRenderer.Render(Verifier.Table(other).Table), "wrong.csv").Passes);
    }

    [Fact]
    public void The_fault_thresholds_through_the_amplifier_by_the_bridge_equation()
    {
        // Ratiometric: code = 2^16·V_out/E. The output range 0.02 V .. 2.45 V clips every fault that ties V+ to a rail:
        // an open sensor (V_d ≈ E − V−, ×20) reads 2^16·2.45/2.5 and a shorted one (V_d = −V−) 2^16·0.02/2.5.
        double Round(double x) => Math.Floor(x + 0.5);
        var f = Verifier.Table(Autoclave()).Faults;
        Assert.Equal((int)Round(65536 * 2.45 / 2.5), f.For(FaultKind.SensorOpen).MinCode);
        Assert.Equal((int)Round(65536 * 0.02 / 2.5), f.For(FaultKind.SensorShorted).MaxCode);
        // The healthy ends: every corner of the halves (±0.05 %), the gain error (±0.05 %) and the input-referred offset
        // (10 µV + 0.1 µV/K·15 K + 10^(−5)·E = 36.5 µV), by hand.
        const double tol = 0.0005, gainError = 0.0005, offset = 10e-6 + 0.1e-6 * 15 + 1e-5 * E;
        var ratioMax = Low * (1 + tol) / (High * (1 - tol) + Low * (1 + tol));
        var ratioMin = Low * (1 - tol) / (High * (1 + tol) + Low * (1 - tol));
        var lowest = (int)Round(65536 / E * Gain * (1 - gainError) * (E * (Pt100(5) / (Pt100(5) + Fixed * (1 + tol)) - ratioMax) - offset));
        var highest = (int)Round(65536 / E * Gain * (1 + gainError) * (E * (Pt100(140) / (Pt100(140) + Fixed * (1 - tol)) - ratioMin) + offset));
        Assert.Equal(lowest, f.LowestValidCode);
        Assert.Equal(highest, f.HighestValidCode);
        Assert.True(f.IsFault(f.For(FaultKind.SensorOpen).MinCode) && f.IsFault(f.For(FaultKind.SensorShorted).MaxCode));
        Assert.False(f.IsFault(lowest) || f.IsFault(highest));
    }

    [Fact]
    public void The_header_says_the_amplifier()
    {
        var header = CHeaderRenderer.Render(Verifier.Table(Autoclave()).Header, TestRun.Provenance);
        Assert.Contains("through the amplifier", header);
        Assert.Contains("Amplifier: output = 20 * (V_d + 0 V)", header);
    }
}
