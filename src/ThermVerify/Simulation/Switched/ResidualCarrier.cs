using MathNet.Numerics.LinearAlgebra;

namespace ThermVerify.Simulation.Switched;

/// <summary>
/// The slew residuals' first-order effect over one interval (see <see cref="IntervalMap"/>): the mesh of check points
/// in time order, per mesh spacing the exponential and the responses to a residual current constant and ramping over
/// one spacing, and the rows that turn z's deviation into the circuit nodes' deviations.
/// </summary>
internal sealed class ResidualCarrier
{
    private readonly int r;
    private readonly SlewResidual[] slews;
    private readonly double[] fractions;
    private readonly int[] gapSpacing;
    private readonly double[][] spacingPhi;
    private readonly double[][][] constant;
    private readonly double[][][] ramp;
    private readonly double[] nodeRows;
    private readonly double[][] nodeDirect;
    private readonly int nodeCount;
    private readonly IReadOnlyList<string> nodes;
    private readonly double limit;
    private readonly int monitorCount;
    private readonly double[] current;
    private readonly double[] previousCurrent;
    private readonly double[] carried;
    private readonly double[] scratch;

    private ResidualCarrier(int r, SlewResidual[] slews, double[] fractions, int[] gapSpacing, double[][] spacingPhi, double[][][] constant,
        double[][][] ramp, double[] nodeRows, double[][] nodeDirect, IReadOnlyList<string> nodes, double limit, int monitorCount)
    {
        this.nodes = nodes;
        this.r = r;
        this.slews = slews;
        this.fractions = fractions;
        this.gapSpacing = gapSpacing;
        this.spacingPhi = spacingPhi;
        this.constant = constant;
        this.ramp = ramp;
        this.nodeRows = nodeRows;
        this.nodeDirect = nodeDirect;
        nodeCount = nodes.Count;
        this.limit = limit;
        this.monitorCount = monitorCount;
        Values = new double[fractions.Length * monitorCount];
        current = new double[slews.Length];
        previousCurrent = new double[slews.Length];
        carried = new double[r];
        scratch = new double[r];
    }

    /// <summary>The monitored values at every check point, filled by <see cref="IntervalMap.Check(System.ReadOnlySpan{double}, System.Span{double}, double, double)"/>.</summary>
    public double[] Values { get; }

    /// <param name="fractions">The check points as fractions of h, in time order; each gap is one of the grids' spacings.</param>
    /// <param name="steps">The augmented exponential over each grid's spacing, coarsest first.</param>
    public static ResidualCarrier Build(SegmentModel model, double h, IReadOnlyList<SlewResidual> slews, double[] fractions,
        Matrix<double>[] steps, IReadOnlyList<string> nodes, double limit, int monitorCount)
    {
        var nodeCount = nodes.Count;
        var r = model.StateCount;
        var spacings = Enumerable.Range(0, steps.Length).Select(g => Math.Pow(32, -g - 1)).ToArray();
        var gapSpacing = new int[fractions.Length - 1];
        for (var k = 0; k < gapSpacing.Length; k++)
        {
            var gap = fractions[k + 1] - fractions[k];
            var best = 0;
            for (var g = 1; g < spacings.Length; g++)
                if (Math.Abs(Math.Log(gap / spacings[g])) < Math.Abs(Math.Log(gap / spacings[best])))
                    best = g;
            gapSpacing[k] = best;
        }
        var spacingPhi = steps.Select(step =>
        {
            var p = new double[r * r];
            for (var i = 0; i < r; i++)
                for (var k = 0; k < r; k++)
                    p[i * r + k] = step[i, k];
            return p;
        }).ToArray();
        var constant = new double[steps.Length][][];
        var ramp = new double[steps.Length][][];
        for (var g = 0; g < steps.Length; g++)
        {
            constant[g] = new double[slews.Count][];
            ramp[g] = new double[slews.Count][];
            for (var s = 0; s < slews.Count; s++)
                (constant[g][s], ramp[g][s]) = model.RampResponse(model.Injections[s].U, h * spacings[g]);
        }
        var nodeRows = new double[nodeCount * r];
        for (var i = 0; i < nodeCount; i++)
            model.OutputRow(i).CopyTo(nodeRows.AsSpan(i * r, r));
        var nodeDirect = model.Injections.Select(injection => injection.Offset[..nodeCount]).ToArray();
        return new ResidualCarrier(r, [.. slews], fractions, gapSpacing, spacingPhi, constant, ramp, nodeRows, nodeDirect, nodes, limit,
            monitorCount);
    }

    /// <summary>
    /// Carries <paramref name="deviation"/> across the interval (the residual currents from <see cref="Values"/>) and judges
    /// the circuit nodes' deviation at its end; on success the deviation becomes the one at the end.
    /// </summary>
    public LinearityViolation? Carry(Span<double> deviation, double startSeconds, double durationSeconds)
    {
        if (deviation.Length == 0)
            throw new InvalidOperationException("An interval with slew residuals needs the deviation carried into it.");
        deviation.CopyTo(carried);
        Currents(0, previousCurrent);
        for (var k = 0; k < gapSpacing.Length; k++)
        {
            Currents(k + 1, current);
            var g = gapSpacing[k];
            var p = spacingPhi[g];
            for (var i = 0; i < r; i++)
            {
                var sum = 0.0;
                for (var j = 0; j < r; j++)
                    sum += p[i * r + j] * carried[j];
                for (var s = 0; s < slews.Length; s++)
                    sum += constant[g][s][i] * previousCurrent[s] + ramp[g][s][i] * (current[s] - previousCurrent[s]);
                scratch[i] = sum;
            }
            scratch.CopyTo(carried, 0);
            current.CopyTo(previousCurrent, 0);
        }

        // The nodes' deviation where the interval ends: through P, plus the residual current's direct part there.
        var worst = 0.0;
        var worstNode = -1;
        for (var n = 0; n < nodeCount; n++)
        {
            var effect = 0.0;
            var row = nodeRows.AsSpan(n * r, r);
            for (var i = 0; i < r; i++)
                effect += row[i] * carried[i];
            for (var s = 0; s < slews.Length; s++)
                effect += nodeDirect[s][n] * current[s];
            if (!(Math.Abs(effect) <= Math.Abs(worst)))
            {
                worst = effect;
                worstNode = n;
            }
        }
        if (!(Math.Abs(worst) <= limit))
            return new LinearityViolation(slews[0].Element,
                $"the slewing stage's departure from linear, carried to node '{nodes[worstNode]}' to first order (slew limit)", startSeconds,
                startSeconds + durationSeconds, startSeconds + durationSeconds, worst, -limit, limit);
        carried.CopyTo(deviation);
        return null;
    }

    private void Currents(int point, double[] into)
    {
        for (var s = 0; s < slews.Length; s++)
            into[s] = slews[s].Current(Values[point * monitorCount + slews[s].Monitor]);
    }
}
