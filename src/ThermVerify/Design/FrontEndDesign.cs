namespace ThermVerify.Design;

/// <summary>
/// One sensor front end as described by a design file, validated. Values are SI doubles with the unit in the
/// property name; fractions (tolerances, gain error) are plain fractions (1 % → 0.01).
/// </summary>
public sealed record FrontEndDesign
{
    public required string Name { get; init; }
    public string? Description { get; init; }
    public required SensorSpec Sensor { get; init; }
    public required DividerSpec Divider { get; init; }
    /// <summary>Null when the divider drives the filter and ADC directly.</summary>
    public BufferSpec? Buffer { get; init; }
    public required FilterSpec Filter { get; init; }
    public required AdcSpec Adc { get; init; }
    public required CheckSpec Check { get; init; }
    /// <summary>How tolerances are spread for the worst-case and Monte Carlo analyses.</summary>
    public ToleranceSpec Tolerances { get; init; } = ToleranceSpec.Default;

    /// <summary>
    /// The files the design was read from, with their SHA-256 (every output names the design by it); null for a
    /// design built in code. A changed copy (a remedy, a built unit) keeps it: it still comes from those files.
    /// </summary>
    public Provenance.DesignDigest? Source { get; init; }
}
