using ThermVerify.Design;
using ThermVerify.Limits;

namespace ThermVerify.Tolerances;

/// <summary>
/// Builds N units, each with its own parts drawn from the design's tolerances, and verifies each (see
/// <see cref="UnitEvaluator"/>). Unit i draws from a stream derived from (seed, i) alone and results are kept by
/// index, so a seed gives the same result whatever the thread count.
/// </summary>
internal static class MonteCarlo
{
    public static MonteCarloResult Run(FrontEndDesign design, MonteCarloOptions? options = null)
    {
        options ??= new MonteCarloOptions();
        if (options.Units < 2)
            throw new ArgumentOutOfRangeException(nameof(options), options.Units, "A Monte Carlo run needs at least 2 units.");
        var evaluator = new UnitEvaluator(design, options.Threads, options.Cancel);
        return Run(evaluator, options);
    }

    public static MonteCarloResult Run(UnitEvaluator evaluator, MonteCarloOptions options)
    {
        var n = options.Units;
        var outcomes = new UnitOutcome[n];
        var deviations = new double[n][];
        var done = 0;
        var step = Math.Max(1, n / 200);
        Parallel.For(0, n, new ParallelOptions { MaxDegreeOfParallelism = options.Threads, CancellationToken = options.Cancel }, i =>
        {
            var random = new UnitRandom(options.Seed, i);
            deviations[i] = evaluator.Set.Sample(ref random);
            outcomes[i] = evaluator.Evaluate(deviations[i], options.SimulateSettling);
            var count = Interlocked.Increment(ref done);
            if (options.Progress is { } progress && (count % step == 0 || count == n))
                progress.Report(new RunProgress(count, n));
        });

        var nominal = evaluator.Evaluate(new double[evaluator.Set.Count], options.SimulateSettling);
        var envelope = Envelope(evaluator, outcomes, nominal, options.Percentiles);
        var worst = outcomes.Select(o => o.WorstErrorKelvin).ToArray();
        var (sharesAt, variance, shares) = VarianceShares.Fit(evaluator, outcomes, deviations, envelope);
        return new MonteCarloResult(n, options.Seed, evaluator.Set.Parameters, options.Percentiles, envelope,
            outcomes.Count(o => o.WithinBudget), sharesAt, variance, shares, MakeHistogram(worst, 40), worst,
            [.. outcomes.Select(o => evaluator.Temperatures[o.WorstIndex])], deviations,
            outcomes.Max(o => o.SelfHeatingKelvin.DefaultIfEmpty(0).Max()), [.. outcomes.Select(o => o.WithinBudget)])
        {
            LargestNoiseKelvin = evaluator.NoiseMarginsKelvin.DefaultIfEmpty(0).Max(),
            ChannelSwitch = nominal.ChannelSwitchKelvin is { } k
                ? new UnitChannelSwitch(evaluator.SwitchCelsius, evaluator.Design.Check.BudgetAt(evaluator.SwitchCelsius), k,
                    outcomes.Max(o => o.ChannelSwitchKelvin!.Value),
                    outcomes.Count(o => o.ChannelSwitchKelvin > evaluator.Design.Check.BudgetAt(evaluator.SwitchCelsius)), n)
                : null,
        };
    }

    private static EnvelopePoint[] Envelope(UnitEvaluator evaluator, UnitOutcome[] outcomes, UnitOutcome nominal, IReadOnlyList<double> percentiles)
    {
        var t = evaluator.Temperatures;
        var column = new double[outcomes.Length];
        var points = new EnvelopePoint[t.Length];
        for (var i = 0; i < t.Length; i++)
        {
            for (var u = 0; u < outcomes.Length; u++)
                column[u] = double.IsNaN(outcomes[u].ErrorKelvin[i]) ? double.PositiveInfinity : outcomes[u].ErrorKelvin[i];
            Array.Sort(column);
            var finite = column.Where(double.IsFinite).ToArray();
            var mean = finite.Length > 0 ? finite.Average() : double.NaN;
            var sd = finite.Length > 1 ? Math.Sqrt(finite.Sum(x => (x - mean) * (x - mean)) / (finite.Length - 1)) : double.NaN;
            points[i] = new EnvelopePoint(t[i], evaluator.Budgets[i], nominal.ErrorKelvin[i], column[0],
                [.. percentiles.Select(p => Percentile(column, p))], column[^1], mean, sd);
        }
        return points;
    }

    /// <summary>Linear interpolation between order statistics (the "R-7" rule of Hyndman and Fan, Amer. Statist. 50 (1996) 361).</summary>
    public static double Percentile(double[] sorted, double percent)
    {
        var h = (sorted.Length - 1) * percent / 100;
        var lo = (int)Math.Floor(h);
        var hi = Math.Min(lo + 1, sorted.Length - 1);
        if (double.IsInfinity(sorted[lo]) || double.IsInfinity(sorted[hi])) return sorted[hi];
        return sorted[lo] + (h - lo) * (sorted[hi] - sorted[lo]);
    }

    private static Histogram MakeHistogram(double[] values, int bins)
    {
        var finite = values.Where(double.IsFinite).ToArray();
        if (finite.Length == 0) return new Histogram([], 0, []);
        var (lo, hi) = (finite.Min(), finite.Max());
        var width = hi > lo ? (hi - lo) / bins : 1e-3;
        var counts = new int[bins];
        foreach (var v in finite)
            counts[Math.Min(bins - 1, (int)((v - lo) / width))]++;
        return new Histogram([.. Enumerable.Range(0, bins).Select(b => lo + b * width)], width, counts);
    }
}
