namespace ThermVerify.Design;

/// <summary>Defaults for keys a design file may leave out; docs/design-file.md lists the same values.</summary>
internal static class DesignDefaults
{
    /// <summary>Tolerances and tempcos left out are taken as zero: the nominal design.</summary>
    public const double Tolerance = 0;
    public const double ReferenceCelsius = 25;
    public const double BetaFromCelsius = 25;
    public const double BetaToCelsius = 85;
    public const double StepKelvin = 1;
    public const double SettleLimitLsb = 0.01;
    public const double LeakageDoublingKelvin = 10;
    public const double PinLeakageCelsius = 25;
    public const double MinimumPhaseMarginDegrees = 45;
    /// <summary>A normal tolerance is at 3σ unless the design says otherwise.</summary>
    public const double CoverageFactor = 3;
    /// <summary>
    /// Noise counts in the budget as ±3σ unless the design says otherwise: a reading outside ±3σ of a Gaussian is one in
    /// 370, which a firmware reading every second meets every few minutes (the worst plausible case, not a rare one).
    /// </summary>
    public const double NoiseCoverage = 3;
    /// <summary>
    /// The converter's own rms noise when the design declares none: 0.5 LSB, what an effective resolution one bit below the
    /// nominal one leaves beside the quantisation: √((2Q)²/12 − Q²/12) = Q/2 (IEEE Std 1241 defines ENOB from the total
    /// rms error; taking one bit short as the plausible worst is common practice, no source).
    /// </summary>
    public const double ConverterNoiseLsb = 0.5;
    /// <summary>At most this many conversions averaged into one reading.</summary>
    public const int MaxReadingsAveraged = 65536;
    /// <summary>Copper's resistance tempco, 0.393 %/K (IEC 60028, annealed copper, at 20 °C; from memory), taken at 25 °C.</summary>
    public const double CopperTempcoPerKelvin = 3.93e-3;
    public const int MinBits = 6;
    public const int MaxBits = 24;
}
