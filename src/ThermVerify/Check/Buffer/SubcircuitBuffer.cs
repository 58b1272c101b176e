using System.Numerics;
using ThermVerify.Circuits;
using ThermVerify.FrontEnd;
using ThermVerify.Simulation;

namespace ThermVerify.Check.Buffer;

/// <summary>
/// The buffer's simulated checks when its op-amp is the design's own SPICE subcircuit, run by the check's engine
/// (ngspice) instead of the built-in macro-model. The subcircuit is a black box, so the loop is broken where it is
/// closed: a voltage source with a 1 V AC value between the node that feeds back (the op-amp's output, or the gain
/// divider's tap) and the inverting input, and T = −v(feedback)/v(inverting input) (Middlebrook's voltage injection,
/// R. D. Middlebrook, "Measurement of loop gain in feedback systems", Int. J. Electronics 38, 1975, from memory;
/// exact when the inverting input's impedance is large against the feedback node's, as at an op-amp input). The DC
/// operating point is unchanged (the source is 0 V at DC). The step and the noise come from the engine's transient
/// and noise analyses; the noise is the total at the node (the engine gives no split by generator), of which the
/// sampling switch's share is its kT/C.
/// </summary>
internal static class SubcircuitBuffer
{
    public const string InjectionSource = "Vloop";
    private const string InjectionNode = "loop_in";
    private const int StepSamples = 3000;
    private const string ExcitationSource = "Vexc";

    public const string Method =
        "AC analysis by the check's engine of the front end during an acquisition (switch closed) with your op-amp subcircuit; " +
        "loop broken by voltage injection at the inverting input (Middlebrook), T = −v(feedback)/v(input)";

    /// <summary>T(f) of the loop around the subcircuit in <paramref name="circuit"/>.</summary>
    public static LoopGainResult LoopGain(Circuit circuit, FrequencySweep sweep, ICheckEngine engine)
    {
        var amp = circuit.Elements.OfType<ExternalOpAmp>().Single();
        var elements = circuit.Elements.Select(e => e == amp ? amp with { Inverting = InjectionNode } : e).ToList();
        elements.Add(new VoltageSource(InjectionSource, InjectionNode, amp.Inverting, new DcWaveform(0), AcMagnitude: 1));
        var broken = new Circuit(elements, circuit.TemperatureCelsius);
        var f = sweep.FrequenciesHertz;
        var pointsPerDecade = (int)Math.Round((f.Count - 1) / Math.Log10(f[^1] / f[0]));
        var (frequencies, volts) = engine.AcSweep(broken, f[0], f[^1], Math.Max(1, pointsPerDecade), [amp.Inverting, InjectionNode]);
        var gain = frequencies.Select((_, k) => -volts[0][k] / volts[1][k]).ToArray();
        return new LoopGainResult(frequencies, gain, hertz => Interpolate(frequencies, gain, hertz), []);
    }

    /// <summary>The step response at <paramref name="node"/> on an even grid of times, from the engine's transient.</summary>
    public static (double[] TimesSeconds, double[] Volts) Step(Circuit circuit, TransientOptions options, string node, ICheckEngine engine)
    {
        var run = engine.StartTransient(circuit, options);
        var times = new double[StepSamples + 1];
        var volts = new double[StepSamples + 1];
        for (var i = 0; i <= StepSamples; i++)
        {
            times[i] = options.StopTimeSeconds * i / StepSamples;
            volts[i] = run.VoltageAt(Math.Max(times[i], options.StopTimeSeconds / StepSamples / 2), node);
        }
        return (times, volts);
    }

    /// <summary>RMS noise at <paramref name="node"/> over the sweep, integrated as a power law between points (as the built-in noise result does).</summary>
    public static double NoiseRmsVolts(Circuit circuit, string node, FrequencySweep sweep, ICheckEngine engine)
    {
        var f = sweep.FrequenciesHertz;
        var pointsPerDecade = (int)Math.Round((f.Count - 1) / Math.Log10(f[^1] / f[0]));
        // SPICE's noise analysis refers the noise to an input with an AC value; the output density does not depend on it.
        var input = new Circuit(circuit.Elements.Select(e => e is VoltageSource { Name: ExcitationSource } v ? v with { AcMagnitude = 1 } : e),
            circuit.TemperatureCelsius);
        var (frequencies, density) = engine.NoiseSweep(input, node, ExcitationSource, f[0], f[^1], Math.Max(1, pointsPerDecade));
        var total = 0.0;
        for (var k = 1; k < frequencies.Length; k++)
        {
            double f0 = frequencies[k - 1], f1 = frequencies[k], s0 = density[k - 1] * density[k - 1], s1 = density[k] * density[k];
            if (!(f1 > f0)) continue;
            if (s0 <= 0 || s1 <= 0)
            {
                total += 0.5 * (s0 + s1) * (f1 - f0);
                continue;
            }
            var e = Math.Log(s1 / s0) / Math.Log(f1 / f0) + 1;
            total += Math.Abs(e) < 1e-9 ? s0 * f0 * Math.Log(f1 / f0) : s0 * f0 * (Math.Pow(f1 / f0, e) - 1) / e;
        }
        return Math.Sqrt(total);
    }

    /// <summary>T between sweep points: magnitude and phase linear in log f (the crossover is refined on it).</summary>
    private static Complex Interpolate(double[] f, Complex[] t, double hertz)
    {
        var k = Array.BinarySearch(f, hertz);
        if (k >= 0) return t[k];
        k = Math.Clamp(~k, 1, f.Length - 1);
        var u = (Math.Log(hertz) - Math.Log(f[k - 1])) / (Math.Log(f[k]) - Math.Log(f[k - 1]));
        var magnitude = Math.Exp(Math.Log(t[k - 1].Magnitude) + u * (Math.Log(t[k].Magnitude) - Math.Log(t[k - 1].Magnitude)));
        var dp = t[k].Phase - t[k - 1].Phase;
        dp -= 2 * Math.PI * Math.Round(dp / (2 * Math.PI));
        return Complex.FromPolarCoordinates(magnitude, t[k - 1].Phase + u * dp);
    }
}
