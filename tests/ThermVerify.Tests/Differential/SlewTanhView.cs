using ThermVerify.Circuits;
using ThermVerify.Simulation;

namespace ThermVerify.Tests.Differential;

/// <summary>
/// The built-in engine's op-amps as ngspice's twin has them in .ac and .noise. The engine's macro-model is linear in DC
/// and AC by design (its input stage's tanh limits slewing, a dynamic effect: <c>OpAmpStamp</c>), while the twin's
/// B-source applies the tanh in every analysis, so ngspice linearises the input stage at g_m·sech²(x₀), with
/// x₀ = g_m·v_d0/I_max = 2π·GBW·v_d0/SR at the operating point. In a follower the factor is 1 − x₀² (2.3e-7 for
/// v_d0 = 22 µV at 21.6 /V), enough to move the response by 2e-6 dB. Here each slewing op-amp's open-loop gain and
/// gain-bandwidth are both scaled by sech²(x₀), which scales g_m and leaves the pole capacitor (and so the slew
/// limit) as it was. Agreement with ngspice in this view explains a disagreement as that modelling choice.
/// </summary>
internal static class SlewTanhView
{
    public static bool Applies(Circuit circuit) => circuit.Elements.OfType<OpAmp>().Any(a => double.IsFinite(a.SlewRateVoltsPerSecond));

    /// <summary>The circuit with every slewing op-amp's transconductance at its tanh's slope at the engine's operating point.</summary>
    public static Circuit For(Circuit circuit)
    {
        var point = OperatingPoint.Solve(circuit);
        var scaled = circuit;
        foreach (var amp in circuit.Elements.OfType<OpAmp>().Where(a => double.IsFinite(a.SlewRateVoltsPerSecond)))
        {
            var vd = point.Voltage(amp.NonInverting) - point.Voltage(amp.Inverting) + amp.InputOffsetVolts;
            var x = 2 * Math.PI * amp.GainBandwidthHertz * vd / amp.SlewRateVoltsPerSecond;
            // Deep in saturation sech² underflows; the smallest positive slope keeps the macro-model valid (ngspice's is as good as zero).
            var slope = Math.Max(1 - Math.Tanh(x) * Math.Tanh(x), 1e-300);
            scaled = scaled.Replace(amp with { OpenLoopGain = amp.OpenLoopGain * slope, GainBandwidthHertz = amp.GainBandwidthHertz * slope });
        }
        return scaled;
    }
}
