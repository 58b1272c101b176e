using ThermVerify.Api;
using ThermVerify.Design;
using ThermVerify.Firmware;

namespace ThermVerify.Tests.Firmware;

/// <summary>
/// The firmware table of a bridge: a code stands for V_d = code·Q (bin middle, IEEE Std 1241; Q = E/2^16 with the
/// ratiometric reference), the sensor's half for V+ = V_d + E·R_low/(R_high + R_low) (the bridge equation, Kirchhoff's
/// laws on two dividers), the sensor for R_s = R_f·V+/(E − V+) (sensor low, Ohm's law), and the temperature for
/// IEC 60751's Callendar–Van Dusen equation (from memory: A = 3.9083e-3, B = −5.775e-7, C = −4.183e-12 below 0 °C),
/// all by hand here.
/// </summary>
public class BridgeTableTests
{
    private const double A = 3.9083e-3, B = -5.775e-7, C = -4.183e-12;

    /// <summary>IEC 60751 R(t) for a Pt1000 (from memory).</summary>
    private static double Pt1000(double t) => 1000 * (1 + A * t + B * t * t + (t < 0 ? C * (t - 100) * t * t * t : 0));

    /// <summary>Its inverse: the quadratic's root for t ≥ 0, Newton's method on the quartic below 0 °C.</summary>
    private static double InversePt1000(double ohms)
    {
        var t = (-A + Math.Sqrt(A * A - 4 * B * (1 - ohms / 1000))) / (2 * B);
        if (ohms >= 1000) return t;
        for (var i = 0; i < 50; i++)
        {
            var slope = 1000 * (A + 2 * B * t + C * (4 * t * t * t - 300 * t * t));
            t -= (Pt1000(t) - ohms) / slope;
        }
        return t;
    }

    /// <summary>By hand: V_d = code·E/2^16, V+ = V_d + E·R_low/(R_high + R_low), R_s = R_f·V+/(E − V+), then IEC 60751.</summary>
    private static double HandCelsius(int code, double e, double fixedOhms, double high, double low)
    {
        var plus = code * e / 65536 + e * low / (high + low);
        return InversePt1000(fixedOhms * plus / (e - plus));
    }

    private static FrontEndDesign Example(string name) => DesignLoader.Load(Path.Combine(Repository.Netlists, name));

    [Theory]
    [InlineData("fermenter-pt1000-bridge.toml", 2.5, 4990, 4990, 953, new[] { 432, 1000, 2500, 4000, 5200 })]
    [InlineData("brine-chiller-bridge-differential.toml", 3.3, 10000, 10000, 1000, new[] { -864, -500, -1, 0, 1, 400, 829 })]
    public void The_table_reads_each_code_through_the_bridge_equation_and_Callendar_Van_Dusen(
        string example, double e, double fixedOhms, double high, double low, int[] codes)
    {
        var run = Verifier.Table(Example(example));
        var t = run.Table;
        Assert.Equal(t.Span.Count, t.Codes.Count);
        foreach (var code in codes)
        {
            var value = t.Values[code - t.Span.FirstCode];
            // The table's unit is 0.01 K: each entry is the true temperature rounded to it.
            Tolerance.AssertClose(HandCelsius(code, e, fixedOhms, high, low), t.Scale.ToCelsius(value), 0, 0.5 * t.Scale.UnitKelvin + 1e-9, $"code {code}");
        }
    }

    [Fact]
    public void The_differential_bridge_reads_signed_codes_either_side_of_its_balance_at_0_degC()
    {
        // Balanced at 0 °C (every ratio 1:10): V_d at −40 °C is 3.3·(R(−40)/(R(−40) + 10k) − 1/11), about −44 mV, code ≈ −873.
        var span = Verifier.Table(Example("brine-chiller-bridge-differential.toml")).Table.Span;
        double Code(double celsius) => 65536 * (Pt1000(celsius) / (Pt1000(celsius) + 10000) - 1.0 / 11);
        Assert.Equal((int)Math.Ceiling(Code(-40)), span.FirstCode);
        Assert.Equal((int)Math.Floor(Code(40)), span.LastCode);
        Assert.True(span.FirstCode < 0 && span.LastCode > 0 && span.TemperatureRisesWithCode);
    }

    [Fact]
    public void The_fault_thresholds_of_the_single_ended_bridge_by_the_bridge_equation()
    {
        // Ratiometric: E cancels, code = 2^16·V_d/E. Corners: the fixed resistor and both opposite arms at ±0.1 %.
        // An open sensor puts V+ at E: code 2^16·(1 − ratio), lowest where the opposite ratio is highest; a shorted one
        // V+ at 0 V: V_d = −V− < 0, the bottom code 0 of the unsigned converter.
        double Round(double x) => Math.Floor(x + 0.5);
        const double tol = 0.001;
        var ratioMax = 953 * (1 + tol) / (4990 * (1 - tol) + 953 * (1 + tol));
        var ratioMin = 953 * (1 - tol) / (4990 * (1 + tol) + 953 * (1 - tol));
        var openMin = (int)Round(65536 * (1 - ratioMax));
        var lowest = (int)Round(65536 * (Pt1000(0) / (Pt1000(0) + 4990 * (1 + tol)) - ratioMax));
        var highest = (int)Round(65536 * (Pt1000(150) / (Pt1000(150) + 4990 * (1 - tol)) - ratioMin));

        var f = Verifier.Table(Example("fermenter-pt1000-bridge.toml")).Faults;
        Assert.Equal(openMin, f.For(FaultKind.SensorOpen).MinCode);
        Assert.Equal(openMin, f.For(FaultKind.FixedShorted).MinCode);
        Assert.Equal(0, f.For(FaultKind.SensorShorted).MaxCode);
        Assert.Equal(0, f.For(FaultKind.FixedOpen).MaxCode);
        Assert.Equal(lowest, f.LowestValidCode);
        Assert.Equal(highest, f.HighestValidCode);
        // The opposite high arm open (or its low arm shorted) leaves V− at 0 V: V_d = V+ = E·R_s/(R_s + R_f), lowest at
        // 0 °C with R_f at +0.1 %, about 10900, nearer the healthy codes than the open sensor; the other two put V− at E: V_d < 0, code 0.
        var oppositeMin = (int)Round(65536 * Pt1000(0) / (Pt1000(0) + 4990 * (1 + tol)));
        Assert.Equal(oppositeMin, f.For(FaultKind.OppositeHighOpen).MinCode);
        Assert.Equal(oppositeMin, f.For(FaultKind.OppositeLowShorted).MinCode);
        Assert.Equal(0, f.For(FaultKind.OppositeLowOpen).MaxCode);
        Assert.Equal(0, f.For(FaultKind.OppositeHighShorted).MaxCode);
        Assert.Equal((lowest + 1) / 2, f.FaultBelowCode);
        Assert.Equal(highest + (oppositeMin - highest) / 2, f.FaultAboveCode);
    }

    [Fact]
    public void The_fault_thresholds_of_the_differential_bridge_are_signed_codes()
    {
        // A shorted sensor: V_d = −E·ratio, code −2^16·ratio (≈ −5958), least negative at the smallest ratio; an open one
        // V_d = E·(1 − ratio) ≈ 3.0 V, beyond +full scale: the top signed code 32767.
        double Round(double x) => Math.Floor(x + 0.5);
        const double tol = 0.0005;
        var ratioMin = 1000 * (1 - tol) / (10000 * (1 + tol) + 1000 * (1 - tol));
        var ratioMax = 1000 * (1 + tol) / (10000 * (1 - tol) + 1000 * (1 + tol));
        var shortedMax = (int)Round(-65536 * ratioMin);
        var lowest = (int)Round(65536 * (Pt1000(-40) / (Pt1000(-40) + 10000 * (1 + tol)) - ratioMax));

        var f = Verifier.Table(Example("brine-chiller-bridge-differential.toml")).Faults;
        Assert.Equal(shortedMax, f.For(FaultKind.SensorShorted).MaxCode);
        Assert.Equal((int)Round(-65536 * ratioMax), f.For(FaultKind.SensorShorted).MinCode);
        Assert.Equal(32767, f.For(FaultKind.SensorOpen).MinCode);
        Assert.Equal(lowest, f.LowestValidCode);
        Assert.Equal(shortedMax + (lowest - shortedMax + 1) / 2, f.FaultBelowCode);
        // An opposite arm that puts V− at E: V_d = V+ − E ≈ −3.0 V, beyond −full scale, the bottom code; at 0 V: V_d = V+,
        // lowest at −40 °C with R_f at +0.05 %, about 5090.
        Assert.Equal(-32768, f.For(FaultKind.OppositeLowOpen).MaxCode);
        Assert.Equal((int)Round(65536 * Pt1000(-40) / (Pt1000(-40) + 10000 * (1 + tol))), f.For(FaultKind.OppositeHighOpen).MinCode);
        Assert.True(f.IsFault(-5958) && f.IsFault(32767) && !f.IsFault(0) && !f.IsFault(-800));
    }

    [Theory]
    [InlineData("fermenter-pt1000-bridge.toml")]
    [InlineData("brine-chiller-bridge-differential.toml")]
    public void Verify_table_passes_the_bridge_table_and_catches_one_made_for_another_opposite_half(string example)
    {
        var design = Example(example);
        var csv = TableCsvRenderer.Render(Verifier.Table(design).Table);
        Assert.True(Verifier.VerifyTable(design, csv, "table.csv").Passes);
        // The same table made for an opposite low arm 2 % higher shifts V− by about 2 % of its ~0.3 V: many kelvin.
        var other = design with { Bridge = design.Bridge! with { LowOhms = design.Bridge.LowOhms * 1.02 } };
        var wrong = TableCsvRenderer.Render(Verifier.Table(other).Table);
        Assert.False(Verifier.VerifyTable(design, wrong, "wrong.csv").Passes);
    }

    [Fact]
    public void The_header_of_a_differential_bridge_takes_signed_codes()
    {
        var run = Verifier.Table(Example("brine-chiller-bridge-differential.toml"));
        var header = CHeaderRenderer.Render(run.Header, TestRun.Provenance);
        Assert.Contains("_temperature(int16_t code)", header);
        Assert.Contains("Bridge:", header);
    }
}
