using MathNet.Numerics.LinearAlgebra;

namespace ThermVerify.Simulation.Switched;

/// <summary>
/// The exact step of one configuration over one duration h: z(t + h) = Φ·z(t) + γ with Φ = e^(Ah) and
/// γ = ∫₀ʰ e^(As) ds·u. With monitors (an op-amp's linear-region conditions) it also holds each monitored quantity
/// as an affine function of the starting state at check points inside the interval: the start (where algebraic
/// quantities jump) and four nested uniform grids of 32 points over h, h/32, h/32² and h/32³, so the fast transient
/// right after an edge is resolved down to h/32⁴ (each grid is one exponential and repeated products). The check
/// samples the exact trajectory at those points; it is not a bound between them.
/// </summary>
internal sealed class IntervalMap
{
    private const int GridPoints = 32;
    private const int Grids = 4;

    private readonly int r;
    private readonly double[] phi;
    private readonly double[] gamma;
    private readonly LinearMonitor[] monitors;
    private readonly double[] checkFractions;
    private readonly double[] checkRows;
    private readonly double[] checkOffsets;

    private IntervalMap(int r, double[] phi, double[] gamma, LinearMonitor[] monitors, double[] fractions, double[] rows, double[] offsets)
    {
        this.r = r;
        this.phi = phi;
        this.gamma = gamma;
        this.monitors = monitors;
        checkFractions = fractions;
        checkRows = rows;
        checkOffsets = offsets;
    }

    /// <summary>Φ, row-major r×r.</summary>
    public ReadOnlySpan<double> Phi => phi;

    public ReadOnlySpan<double> Gamma => gamma;

    public bool HasChecks => monitors.Length > 0;

    public static IntervalMap Build(SegmentModel model, double h, IReadOnlyList<LinearMonitor> monitors)
    {
        var r = model.StateCount;
        var (phi, gamma) = Split(model.AugmentedExponential(h), r);
        if (monitors.Count == 0)
            return new IntervalMap(r, phi, gamma, [], [], [], []);

        var points = new List<(double Fraction, Matrix<double> Exponential)> { (0, Matrix<double>.Build.DenseIdentity(r + 1)) };
        for (var grid = 0; grid < Grids; grid++)
        {
            var spacing = Math.Pow(GridPoints, -grid - 1);
            var step = model.AugmentedExponential(h * spacing);
            var power = step;
            for (var j = 1; j <= GridPoints; j++, power = power * step)
                if (grid == 0 || j < GridPoints) // a finer grid's last point is the coarser grid's first
                    points.Add((j * spacing, power));
        }

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
        return new IntervalMap(r, phi, gamma, [.. monitors], [.. points.Select(p => p.Fraction)], rows, offsets);
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
    public LinearityViolation? Check(ReadOnlySpan<double> z, double startSeconds, double durationSeconds)
    {
        var q = monitors.Length;
        LinearityViolation? worst = null;
        var worstExcess = 0.0;
        for (var j = 0; j < checkFractions.Length; j++)
            for (var m = 0; m < q; m++)
            {
                var value = checkOffsets[j * q + m];
                var row = checkRows.AsSpan((j * q + m) * r, r);
                for (var k = 0; k < r; k++)
                    value += row[k] * z[k];
                var monitor = monitors[m];
                var excess = Math.Max(monitor.Low - value, value - monitor.High);
                if (excess > worstExcess || double.IsNaN(value))
                {
                    worstExcess = double.IsNaN(value) ? double.PositiveInfinity : excess;
                    worst = new LinearityViolation(monitor.Element, monitor.Condition, startSeconds, startSeconds + durationSeconds,
                        startSeconds + checkFractions[j] * durationSeconds, value, monitor.Low, monitor.High);
                }
            }
        return worst;
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
