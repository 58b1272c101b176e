using ThermVerify.Design;

namespace ThermVerify.FrontEnd;

/// <summary>
/// Sampling transients on a grid of the check's temperatures: every point when there are few, else evenly spread
/// points that always include both ends. Between grid points the settling error (sample minus DC pin voltage) is
/// interpolated linearly in temperature. Points run in parallel; each is independent, so the result does not
/// depend on the thread count.
/// </summary>
internal static class SettlingGrid
{
    public static int[] Indices(int pointCount, int maximumPoints)
    {
        if (pointCount <= maximumPoints) return [.. Enumerable.Range(0, pointCount)];
        return [.. Enumerable.Range(0, maximumPoints)
            .Select(i => (int)Math.Round(i * (pointCount - 1) / (double)(maximumPoints - 1)))
            .Distinct()];
    }

    public static SamplingOutcome[] Run(FrontEndDesign design, double? prechargeVolts, IReadOnlyList<double> temperatures,
        int[] indices, double settleVolts, int threads, CancellationToken cancel, ICheckEngine? engine = null, Action? runDone = null)
    {
        var outcomes = new SamplingOutcome[indices.Length];
        Parallel.For(0, indices.Length, new ParallelOptions { MaxDegreeOfParallelism = threads, CancellationToken = cancel }, i =>
        {
            outcomes[i] = SamplingRun.Run(design, temperatures[indices[i]], prechargeVolts, settleVolts, cancel: cancel, engine: engine);
            runDone?.Invoke();
        });
        return outcomes;
    }

    /// <summary>A per-grid-point quantity at every check point, linear in temperature between grid points.</summary>
    public static double[] Interpolate(IReadOnlyList<double> temperatures, int[] indices, Func<int, double> valueAtGridPoint)
    {
        var result = new double[temperatures.Count];
        var g = 0;
        for (var i = 0; i < temperatures.Count; i++)
        {
            while (g < indices.Length - 2 && indices[g + 1] < i) g++;
            if (indices.Length == 1) { result[i] = valueAtGridPoint(0); continue; }
            var (i0, i1) = (indices[g], indices[g + 1]);
            var w = (temperatures[i] - temperatures[i0]) / (temperatures[i1] - temperatures[i0]);
            result[i] = valueAtGridPoint(g) + w * (valueAtGridPoint(g + 1) - valueAtGridPoint(g));
        }
        return result;
    }
}
