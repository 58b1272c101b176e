namespace ThermVerify.Check.Buffer;

/// <summary>Everything `check` found about the op-amp buffer: stability, headroom, static errors, recovery after sampling, noise.</summary>
public sealed record BufferReport(
    StabilityReport Stability,
    HeadroomResult Headroom,
    IReadOnlyList<StaticErrorPoint> StaticErrors,
    RecoveryResult? Recovery,
    NoiseReport Noise,
    IReadOnlyList<Finding> Findings);
