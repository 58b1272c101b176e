using System.Collections.Concurrent;
using ThermVerify.Design;
using ThermVerify.Limits;

namespace ThermVerify.Tolerances;

/// <summary>How the worst-case analysis runs.</summary>
public sealed record WorstCaseOptions
{
    /// <summary>Enumerate all 2ⁿ corners to confirm the sensitivities' corners when n is at most this.</summary>
    public int MaximumEnumeratedParameters { get; init; } = 10;

    public int Threads { get; init; } = Environment.ProcessorCount;

    /// <summary>Called from worker threads as units (the nominal, the sensitivities' ±tolerance units, the corners) complete.</summary>
    public IProgress<RunProgress>? Progress { get; init; }

    public CancellationToken Cancel { get; init; }
}

/// <summary>dError/dDeviation of one tolerance at every temperature of the grid (K per unit of the parameter).</summary>
public sealed record Sensitivity(ToleranceParameter Parameter, double[] KelvinPerUnit);

/// <summary>
/// The worst case at one temperature: the nominal error, the errors at the two corners the sensitivities pick
/// (every tolerance at the end that raises, or lowers, the error), their linear sum Σ|sᵢ·aᵢ|, the root sum of squares
/// √Σ(sᵢ·aᵢ)² and the standard deviation √Σ(sᵢ·σᵢ)² for the stated distributions.
/// </summary>
public sealed record WorstCasePoint(
    double Celsius,
    double BudgetKelvin,
    double NominalKelvin,
    double HighKelvin,
    double LowKelvin,
    double LinearSumKelvin,
    double RssKelvin,
    double SigmaKelvin)
{
    /// <summary>The nominal design's noise at its coverage plus its lag on the declared ramp, counted beside each corner as the check counts it.</summary>
    public double NoiseKelvin { get; init; }

    public bool WithinBudget => double.IsFinite(HighKelvin) && double.IsFinite(LowKelvin)
                                && Math.Abs(HighKelvin) + NoiseKelvin <= BudgetKelvin && Math.Abs(LowKelvin) + NoiseKelvin <= BudgetKelvin;
}

/// <summary>
/// The confirmation by enumeration: every corner of the tolerance box evaluated (unquantised, nominal settling),
/// and by how much the sensitivities' corners fall short of the true extremes (0 when they are the extremes).
/// </summary>
public sealed record CornerEnumeration(int Corners, double LargestShortfallKelvin, double ShortfallCelsius);

public sealed record WorstCaseResult(
    IReadOnlyList<ToleranceParameter> Parameters,
    IReadOnlyList<WorstCasePoint> Points,
    IReadOnlyList<Sensitivity> Sensitivities,
    int CornersEvaluated,
    CornerEnumeration? Enumeration)
{
    public bool WithinBudget => Points.All(p => p.WithinBudget);

    /// <summary>
    /// Proven changes that bring the worst case within budget (today: a ratiometric reference resistor's tolerance or
    /// tempco, <see cref="ReferenceResistorRemedies"/>), each with the worst case of the changed design as its proof.
    /// </summary>
    public IReadOnlyList<Check.Remedy> Remedies { get; init; } = [];

    /// <summary>Why the remedies are a combination, or why there are none where one was searched; null otherwise.</summary>
    public string? RemedyNote { get; init; }

    public WorstCasePoint Worst => Points.MaxBy(p => Math.Max(Math.Abs(p.HighKelvin), Math.Abs(p.LowKelvin)) is var k && double.IsFinite(k) ? k : double.PositiveInfinity)!;
}

/// <summary>
/// Extreme-value analysis over the tolerance box. Sensitivities come from central differences of the unquantised
/// error at ±tolerance of each part alone; at each temperature they pick the corner that raises the error most and
/// the one that lowers it most, and each distinct corner is then verified in full (DC sweep, the sampling transient
/// at its worst temperature, quantisation). With few tolerances every corner is enumerated as a check.
/// </summary>
internal static class WorstCase
{
    public static WorstCaseResult Run(FrontEndDesign design, WorstCaseOptions? options = null)
    {
        options ??= new WorstCaseOptions();
        var evaluator = new UnitEvaluator(design, options.Threads, options.Cancel);
        var set = evaluator.Set;
        var n = set.Count;
        var t = evaluator.Temperatures;
        var parallel = new ParallelOptions { MaxDegreeOfParallelism = options.Threads, CancellationToken = options.Cancel };

        var enumerated = n >= 1 && n <= options.MaximumEnumeratedParameters ? 1 << n : 0;
        // The corners the sensitivities pick are known only after them: two until then, the real count afterwards.
        var total = 1 + 2 * n + 2 + enumerated;
        var done = 0;
        void Completed(int units = 1)
        {
            var now = Interlocked.Add(ref done, units);
            options.Progress?.Report(new RunProgress(now, Volatile.Read(ref total)));
        }

        var nominal = evaluator.Evaluate(new double[n]);
        Completed();
        var sensitivities = new Sensitivity[n];
        Parallel.For(0, n, parallel, i =>
        {
            var a = set.Parameters[i].HalfWidth;
            var plus = new double[n];
            var minus = new double[n];
            (plus[i], minus[i]) = (a, -a);
            var up = evaluator.Evaluate(plus, simulateSettling: false).UnquantisedErrorKelvin;
            var down = evaluator.Evaluate(minus, simulateSettling: false).UnquantisedErrorKelvin;
            Completed(2);
            sensitivities[i] = new Sensitivity(set.Parameters[i], [.. t.Select((_, k) => Finite((up[k] - down[k]) / (2 * a)))]);
        });

        var highSigns = t.Select((_, k) => sensitivities.Select(s => s.KelvinPerUnit[k] >= 0 ? 1 : -1).ToArray()).ToArray();
        var patterns = highSigns.Concat(highSigns.Select(Negate)).Select(Key).Distinct().ToArray();
        Volatile.Write(ref total, 1 + 2 * n + patterns.Length + enumerated);
        var corners = new ConcurrentDictionary<string, UnitOutcome>();
        Parallel.ForEach(patterns, parallel, key =>
        {
            corners[key] = evaluator.Evaluate(set.Corner(Signs(key)));
            Completed();
        });

        var points = new WorstCasePoint[t.Length];
        for (var k = 0; k < t.Length; k++)
        {
            var contributions = sensitivities.Select(s => s.KelvinPerUnit[k] * s.Parameter.HalfWidth).ToArray();
            var sigma = Math.Sqrt(sensitivities.Sum(s => Math.Pow(s.KelvinPerUnit[k] * s.Parameter.StandardDeviation, 2)));
            points[k] = new WorstCasePoint(t[k], evaluator.Budgets[k], nominal.ErrorKelvin[k],
                corners[Key(highSigns[k])].ErrorKelvin[k], corners[Key(Negate(highSigns[k]))].ErrorKelvin[k],
                contributions.Sum(Math.Abs), Math.Sqrt(contributions.Sum(c => c * c)), sigma) { NoiseKelvin = evaluator.NoiseMarginsKelvin[k] };
        }

        CornerEnumeration? enumeration = null;
        if (enumerated > 0)
            enumeration = Enumerate(evaluator, highSigns, parallel, () => Completed());
        return new WorstCaseResult(set.Parameters, points, sensitivities, patterns.Length, enumeration);
    }

    /// <summary>Every corner, unquantised with the nominal settling offsets, against the sensitivities' corners evaluated the same way.</summary>
    private static CornerEnumeration Enumerate(UnitEvaluator evaluator, int[][] highSigns, ParallelOptions parallel, Action completed)
    {
        var n = evaluator.Set.Count;
        var count = 1 << n;
        var outcomes = new double[count][];
        Parallel.For(0, count, parallel, c =>
        {
            var signs = Enumerable.Range(0, n).Select(i => (c >> i & 1) == 1 ? 1 : -1).ToArray();
            outcomes[c] = evaluator.Evaluate(evaluator.Set.Corner(signs), simulateSettling: false).UnquantisedErrorKelvin;
            completed();
        });
        int Index(int[] signs) => Enumerable.Range(0, n).Sum(i => signs[i] > 0 ? 1 << i : 0);
        var (shortfall, at) = (0.0, evaluator.Temperatures[0]);
        for (var k = 0; k < evaluator.Temperatures.Length; k++)
        {
            var max = outcomes.Max(o => o[k]);
            var min = outcomes.Min(o => o[k]);
            var gap = Math.Max(max - outcomes[Index(highSigns[k])][k], outcomes[Index(Negate(highSigns[k]))][k] - min);
            if (gap > shortfall) (shortfall, at) = (gap, evaluator.Temperatures[k]);
        }
        return new CornerEnumeration(count, shortfall, at);
    }

    private static double Finite(double v) => double.IsFinite(v) ? v : 0;

    private static int[] Negate(int[] signs) => [.. signs.Select(s => -s)];

    private static string Key(int[] signs) => new([.. signs.Select(s => s > 0 ? '+' : '-')]);

    private static int[] Signs(string key) => [.. key.Select(ch => ch == '+' ? 1 : -1)];
}
