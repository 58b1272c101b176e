namespace ThermVerify.Circuits;

/// <summary>
/// The op-amp macro-model in SPICE cards, element for element as the engine stamps it: a behavioural
/// transconductance (tanh-limited when a slew rate is given) into R_p ∥ C_p, an optional second pole,
/// the output clamp as a behavioural voltage (softplus knees), r_o, and the bias currents. Internal nodes
/// are named after the op-amp.
/// </summary>
internal static class SpiceOpAmp
{
    private const double PoleOhms = 1e3;

    public static void Write(OpAmp amp, SpiceDeckBuilder deck)
    {
        static string N(double v) => SpiceDeckBuilder.Number(v);
        var name = amp.Name;
        var pole = $"{name}_pole";
        var gm = amp.OpenLoopGain / PoleOhms;
        var cp = amp.OpenLoopGain / (2 * Math.PI * PoleOhms * amp.GainBandwidthHertz);
        var vd = $"(v({amp.NonInverting})-v({amp.Inverting})+({N(amp.InputOffsetVolts)}))";
        var current = double.IsFinite(amp.SlewRateVoltsPerSecond)
            ? $"{N(amp.SlewRateVoltsPerSecond * cp)}*tanh({N(gm)}*{vd}/{N(amp.SlewRateVoltsPerSecond * cp)})"
            : $"{N(gm)}*{vd}";
        deck.Comment($"op-amp {name}: A0 {N(amp.OpenLoopGain)}, GBW {N(amp.GainBandwidthHertz)} Hz");
        deck.Card($"{SpiceDeckBuilder.Name('B', name + "_gm")} 0 {pole} I='{current}'");
        deck.Card($"{SpiceDeckBuilder.Name('R', name + "_pole")} {pole} 0 {N(PoleOhms)}");
        deck.Card($"{SpiceDeckBuilder.Name('C', name + "_pole")} {pole} 0 {N(cp)}");
        var last = pole;
        if (amp.SecondPoleHertz is { } f2)
        {
            last = $"{name}_pole2";
            deck.Card($"{SpiceDeckBuilder.Name('G', name + "_pole2")} 0 {last} {pole} 0 {N(1 / PoleOhms)}");
            deck.Card($"{SpiceDeckBuilder.Name('R', name + "_pole2")} {last} 0 {N(PoleOhms)}");
            deck.Card($"{SpiceDeckBuilder.Name('C', name + "_pole2")} {last} 0 {N(1 / (2 * Math.PI * PoleOhms * f2))}");
        }
        var drive = $"{name}_drive";
        var w = N(amp.OutputKneeVolts);
        // Softplus written so that exp never overflows: sp(x) = (x + |x|)/2 + ln(1 + e^−|x|).
        string Softplus(double limit)
        {
            var x = $"((v({last})-({N(limit)}))/{w})";
            return $"{w}*(({x}+abs({x}))/2+ln(1+exp(-abs({x}))))";
        }
        var clamp = $"v({last})";
        if (double.IsFinite(amp.OutputLowVolts))
            clamp = $"{N(amp.OutputLowVolts)}+{Softplus(amp.OutputLowVolts)}";
        if (double.IsFinite(amp.OutputHighVolts))
            clamp += $"-{Softplus(amp.OutputHighVolts)}";
        deck.Card($"{SpiceDeckBuilder.Name('B', name + "_drive")} {drive} 0 V='{clamp}'");
        deck.Card($"{SpiceDeckBuilder.Name('R', name + "_out")} {drive} {amp.Output} {N(amp.OutputResistanceOhms)}");
        if (amp.NonInvertingBiasAmperes != 0)
            deck.Card($"{SpiceDeckBuilder.Name('I', name + "_biasp")} {amp.NonInverting} 0 dc {N(amp.NonInvertingBiasAmperes)}");
        if (amp.InvertingBiasAmperes != 0)
            deck.Card($"{SpiceDeckBuilder.Name('I', name + "_biasm")} {amp.Inverting} 0 dc {N(amp.InvertingBiasAmperes)}");
    }
}
