using ThermVerify.Design;

namespace ThermVerify.Tolerances;

/// <summary>
/// How one tolerance ±a is spread over built units: uniform on [−a, a] (σ = a/√3), or normal with a at k·σ
/// (σ = a/k, not truncated: a part beyond its tolerance is possible, as with any unscreened normal population).
/// </summary>
public readonly record struct ToleranceDistribution(ToleranceShape Shape, double CoverageFactor)
{
    public static ToleranceDistribution Uniform => new(ToleranceShape.Uniform, 0);

    public static ToleranceDistribution Normal(double coverageFactor) => new(ToleranceShape.Normal, coverageFactor);

    public static ToleranceDistribution Of(ToleranceSpec spec) =>
        spec.Distribution == ToleranceShape.Normal ? Normal(spec.CoverageFactor) : Uniform;

    /// <summary>Standard deviation for a tolerance of half-width <paramref name="halfWidth"/>.</summary>
    public double StandardDeviation(double halfWidth) =>
        Shape == ToleranceShape.Normal ? halfWidth / CoverageFactor : halfWidth / Math.Sqrt(3);

    /// <summary>One draw for a tolerance of half-width <paramref name="halfWidth"/>.</summary>
    internal double Sample(ref UnitRandom random, double halfWidth) =>
        Shape == ToleranceShape.Normal
            ? halfWidth / CoverageFactor * random.NextStandardNormal()
            : halfWidth * (2 * random.NextUnit() - 1);

    public override string ToString() =>
        Shape == ToleranceShape.Normal ? FormattableString.Invariant($"normal, tolerance = {CoverageFactor:0.###}σ") : "uniform";
}
