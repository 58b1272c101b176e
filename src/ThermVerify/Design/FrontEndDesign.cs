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
    /// <summary>The voltage-excited divider; null when a current source excites the sensor (<see cref="CurrentSource"/>).</summary>
    public DividerSpec? Divider { get; init; }
    /// <summary>
    /// A Wheatstone bridge ([bridge]): the opposite half, whose midpoint is the converter's negative input; <see cref="Divider"/>
    /// is then the sensor's half. Null: no bridge.
    /// </summary>
    public BridgeSpec? Bridge { get; init; }
    /// <summary>An amplifier between a bridge's outputs and the converter ([amplifier]); null: none.</summary>
    public AmplifierSpec? Amplifier { get; init; }

    /// <summary>The gain from the sensor's network to the converter: the buffer's, the amplifier's, or 1.</summary>
    public double StageGain => Buffer?.Gain ?? Amplifier?.Gain ?? 1;
    /// <summary>The current source through the sensor; null for a divider. A design has exactly one of the two.</summary>
    public CurrentSourceSpec? CurrentSource { get; init; }
    /// <summary>A front end given as a SPICE netlist ([netlist]) instead of the built-in shape; null for the built-in shape.</summary>
    public NetlistSpec? Netlist { get; init; }
    /// <summary>The sensor's leads (with a current source); null: no leads modelled.</summary>
    public WiringSpec? Wiring { get; init; }
    /// <summary>Null when the divider drives the filter and ADC directly.</summary>
    public BufferSpec? Buffer { get; init; }
    public required FilterSpec Filter { get; init; }
    /// <summary>Clamp diodes at the pin and the insulation's leakage; null: none.</summary>
    public ProtectionSpec? Protection { get; init; }
    public required AdcSpec Adc { get; init; }
    public required CheckSpec Check { get; init; }
    /// <summary>How noise counts in the verdict: coverage, firmware averaging, the ramp to follow ([noise]).</summary>
    public NoiseSpec Noise { get; init; } = NoiseSpec.Default;
    /// <summary>How tolerances are spread for the worst-case and Monte Carlo analyses.</summary>
    public ToleranceSpec Tolerances { get; init; } = ToleranceSpec.Default;

    /// <summary>
    /// The files the design was read from, with their SHA-256 (every output names the design by it); null for a
    /// design built in code. A changed copy (a remedy, a built unit) keeps it: it still comes from those files.
    /// </summary>
    public Provenance.DesignDigest? Source { get; init; }

    /// <summary>The divider of a voltage-excited design (every divider-only analysis asks through here).</summary>
    public DividerSpec VoltageDivider => Divider ?? throw new InvalidOperationException($"{Name} is excited by a current source, not a divider.");

    /// <summary>The converter's reference as the firmware takes it: a fixed one, the excitation (ratiometric divider) or I·R_ref.</summary>
    public double NominalReferenceVolts =>
        Adc.ReferenceVolts ?? CurrentSource?.NominalReferenceVolts ?? Divider?.ExcitationVolts ?? Netlist?.ReferenceVolts
        ?? throw new InvalidOperationException($"{Name} has no reference.");

    /// <summary>
    /// Full scale referred to the pin: the reference over the programmable gain (the reference itself without a gain
    /// stage). Every analysis works on the pin's scale, so the gain enters as the converter's LSB at the pin.
    /// </summary>
    public double FullScaleAtPinVolts => NominalReferenceVolts / Adc.ProgrammableGain;
}
