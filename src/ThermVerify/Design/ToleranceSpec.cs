namespace ThermVerify.Design;

/// <summary>How the tolerances of a design are spread over the built units.</summary>
public enum ToleranceShape
{
    /// <summary>Every value inside ±tolerance equally likely.</summary>
    Uniform,
    /// <summary>Gaussian with the tolerance at <see cref="ToleranceSpec.CoverageFactor"/> standard deviations.</summary>
    Normal,
}

/// <summary>
/// The [tolerances] section: the distribution every tolerance of the design follows in the worst-case and
/// Monte Carlo analyses, and the spreads that have no key of their own elsewhere.
/// </summary>
public sealed record ToleranceSpec
{
    public ToleranceShape Distribution { get; init; } = ToleranceShape.Uniform;

    /// <summary>k: a normal tolerance is at k·σ (σ = tolerance/k). Unused for a uniform distribution.</summary>
    public double CoverageFactor { get; init; } = DesignDefaults.CoverageFactor;

    /// <summary>Fraction: the ADC pin leakage of a unit lies within nominal·(1 ± spread).</summary>
    public double LeakageSpread { get; init; } = DesignDefaults.Tolerance;

    public static ToleranceSpec Default { get; } = new();
}
