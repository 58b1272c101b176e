using MathNet.Numerics.LinearRegression;

namespace ThermVerify.Tolerances;

/// <summary>
/// Ranks the tolerances by their share of the variance of the error at the temperature where the units spread
/// most. A least-squares fit e ≈ c + Σ bᵢ·δᵢ of the unquantised error on the deviations gives each share as
/// bᵢ²·Var(δᵢ)/Var(e) (first-order variance decomposition for independent inputs); what the fit leaves is reported
/// as "nonlinear and settling". Quantisation is not in the unquantised error; its own variance is Q²/12 in volts
/// (IEEE Std 1241) and shows in the envelope.
/// </summary>
public static class VarianceShares
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
        var variance = Variance(y);
        if (!(variance > 0)) return (envelope[column].Celsius, 0, []);
        var shares = new List<VarianceShare>();
        for (var i = 0; i < parameters.Count; i++)
        {
            var deviation = Variance([.. x.Select(r => r[i])]);
            shares.Add(new VarianceShare(parameters[i].Key, parameters[i].Kind, b[i + 1] * b[i + 1] * deviation / variance, b[i + 1]));
        }
        shares.Add(new VarianceShare(RestKey, null, Math.Max(0, 1 - shares.Sum(s => s.Share)), double.NaN));
        return (envelope[column].Celsius, variance, [.. shares.OrderByDescending(s => s.Share)]);
    }

    private static double Variance(double[] v)
    {
        var mean = v.Average();
        return v.Sum(x => (x - mean) * (x - mean)) / (v.Length - 1);
    }
}
