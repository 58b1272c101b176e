using MathNet.Numerics.LinearRegression;

namespace ThermVerify.Tolerances;

/// <summary>
/// Ranks the tolerances by their share of the variance of the error at the temperature where the units spread
/// most. A least-squares fit e ≈ c + Σ bᵢ·δᵢ of the unquantised error on the deviations gives each share as
/// bᵢ²·σᵢ²/(Σⱼ bⱼ²·σⱼ² + residual variance), σᵢ from the part's distribution (first-order variance decomposition
/// for independent inputs); what the fit leaves is reported as "nonlinear and settling". Quantisation is not in the unquantised error; its own variance is Q²/12 in volts
/// (IEEE Std 1241) and shows in the envelope.
/// </summary>
internal static class VarianceShares
{
    public const string RestKey = "nonlinear and settling (what a linear fit leaves)";

    public static (double Celsius, double VarianceKelvinSquared, IReadOnlyList<VarianceShare> Shares) Fit(UnitEvaluator evaluator, UnitOutcome[] outcomes,
        double[][] deviations, IReadOnlyList<EnvelopePoint> envelope)
    {
        var parameters = evaluator.Set.Parameters;
        var column = Enumerable.Range(0, envelope.Count)
            .OrderByDescending(i => double.IsFinite(envelope[i].StandardDeviationKelvin) ? envelope[i].StandardDeviationKelvin : -1)
            .First();
        var rows = Enumerable.Range(0, outcomes.Length).Where(u => double.IsFinite(outcomes[u].UnquantisedErrorKelvin[column])).ToArray();
        if (parameters.Count == 0 || rows.Length <= parameters.Count + 1) return (envelope[column].Celsius, 0, []);
        var y = rows.Select(u => outcomes[u].UnquantisedErrorKelvin[column]).ToArray();
        var x = rows.Select(u => deviations[u]).ToArray();
        var b = MultipleRegression.QR(x, y, intercept: true);
        var fitted = x.Select(r => b[0] + r.Select((v, i) => b[i + 1] * v).Sum()).ToArray();
        var residual = Variance([.. y.Select((v, u) => v - fitted[u])]);
        // Each part's variance from its distribution, not from the sample, so that chance correlations between the
        // drawn deviations do not leak into the shares; the shares and the rest then add up to one.
        var parts = parameters.Select((p, i) => b[i + 1] * b[i + 1] * p.StandardDeviation * p.StandardDeviation).ToArray();
        var variance = parts.Sum() + residual;
        if (!(variance > 0)) return (envelope[column].Celsius, 0, []);
        var shares = parameters.Select((p, i) => new VarianceShare(p.Key, p.Kind, parts[i] / variance, b[i + 1])).ToList();
        shares.Add(new VarianceShare(RestKey, null, residual / variance, double.NaN));
        return (envelope[column].Celsius, variance, [.. shares.OrderByDescending(s => s.Share)]);
    }

    private static double Variance(double[] v)
    {
        var mean = v.Average();
        return v.Sum(x => (x - mean) * (x - mean)) / (v.Length - 1);
    }
}
