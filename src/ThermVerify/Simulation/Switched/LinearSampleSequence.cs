namespace ThermVerify.Simulation.Switched;

/// <summary>
/// A node read once a period (as a sampling switch opens) in a linear switched circuit, conversion n = 0, 1, …, as
/// exact propagation has it: the reads of the first <see cref="EarlyVolts"/>.Length conversions as they are (the
/// schedules still starting there, so the periods differ), then, from conversion n₀ = EarlyVolts.Length on, every period
/// alike: s_n = w·z_n + d with z_(n+1) = Φ·z_n + c, z the state at the start of conversion n's period. Any number of
/// conversions follows from it without stepping a period at a time (powers and geometric sums of Φ).
/// The arrays are never changed after the engine makes them.
/// </summary>
/// <param name="EarlyVolts">s_0 … s_(n₀−1).</param>
/// <param name="StateCount">r, the length of z.</param>
/// <param name="Phi">Φ, row-major r×r: one period of the regular pattern.</param>
/// <param name="Offset">c: what one period adds.</param>
/// <param name="State">z_(n₀).</param>
/// <param name="Row">w: the read as a row over the period's starting state.</param>
/// <param name="Constant">d.</param>
internal sealed record LinearSampleSequence(double[] EarlyVolts, int StateCount, double[] Phi, double[] Offset, double[] State, double[] Row,
    double Constant)
{
    /// <summary>n₀: the first conversion the recurrence gives.</summary>
    public int FirstRegular => EarlyVolts.Length;

    /// <summary>s_0 … s_(count−1), period after period (the reference the closed sums are tested against).</summary>
    public double[] Stepped(int count)
    {
        var r = StateCount;
        var s = new double[count];
        var z = (double[])State.Clone();
        var next = new double[r];
        for (var n = 0; n < count; n++)
        {
            if (n < FirstRegular)
            {
                s[n] = EarlyVolts[n];
                continue;
            }
            var sum = Constant;
            for (var i = 0; i < r; i++) sum += Row[i] * z[i];
            s[n] = sum;
            for (var i = 0; i < r; i++)
            {
                var v = Offset[i];
                for (var k = 0; k < r; k++) v += Phi[i * r + k] * z[k];
                next[i] = v;
            }
            (z, next) = (next, z);
        }
        return s;
    }
}
