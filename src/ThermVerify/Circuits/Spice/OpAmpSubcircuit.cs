using System.Text;
using ThermVerify.Quantities;
using static ThermVerify.Circuits.Spice.SpiceNumber;

namespace ThermVerify.Circuits.Spice;

/// <summary>
/// The built-in op-amp macro-model as a SPICE subcircuit of the same parts, so both engines solve the same equations:
/// offset source in series with the non-inverting input; bias current sources; the input transconductance into a
/// 1 kΩ ∥ C pole node (a B-source, g_m·v_d, or I_max·tanh(g_m·v_d/I_max) when a slew rate is given; the tanh is also
/// applied in DC and AC, where it changes the gain by (g_m·v_d/I_max)²/3, far below anything measurable); an
/// optional second pole; the output clamp as a B-source with the same softplus knee; the output resistance. The
/// internal resistors are noiseless (<c>noisy=0</c>) as in the built-in model; input voltage and current noise
/// (white plus 1/f) come from resistors whose thermal and flicker noise is scaled onto the pole node and the pins.
/// Common-mode warnings are not exported.
/// </summary>
internal static class OpAmpSubcircuit
{
    private const double PoleOhms = 1e3;

    // Noise generators: a resistor carrying a DC current, its thermal noise 4kT·R and, through the resistor model's
    // flicker term KF·I^AF/f with AF = 2, a 1/f part; a noiseless twin carries the same current so the generator's
    // DC voltage cancels in the controlled source that scales it.
    private const double NoiseOhms = 1e3;
    private const double NoiseBiasAmperes = 1e-3;

    public static void Write(OpAmp amp, SpiceLines deck)
    {
        var name = $"{amp.Name}_macro".ToLowerInvariant();
        deck.Line($"{SpiceLines.InstanceName('X', amp.Name)} {amp.NonInverting} {amp.Inverting} {amp.Output} {name}");
        deck.Definition(name, Subcircuit(amp, name, deck.TemperatureCelsius, deck.WritesNoiseSources));
    }

    private static string Subcircuit(OpAmp amp, string name, double celsius, bool noise)
    {
        var gm = amp.OpenLoopGain / PoleOhms;
        var cPole = amp.OpenLoopGain / (2 * Math.PI * PoleOhms * amp.GainBandwidthHertz);
        var s = new StringBuilder();
        s.AppendLine($".subckt {name} inp inn out");
        s.AppendLine("* op-amp macro-model: pins non-inverting input, inverting input, output");
        s.AppendLine($"Vos inp_os inp dc {Format(amp.InputOffsetVolts)}");
        s.AppendLine($"Ibp inp 0 dc {Format(amp.NonInvertingBiasAmperes)}");
        s.AppendLine($"Ibn inn 0 dc {Format(amp.InvertingBiasAmperes)}");
        var vd = "(v(inp_os)-v(inn))";
        if (double.IsFinite(amp.SlewRateVoltsPerSecond))
        {
            var iMax = amp.SlewRateVoltsPerSecond * cPole;
            s.AppendLine($"Bgm 0 pole I={Format(iMax)}*tanh({Format(gm / iMax)}*{vd})");
        }
        else
            s.AppendLine($"Ggm 0 pole inp_os inn {Format(gm)}");
        s.AppendLine($"Rpole pole 0 {Format(PoleOhms)} noisy=0");
        s.AppendLine($"Cpole pole 0 {Format(cPole)}");
        var last = "pole";
        if (amp.SecondPoleHertz is { } p2)
        {
            s.AppendLine($"Gp2 0 pole2 pole 0 {Format(1 / PoleOhms)}");
            s.AppendLine($"Rpole2 pole2 0 {Format(PoleOhms)} noisy=0");
            s.AppendLine($"Cpole2 pole2 0 {Format(1 / (2 * Math.PI * PoleOhms * p2))}");
            last = "pole2";
        }
        s.AppendLine(Clamp(amp, last));
        s.AppendLine($"Rout drive out {Format(amp.OutputResistanceOhms)} noisy=0");
        if (noise)
        {
            Noise(s, "en", "0", "pole", gm * amp.VoltageNoiseVoltsPerRootHertz, amp.VoltageNoiseCornerHertz, celsius);
            Noise(s, "inp", "inp", "0", amp.CurrentNoiseAmperesPerRootHertz, amp.CurrentNoiseCornerHertz, celsius);
            Noise(s, "inn", "inn", "0", amp.CurrentNoiseAmperesPerRootHertz, amp.CurrentNoiseCornerHertz, celsius);
        }
        s.Append($".ends {name}");
        return s.ToString();
    }

    /// <summary>V(drive) = clamp(V(last)) with softplus(x) written as max(x,0) + ln(1 + e^−|x|), which cannot overflow.</summary>
    private static string Clamp(OpAmp amp, string last)
    {
        var low = amp.OutputLowVolts;
        var high = amp.OutputHighVolts;
        if (!double.IsFinite(low) && !double.IsFinite(high))
            return $"Edrive drive 0 {last} 0 1";
        var w = Format(amp.OutputKneeVolts);
        string Softplus(string x) => $"(max({x},0)+ln(1+exp(-abs({x}))))";
        var v = $"v({last})";
        var expression = double.IsFinite(low) ? $"{Format(low)}+{w}*{Softplus($"({v}-{Format(low)})/{w}")}" : v;
        if (double.IsFinite(high))
            expression += $"-{w}*{Softplus($"({v}-{Format(high)})/{w}")}";
        return $"Bdrive drive 0 V={expression}";
    }

    /// <summary>A noise current of density <paramref name="density"/> (A/√Hz, white) with a 1/f corner, from <paramref name="from"/> into <paramref name="into"/>.</summary>
    private static void Noise(StringBuilder s, string tag, string from, string into, double density, double cornerHertz, double celsius)
    {
        if (density <= 0) return;
        var fourKt = 4 * PhysicalConstants.BoltzmannJoulesPerKelvin * PhysicalConstants.ToKelvin(celsius);
        // Generator voltage PSD 4kT·R·(1 + f_c/f): KF·I² = f_c·4kT/R gives the 1/f part.
        var gain = density / Math.Sqrt(fourKt * NoiseOhms);
        var kf = cornerHertz * fourKt / (NoiseOhms * NoiseBiasAmperes * NoiseBiasAmperes);
        s.AppendLine($"I{tag}_bias 0 n{tag} dc {Format(NoiseBiasAmperes)}");
        s.AppendLine($"I{tag}_twin 0 n{tag}_twin dc {Format(NoiseBiasAmperes)}");
        if (cornerHertz > 0)
        {
            s.AppendLine($"R{tag} n{tag} 0 {Format(NoiseOhms)} r{tag}_flicker");
            s.AppendLine($".model r{tag}_flicker r kf={Format(kf)} af=2");
        }
        else
            s.AppendLine($"R{tag} n{tag} 0 {Format(NoiseOhms)}");
        s.AppendLine($"R{tag}_twin n{tag}_twin 0 {Format(NoiseOhms)} noisy=0");
        s.AppendLine($"G{tag} {from} {into} n{tag} n{tag}_twin {Format(gain)}");
    }
}
