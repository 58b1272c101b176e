namespace ThermVerify.Design;

/// <summary>
/// How noise counts in the verdict and what the firmware does about it ([noise], all optional): the coverage the
/// noise is counted at (k: ±k·σ), the number of consecutive conversions the firmware averages into one reading (a
/// boxcar mean), and the temperature ramp the reading must follow, against which that averaging and the filter lag.
/// </summary>
public sealed record NoiseSpec
{
    /// <summary>Noise is counted in the budget as ±k·σ: 3 unless the design says otherwise (docs/design-file.md says why).</summary>
    public double Coverage { get; init; } = DesignDefaults.NoiseCoverage;

    /// <summary>Consecutive conversions the firmware averages (a mean of N) into one reading; 1: every conversion is a reading.</summary>
    public int ReadingsAveraged { get; init; } = 1;

    /// <summary>The fastest temperature change the reading must follow, in K/s (either direction); null: not declared, no lag counted.</summary>
    public double? RampKelvinPerSecond { get; init; }

    public static NoiseSpec Default { get; } = new();
}
