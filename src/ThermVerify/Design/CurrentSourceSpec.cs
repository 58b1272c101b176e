namespace ThermVerify.Design;

/// <summary>
/// A current source (an IDAC or a precision source) that drives its current through the sensor to ground; the ADC
/// reads the sensor's voltage. With a <see cref="ReferenceResistorOhms"/> the same current first flows through a
/// reference resistor whose voltage is the converter's reference (ratiometric: the current's own error cancels).
/// </summary>
public sealed record CurrentSourceSpec
{
    public required double CurrentAmperes { get; init; }
    /// <summary>Fraction, e.g. 0.01 for 1 %.</summary>
    public double CurrentTolerance { get; init; } = DesignDefaults.Tolerance;
    /// <summary>Fraction per kelvin; the source sits at the board temperature (the swept one without a board temperature).</summary>
    public double CurrentTempcoPerKelvin { get; init; }
    /// <summary>Written with a sign: taken at that sign; without one the tempco is a bound (<see cref="SignWritten"/>).</summary>
    public bool CurrentTempcoSigned { get; init; }
    /// <summary>The output voltages the source can hold its current over; null: not stated (not checked).</summary>
    public VoltageRange? Compliance { get; init; }
    /// <summary>The source's own output resistance, in parallel with its output; null: ideal (infinite).</summary>
    public double? OutputResistanceOhms { get; init; }
    /// <summary>Null: the converter has a fixed reference of its own; a value: the ratiometric reference resistor.</summary>
    public double? ReferenceResistorOhms { get; init; }
    public double ReferenceResistorTolerance { get; init; } = DesignDefaults.Tolerance;
    /// <summary>Fraction per kelvin; the resistor sits at the board temperature.</summary>
    public double ReferenceResistorTempcoPerKelvin { get; init; }
    public bool ReferenceResistorTempcoSigned { get; init; }
    /// <summary>The converter's reference input seen across the reference resistor (it takes part of the current); null: none.</summary>
    public double? ReferenceInputOhms { get; init; }

    /// <summary>The converter's reference as the firmware takes it: I·R_ref with a reference resistor.</summary>
    public double? NominalReferenceVolts => ReferenceResistorOhms is { } r ? CurrentAmperes * r : null;
}
