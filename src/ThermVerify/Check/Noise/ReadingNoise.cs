namespace ThermVerify.Check.Noise;

/// <summary>One group of noise generators and its rms share on the sampling capacitor (the sensor, a resistor, the switch, the op-amp, the converter).</summary>
public sealed record NoiseShare(string Source, string Label, double RmsVolts);

/// <summary>The noise density at the ADC pin (switch closed) at one stated frequency.</summary>
public sealed record NoiseDensity(double Hertz, double VoltsPerRootHertz);

/// <summary>
/// The noise of one reading at one temperature. A conversion samples the front end's noise on the sampling capacitor
/// (every resistor's Johnson–Nyquist noise at its own temperature, the op-amp's, integrated over the sampling network's
/// band; its kT/C share is new at every acquisition) and adds the converter's own noise. The firmware's mean of N
/// conversions keeps the part the filter carries from one conversion to the next (correlation ρ between neighbours).
/// Volts at the pin; kelvin through the closed form's slope there.
/// </summary>
public sealed record ReadingNoise(
    double Celsius,
    double AnalogRmsVolts,
    double FastRmsVolts,
    double SlowRmsVolts,
    double KtcRmsVolts,
    double ConverterRmsVolts,
    double SingleRmsVolts,
    double AveragedRmsVolts,
    double Correlation,
    double VoltsPerKelvin,
    double LsbVolts,
    double Coverage,
    double RampLagKelvin,
    IReadOnlyList<NoiseShare> Shares,
    IReadOnlyList<NoiseDensity> PinDensity)
{
    /// <summary>The reading's rms noise in K.</summary>
    public double AveragedRmsKelvin => AveragedRmsVolts / Math.Abs(VoltsPerKelvin);

    /// <summary>One conversion's rms noise in K (no averaging).</summary>
    public double SingleRmsKelvin => SingleRmsVolts / Math.Abs(VoltsPerKelvin);

    /// <summary>What the budget counts: ±k·σ of the reading, at the pin.</summary>
    public double CoveredVolts => Coverage * AveragedRmsVolts;

    /// <summary>What the budget counts: ±k·σ of the reading, in K.</summary>
    public double CoveredKelvin => Coverage * AveragedRmsKelvin;

    /// <summary>The lag on the declared ramp as a voltage at the pin (the closed form's slope times the lag in K).</summary>
    public double RampLagVolts => RampLagKelvin * Math.Abs(VoltsPerKelvin);

    /// <summary>One LSB in K at this temperature.</summary>
    public double LsbKelvin => LsbVolts / Math.Abs(VoltsPerKelvin);

    /// <summary>
    /// The smallest temperature step a reading resolves free of noise: the span ±k·σ the reading wanders over, never
    /// finer than one LSB (the peak-to-peak noise in the sense of "noise-free resolution"; common practice, no source).
    /// </summary>
    public double NoiseFreeResolutionKelvin => Math.Max(LsbKelvin, 2 * CoveredKelvin);

    /// <summary>The reading's rms noise in LSB.</summary>
    public double AveragedRmsLsb => AveragedRmsVolts / LsbVolts;
}

/// <summary>
/// The noise of the design over the check: the readings at each temperature, the band the sampled noise was integrated
/// over, the converter noise assumed or declared, the averaging and what it costs in time and lag.
/// </summary>
public sealed record NoiseSummary(
    IReadOnlyList<ReadingNoise> Points,
    double FromHertz,
    double ToHertz,
    double NoiseBandwidthHertz,
    string ConverterNoise,
    bool ConverterNoiseAssumed,
    int ReadingsAveraged,
    double ReadingSeconds,
    double CorrelationSeconds,
    double EffectiveReadings,
    double? RampKelvinPerSecond,
    double LagSeconds,
    string Method)
{
    /// <summary>What the band line of a report says, where the band is not the sampling network's (a delta-sigma converter's digital filter); null: the sampling network's.</summary>
    public string? Band { get; init; }

    /// <summary>Whether each conversion samples kT/C on a sampling capacitor the report shows beside its closed form (a successive-approximation converter).</summary>
    public bool SampledKtc { get; init; } = true;

    /// <summary>The reading with the largest ±k·σ in K against the budget's point (largest in K).</summary>
    public ReadingNoise Worst => Points.MaxBy(p => p.CoveredKelvin)!;
}
