using ThermVerify.Design;
using ThermVerify.Tests.Check;
using ThermVerify.Tolerances;

namespace ThermVerify.Tests.Tolerances;

public class MonteCarloTests
{
    /// <summary>
    /// A linear case: y = Σ cᵢ·δᵢ over the design's own draws. Mean 0 and σ² = Σ cᵢ²·σᵢ² with σ = a/√3 (uniform) or
    /// a/k (normal) (definitions). Sampling bounds: the mean within 4 standard errors σ/√N; the sample standard
    /// deviation within 4 of its standard errors, σ·√((κ − 1)/(4N)) with κ the kurtosis (1.8 uniform, 3 normal),
    /// the large-sample result for the variance estimator (Cramér, Mathematical Methods of Statistics, 1946, from memory).
    /// </summary>
    [Theory]
    [InlineData("uniform", 1.8)]
    [InlineData("normal", 3.0)]
    public void LinearCaseMeanAndDeviationMatchTheAnalyticValues(string shape, double kurtosis)
    {
        var distribution = shape == "normal" ? ToleranceShape.Normal : ToleranceShape.Uniform;
        var design = ToleranceTestDesigns.TwoResistors() with { Tolerances = new ToleranceSpec { Distribution = distribution, CoverageFactor = 3 } };
        var set = ToleranceSet.From(design);
        double[] c = [2.0, -5.0];
        const int n = 40_000;
        var y = new double[n];
        for (var u = 0; u < n; u++)
        {
            var random = new UnitRandom(7, u);
            var d = set.Sample(ref random);
            y[u] = c[0] * d[0] + c[1] * d[1];
        }
        var sigma = Math.Sqrt(set.Parameters.Select((p, i) => Math.Pow(c[i] * p.StandardDeviation, 2)).Sum());
        var mean = y.Average();
        var sd = Math.Sqrt(y.Sum(v => (v - mean) * (v - mean)) / (n - 1));
        Tolerance.AssertClose(0, mean, 0, 4 * sigma / Math.Sqrt(n), "mean");
        Tolerance.AssertClose(sigma, sd, 0, 4 * sigma * Math.Sqrt((kurtosis - 1) / (4.0 * n)), "standard deviation");
    }

    /// <summary>
    /// The whole run on a case that is linear to first order: a ratiometric divider with only the fixed resistor
    /// toleranced (uniform ±0.5 %). Each unit reads ΔT = −δ·R_s/(dR_s/dT) (see SensitivityTests), so over the units the
    /// error has mean ≈ nominal and σ² = (R_s/(dR_s/dT)·a)²/3 plus the quantisation, (K per LSB)²/12 (IEEE Std 1241,
    /// uniform ±½ LSB). Bounds as in the linear case above, widened by the second-order term of the divider (0.5 %).
    /// </summary>
    [Fact]
    public void WholeRunMeanAndDeviationMatchTheLinearModel()
    {
        var design = ToleranceTestDesigns.TwoResistors(sensorTolerance: "\"0 %\"", fixedTolerance: "\"0.5 %\"");
        const int n = 3000;
        var result = MonteCarlo.Run(design, new MonteCarloOptions { Units = n, Seed = 11, Threads = 2 });
        var sensor = design.Sensor.Build();
        foreach (var e in result.Envelope)
        {
            var r = sensor.ResistanceOhms(e.Celsius);
            var s = r / sensor.SlopeOhmsPerKelvin(e.Celsius);
            // K per LSB = Q/|dV/dT|, dV/dT = E·R_f/(R_s + R_f)²·dR_s/dT, Q = E/2^16.
            var kelvinPerLsb = Math.Pow(r + 10e3, 2) / (65536 * 10e3 * Math.Abs(sensor.SlopeOhmsPerKelvin(e.Celsius)));
            var sigma = Math.Sqrt(Math.Pow(s * 0.005, 2) / 3 + kelvinPerLsb * kelvinPerLsb / 12);
            Tolerance.AssertClose(sigma, e.StandardDeviationKelvin, 0.005, 4 * sigma * Math.Sqrt(0.8 / (4.0 * n)), $"σ at {e.Celsius} °C");
            Tolerance.AssertClose(e.NominalErrorKelvin, e.MeanKelvin, 0, 4 * sigma / Math.Sqrt(n) + kelvinPerLsb, $"mean at {e.Celsius} °C");
        }
        Assert.Equal(n, result.Units);
        Assert.Contains(result.Contributors, c => c.Kind == ToleranceKind.FixedResistance && c.Share > 0.99);
    }

    /// <summary>Each unit draws from its own stream (seed, index): the result cannot depend on the thread count.</summary>
    [Fact]
    public void SameSeedGivesTheSameResultOnOneTwoAndEightThreads()
    {
        var design = TestDesign.Make(("sensor.resistance_tolerance", "\"1 %\""), ("sensor.beta_tolerance", "\"0.5 %\""),
            ("divider.fixed_tolerance", "\"0.1 %\""), ("adc.offset_error", "\"1 LSB\""), ("adc.inl", "\"1 LSB\""),
            ("adc.pin_leakage", "\"20 nA\""), ("tolerances.leakage_spread", "\"50 %\""));
        MonteCarloResult Run(int threads) => MonteCarlo.Run(design, new MonteCarloOptions { Units = 200, Seed = 42, Threads = threads });
        var one = Run(1);
        foreach (var other in new[] { Run(2), Run(8) })
        {
            Assert.Equal(one.WorstErrorKelvin, other.WorstErrorKelvin);
            Assert.Equal(one.UnitsWithinBudget, other.UnitsWithinBudget);
            Assert.Equal(one.Envelope.Select(e => e.PercentileKelvin[2]), other.Envelope.Select(e => e.PercentileKelvin[2]));
            Assert.Equal(one.Contributors.Select(c => c.Share), other.Contributors.Select(c => c.Share));
        }
        Assert.NotEqual(one.WorstErrorKelvin, MonteCarlo.Run(design, new MonteCarloOptions { Units = 200, Seed = 43, Threads = 2 }).WorstErrorKelvin);
    }

    /// <summary>Percentiles by linear interpolation between order statistics (Hyndman and Fan 1996, definition 7).</summary>
    [Fact]
    public void PercentileInterpolatesBetweenOrderStatistics()
    {
        double[] sorted = [1, 2, 3, 4, 5];
        Assert.Equal(3, MonteCarlo.Percentile(sorted, 50));
        Assert.Equal(1.4, MonteCarlo.Percentile(sorted, 10), 12);
        Assert.Equal(5, MonteCarlo.Percentile(sorted, 100));
    }
}
