using ThermVerify.Circuits;
using ThermVerify.Design;
using static ThermVerify.FrontEnd.FrontEndNodes;

namespace ThermVerify.FrontEnd;

/// <summary>
/// An amplifier between a bridge's two outputs, built from controlled sources both engines have: the offset in series
/// with the positive input (a DC source, and where the drift follows the sweep a VCVS on a 1 A, 1 Ω-with-tempco stage:
/// V_os − 1000·D + 1000·D·(1 + 10⁻³·(T − 25 °C)) = V_os + D·(T − 25 °C)), the differential gain G·(1 + ε) on
/// (V+ + V_os − V−) to ground, two VCVS of G·f/2 each in series for the common mode (V+ + V−)/2 (f = ±10^(−CMRR/20)),
/// and the input bias currents drawn from both outputs. The output is ideal (no output resistance; a swing beyond the
/// amplifier's output range is reported by the check, not clipped).
/// </summary>
internal static class AmplifierStage
{
    /// <summary>The drift stage's tempco: small enough that its resistor stays positive far below any sensor's range.</summary>
    private const double DriftStageTempco = 1e-3;

    /// <param name="boardCelsius">The board's temperature when the design fixes one; null: the drift follows the sweep.</param>
    /// <param name="celsius">The temperature of a circuit built for one; null for a sweep.</param>
    public static void Add(List<Element> elements, AmplifierSpec a, double? boardCelsius, double? celsius)
    {
        var at = boardCelsius ?? celsius;
        if (at is { } t || a.OffsetDriftVoltsPerKelvin == 0)
            elements.Add(new VoltageSource("Vinaos", AmplifierOffsetInput, Divider, new DcWaveform(a.OffsetVoltsAt(at ?? 25))));
        else
        {
            var scale = a.OffsetDriftVoltsPerKelvin / DriftStageTempco;
            elements.Add(new CurrentSource("Iinatc", Circuit.Ground, AmplifierDriftStage, new DcWaveform(1)));
            elements.Add(new Resistor("Rinatc", AmplifierDriftStage, Circuit.Ground, 1, DriftStageTempco));
            elements.Add(new VoltageSource("Vinaos", AmplifierOffsetBase, Divider, new DcWaveform(a.OffsetVolts - scale)));
            elements.Add(new Vcvs("Einadrift", AmplifierOffsetInput, AmplifierOffsetBase, AmplifierDriftStage, Circuit.Ground, scale));
        }
        var differential = a.CommonModeFraction == 0 ? AmplifierOutput : AmplifierDifferential;
        elements.Add(new Vcvs("Einadiff", differential, Circuit.Ground, AmplifierOffsetInput, BridgeNegative, a.Gain * (1 + a.GainError)));
        if (a.CommonModeFraction != 0)
        {
            var half = a.Gain * a.CommonModeFraction / 2;
            elements.Add(new Vcvs("Einacmp", AmplifierCommonMode, AmplifierDifferential, Divider, Circuit.Ground, half));
            elements.Add(new Vcvs("Einacmn", AmplifierOutput, AmplifierCommonMode, BridgeNegative, Circuit.Ground, half));
        }
        if (a.BiasCurrentAmperes != 0)
        {
            elements.Add(new CurrentSource("Iinabp", Divider, Circuit.Ground, new DcWaveform(a.BiasCurrentAmperes)));
            elements.Add(new CurrentSource("Iinabn", BridgeNegative, Circuit.Ground, new DcWaveform(a.BiasCurrentAmperes)));
        }
    }

    /// <summary>
    /// The amplifier's output in closed form for the bridge's two outputs (Kirchhoff's laws on the controlled sources):
    /// G·(1 + ε)·(V+ − V− + V_os(T)) + G·f·(V+ + V−)/2.
    /// </summary>
    public static double OutputVolts(AmplifierSpec a, double positiveVolts, double negativeVolts, double boardCelsius) =>
        a.Gain * (1 + a.GainError) * (positiveVolts - negativeVolts + a.OffsetVoltsAt(boardCelsius))
        + a.Gain * a.CommonModeFraction * (positiveVolts + negativeVolts) / 2;
}
