using ThermVerify.Circuits;
using ThermVerify.Simulation.Mna;
using ThermVerify.Simulation.Stamps;

namespace ThermVerify.Simulation.Switched;

/// <summary>
/// The op-amp macro-model (<see cref="OpAmpStamp"/>) in its linear region, and the conditions under which that
/// region holds. Linearised where both of its nonlinearities are at their centre: input difference v_d = 0 (the
/// slew-limiting tanh is then exactly g_m·v_d with slope g_m) and the output-clamp input at mid-swing (the soft
/// clamp is then the identity to the last bit). The stamp itself loads the model there, so the linear model is the
/// time-stepping engine's own, not a copy.
/// <para>
/// Conditions, for a tolerance δ in volts. Slewing: the stage delivers I_max·tanh(g_m·v_d/I_max), which is
/// g_m·(s·tanh(v_d/s)) with s = I_max/g_m = SR/(2π·GBW) (the model sets I_max = SR·C_p and g_m/C_p = 2π·GBW). What the
/// linear model leaves out is a current into the pole node, the <see cref="SlewResidual"/>; its effect is carried to
/// first order and judged on the node voltages where a value can be read (<see cref="IntervalMap"/>), so the monitor
/// here only caps |v_d| at s/4, where the first order is the effect to within a sixteenth. An instantaneous bound on the
/// residual referred to the input (|v_d|³/(3s²) ≤ δ) was both too strict for a fast follower kicked briefly (the effect
/// is gone long before the sample) and not safe for a slow one (the residual accumulates in the pole: 13 µV at 1 mV/µs).
/// Output clamp (soft clamp of knee width w): its value departs from the identity by at most
/// w·(e^(−d_low/w) + e^(−d_high/w)) for distances d from the swing limits (softplus tail ln(1 + e^(−y)) ≤ e^(−y)), so
/// d ≥ w·ln(2w/δ) keeps it within δ; its slope error is then below δ/w; conservative inside a feedback loop, which
/// divides such errors by the loop gain.
/// </para>
/// </summary>
internal sealed class OpAmpLinearRegion
{
    private readonly OpAmpStamp stamp;
    private readonly int plus, minus, last, ground;
    private readonly double offset, centre;

    public OpAmpLinearRegion(BoundSystem system, OpAmpStamp stamp, double toleranceVolts)
    {
        this.stamp = stamp;
        var amp = (OpAmp)stamp.Element;
        var layout = system.Layout;
        ground = layout.Ground;
        plus = layout.IndexOfNode(amp.NonInverting);
        minus = layout.IndexOfNode(amp.Inverting);
        // The clamp acts on the last pole node: OpAmp.ExtraUnknowns lists [pole, (pole2), drive, current].
        last = layout.ExtraStart[system.ElementIndex(amp.Name)] + (amp.SecondPoleHertz is null ? 0 : 1);
        offset = amp.InputOffsetVolts;
        var (low, high) = (amp.OutputLowVolts, amp.OutputHighVolts);
        centre = (double.IsFinite(low), double.IsFinite(high)) switch
        {
            (true, true) => (low + high) / 2,
            (true, false) => low + 1e3 * amp.OutputKneeVolts,
            (false, true) => high - 1e3 * amp.OutputKneeVolts,
            _ => 0,
        };

        var monitors = new List<LinearMonitor>();
        if (double.IsFinite(amp.SlewRateVoltsPerSecond))
        {
            var scale = amp.SlewRateVoltsPerSecond / (2 * Math.PI * amp.GainBandwidthHertz);
            var limit = SlewCapFraction * scale;
            monitors.Add(Monitor(amp.Name, "the input difference V(+) − V(−) + offset (slew limit)", [plus, minus], [1, -1], offset, -limit, limit));
            var pole = layout.ExtraStart[system.ElementIndex(amp.Name)];
            Residual = new SlewResidual(amp.Name, 0, pole, stamp.LinearTransconductance, scale);
        }
        if (double.IsFinite(low) || double.IsFinite(high))
        {
            var margin = amp.OutputKneeVolts * Math.Max(0, Math.Log(2 * amp.OutputKneeVolts / toleranceVolts));
            monitors.Add(Monitor(amp.Name, "the unclamped output (swing limits)", [last], [1], 0, low + margin, high - margin));
        }
        Monitors = monitors;
    }

    /// <summary>
    /// The largest input difference, as a fraction of s, at which the slewing stage counts as nearly linear: its slope is
    /// then at least 1 − (1/4)² of g_m, so the residual's effect, carried to first order (<see cref="SlewResidual"/>),
    /// leaves out a second-order term below a sixteenth of itself.
    /// </summary>
    public const double SlewCapFraction = 0.25;

    /// <summary>The slewing stage's residual (monitor index relative to this op-amp's <see cref="Monitors"/>), or null without a slew limit.</summary>
    public SlewResidual? Residual { get; }

    public IReadOnlyList<LinearMonitor> Monitors { get; }

    /// <summary>Adds the stamp's load linearised at the centre of its linear region; <paramref name="scratch"/> is a vector the size of the solution.</summary>
    public void LoadLinear(LoadContext c, double[] scratch)
    {
        Array.Clear(scratch);
        if (plus != ground)
            scratch[plus] = -offset;
        else
            scratch[minus] = offset;
        scratch[last] = centre;
        var saved = c.Solution;
        c.Solution = scratch;
        try
        {
            stamp.Load(c);
        }
        finally
        {
            c.Solution = saved;
        }
    }

    private LinearMonitor Monitor(string element, string condition, int[] indices, double[] coefficients, double constant, double low, double high)
    {
        var kept = indices.Select((index, k) => (index, k)).Where(p => p.index != ground).ToArray();
        return new LinearMonitor(element, condition, [.. kept.Select(p => p.index)], [.. kept.Select(p => coefficients[p.k])], constant, low, high);
    }
}
