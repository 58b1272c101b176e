using MathNet.Numerics.LinearAlgebra;

namespace ThermVerify.Simulation.Switched;

/// <summary>
/// One period's affine map z_{k+1} = Φ·z_k + c, kept as the augmented matrix M = [[Φ, c], [0, 1]] so that n periods
/// are Mⁿ (by repeated squaring: ⌈log₂ n⌉ squarings and at most as many products) and the periodic steady state is
/// the fixed point (I − Φ)·z = c.
/// </summary>
internal sealed class PeriodMap
{
    private readonly int r;
    private readonly Matrix<double> augmented;

    public PeriodMap(IEnumerable<IntervalMap> intervals, int stateCount)
    {
        r = stateCount;
        augmented = Matrix<double>.Build.DenseIdentity(r + 1);
        foreach (var interval in intervals)
            augmented = Augmented(interval) * augmented;
    }

    public Matrix<double> Phi => augmented.SubMatrix(0, r, 0, r);

    public Vector<double> Offset => augmented.Column(r, 0, r);

    /// <summary>z after <paramref name="periods"/> periods from <paramref name="z"/>.</summary>
    public double[] Advance(ReadOnlySpan<double> z, long periods)
    {
        var result = Matrix<double>.Build.DenseIdentity(r + 1);
        var square = augmented;
        for (var n = periods; n > 0; n >>= 1)
        {
            if ((n & 1) != 0)
                result = square * result;
            if (n > 1)
                square = square * square;
        }
        var state = Vector<double>.Build.Dense(r + 1);
        for (var i = 0; i < r; i++)
            state[i] = z[i];
        state[r] = 1;
        return (result * state).SubVector(0, r).ToArray();
    }

    /// <summary>The state that one period maps onto itself: (I − Φ)·z = c.</summary>
    public double[] FixedPoint()
    {
        var system = Matrix<double>.Build.DenseIdentity(r) - Phi;
        var s = system.Svd(computeVectors: false).S;
        if (!(s[^1] > 1e-14 * s[0]))
            throw new SimulationException(
                "The switched circuit has no unique periodic steady state: a mode neither decays nor grows over a period " +
                "(a capacitor without any resistive path, or an undamped loop); add the missing path or simulate a finite number of periods.");
        return system.LU().Solve(Offset).ToArray();
    }

    /// <summary>
    /// The periodic solution of d_{k+1} = Φ·d_k + <paramref name="added"/>: (I − Φ)⁻¹·added, for a deviation that every
    /// period adds to and the period map carries (<see cref="IntervalMap"/>'s slew residuals in the steady state).
    /// </summary>
    public double[] Periodic(ReadOnlySpan<double> added)
    {
        var system = Matrix<double>.Build.DenseIdentity(r) - Phi;
        return system.LU().Solve(Vector<double>.Build.Dense(added.ToArray())).ToArray();
    }

    private Matrix<double> Augmented(IntervalMap interval)
    {
        var m = Matrix<double>.Build.DenseIdentity(r + 1);
        var phi = interval.Phi;
        var gamma = interval.Gamma;
        for (var i = 0; i < r; i++)
        {
            for (var k = 0; k < r; k++)
                m[i, k] = phi[i * r + k];
            m[i, r] = gamma[i];
        }
        return m;
    }
}
