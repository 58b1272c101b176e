using MathNet.Numerics.LinearAlgebra;

namespace ThermVerify.Simulation.Switched;

/// <summary>
/// The exact step of one configuration over one duration h: z(t + h) = Φ·z(t) + γ with Φ = e^(Ah) and
/// γ = ∫₀ʰ e^(As) ds·u. With monitors (an op-amp's linear-region conditions) it also holds each monitored quantity
/// as an affine function of the starting state at check points inside the interval: the start (where algebraic
/// quantities jump) and four nested uniform grids of 32 points over h, h/32, h/32² and h/32³, so the fast transient
/// right after an edge is resolved down to h/32⁴ (each grid is one exponential and repeated products). The check
/// samples the exact trajectory at those points; it is not a bound between them.
/// <para>
/// With slew residuals (<see cref="SlewResidual"/>) the input difference is held only to a cap (a quarter of the stage's
/// scale s), and what decides is the residual's effect: the residual current, evaluated on the linear trajectory at the
/// check points (which, sorted, form a graded mesh from h/32⁴ up to h), is taken as linear between them and carried by
/// the linear model's own exponential — exact for such a current: z's deviation d_{k+1} = e^(AΔ)·d_k + c₀·i_k + c₁·(i_{k+1} − i_k),
/// c₀ and c₁ from one augmented exponential per mesh spacing (<see cref="SegmentModel.RampResponse"/>). This is the
/// first-order (Born) term of the deviation of the macro-model's trajectory from the linear one. It starts from the
/// deviation carried in from earlier intervals and is judged where a value can be read: on every circuit node at the
/// interval's end (a read inside an interval is the end of a partial interval, checked the same way).
/// </para>
/// </summary>
internal sealed class IntervalMap
{
    private const int GridPoints = 32;
    private const int Grids = 4;

    /// <summary>
    /// The share of the tolerance the first-order effect may use: the rest covers the second-order term (below a
    /// sixteenth, <see cref="OpAmpLinearRegion.SlewCapFraction"/>) and the residual's departure from linear between check
    /// points.
    /// </summary>
    private const double EffectShare = 0.5;

    private readonly int r;
    private readonly double[] phi;
    private readonly double[] gamma;
    private readonly LinearMonitor[] monitors;
    private readonly double[] checkFractions;
    private readonly double[] checkRows;
    private readonly double[] checkOffsets;
    private readonly ResidualCarrier? residuals;

    private IntervalMap(int r, double[] phi, double[] gamma, LinearMonitor[] monitors, double[] fractions, double[] rows, double[] offsets,
        ResidualCarrier? residuals)
    {
        this.r = r;
        this.phi = phi;
        this.gamma = gamma;
        this.monitors = monitors;
        checkFractions = fractions;
        checkRows = rows;
        checkOffsets = offsets;
        this.residuals = residuals;
    }

    /// <summary>Φ, row-major r×r.</summary>
    public ReadOnlySpan<double> Phi => phi;

    public ReadOnlySpan<double> Gamma => gamma;

    public bool HasChecks => monitors.Length > 0;

    /// <summary>Whether <see cref="Check"/> carries a deviation (slew residuals present).</summary>
    public bool CarriesDeviation => residuals is not null;

    public static IntervalMap Build(SegmentModel model, double h, IReadOnlyList<LinearMonitor> monitors) =>
        Build(model, h, monitors, [], [], 0);

    public static IntervalMap Build(SegmentModel model, double h, LinearAssembly assembly) =>
        Build(model, h, assembly.Monitors, assembly.Residuals, assembly.NodeNames, assembly.ToleranceVolts);

    private static IntervalMap Build(SegmentModel model, double h, IReadOnlyList<LinearMonitor> monitors, IReadOnlyList<SlewResidual> slews,
        IReadOnlyList<string> nodes, double toleranceVolts)
    {
        var r = model.StateCount;
        var (phi, gamma) = Split(model.AugmentedExponential(h), r);
        if (monitors.Count == 0)
            return new IntervalMap(r, phi, gamma, [], [], [], [], null);

        var points = new List<(double Fraction, Matrix<double> Exponential)> { (0, Matrix<double>.Build.DenseIdentity(r + 1)) };
        var steps = new Matrix<double>[Grids];
        for (var grid = 0; grid < Grids; grid++)
        {
            var spacing = Math.Pow(GridPoints, -grid - 1);
            var step = model.AugmentedExponential(h * spacing);
            steps[grid] = step;
            var power = step;
            for (var j = 1; j <= GridPoints; j++, power = power * step)
                if (grid == 0 || j < GridPoints) // a finer grid's last point is the coarser grid's first
                    points.Add((j * spacing, power));
        }
        // In time order: the mesh along which a residual's effect is carried.
        points.Sort((a, b) => a.Fraction.CompareTo(b.Fraction));

        var q = monitors.Count;
        var rows = new double[points.Count * q * r];
        var offsets = new double[points.Count * q];
        var affine = monitors.Select(model.Monitor).ToArray();
        for (var j = 0; j < points.Count; j++)
        {
            var (pointPhi, pointGamma) = Split(points[j].Exponential, r);
            for (var m = 0; m < q; m++)
            {
                var (w, w0) = affine[m];
                var offset = w0;
                for (var k = 0; k < r; k++)
                {
                    offset += w[k] * pointGamma[k];
                    var sum = 0.0;
                    for (var i = 0; i < r; i++)
                        sum += w[i] * pointPhi[i * r + k];
                    rows[(j * q + m) * r + k] = sum;
                }
                offsets[j * q + m] = offset;
            }
        }
        var fractions = points.Select(p => p.Fraction).ToArray();
        var carried = slews.Count == 0 ? null : ResidualCarrier.Build(model, h, slews, fractions, steps, nodes, EffectShare * toleranceVolts, q);
        return new IntervalMap(r, phi, gamma, [.. monitors], fractions, rows, offsets, carried);
    }

    /// <summary><paramref name="into"/> = Φ·z + γ (must not alias z).</summary>
    public void Apply(ReadOnlySpan<double> z, Span<double> into)
    {
        for (var i = 0; i < r; i++)
        {
            var sum = gamma[i];
            var row = phi.AsSpan(i * r, r);
            for (var k = 0; k < r; k++)
                sum += row[k] * z[k];
            into[i] = sum;
        }
    }

    /// <summary>The worst breach of a monitored range on this interval from state z, or null if there is none.</summary>
    public LinearityViolation? Check(ReadOnlySpan<double> z, double startSeconds, double durationSeconds) =>
        Check(z, [], startSeconds, durationSeconds);

    /// <summary>
    /// As <see cref="Check(ReadOnlySpan{double}, double, double)"/>, and with slew residuals the first-order deviation
    /// too: <paramref name="deviation"/> (z's deviation carried in) becomes the deviation at the interval's end when the
    /// interval passes, and is left as it was when it does not.
    /// </summary>
    public LinearityViolation? Check(ReadOnlySpan<double> z, Span<double> deviation, double startSeconds, double durationSeconds)
    {
        var q = monitors.Length;
        LinearityViolation? worst = null;
        var worstExcess = 0.0;
        var values = residuals?.Values;
        for (var j = 0; j < checkFractions.Length; j++)
            for (var m = 0; m < q; m++)
            {
                var value = checkOffsets[j * q + m];
                var row = checkRows.AsSpan((j * q + m) * r, r);
                for (var k = 0; k < r; k++)
                    value += row[k] * z[k];
                if (values is not null)
                    values[j * q + m] = value;
                var monitor = monitors[m];
                var excess = Math.Max(monitor.Low - value, value - monitor.High);
                if (excess > worstExcess || double.IsNaN(value))
                {
                    worstExcess = double.IsNaN(value) ? double.PositiveInfinity : excess;
                    worst = new LinearityViolation(monitor.Element, monitor.Condition, startSeconds, startSeconds + durationSeconds,
                        startSeconds + checkFractions[j] * durationSeconds, value, monitor.Low, monitor.High);
                }
            }
        if (worst is not null || residuals is null)
            return worst;
        return residuals.Carry(deviation, startSeconds, durationSeconds);
    }

    private static (double[] Phi, double[] Gamma) Split(Matrix<double> exponential, int r)
    {
        var phi = new double[r * r];
        var gamma = new double[r];
        for (var i = 0; i < r; i++)
        {
            for (var k = 0; k < r; k++)
                phi[i * r + k] = exponential[i, k];
            gamma[i] = exponential[i, r];
        }
        return (phi, gamma);
    }
}
