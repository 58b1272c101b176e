namespace ThermVerify.Tolerances;

/// <summary>Which part of a unit a tolerance moves.</summary>
public enum ToleranceKind
{
    /// <summary>Sensor resistance scale (R25 or R0 of a Beta NTC; every point of a table or Steinhart–Hart curve together).</summary>
    SensorResistance,
    /// <summary>β of a Beta-model NTC.</summary>
    SensorBeta,
    /// <summary>IEC 60751 class of a platinum RTD: a temperature deviation, as a fraction of the class band ±(a + b·|t|).</summary>
    RtdClass,
    FixedResistance,
    /// <summary>Fixed resistor tempco, spread over ±|tempco| (the written tempco is read as a bound).</summary>
    FixedTempco,
    Excitation,
    /// <summary>ADC reference (absent when ratiometric: the reference is the excitation, which then cancels).</summary>
    Reference,
    /// <summary>IEEE Std 1241 offset error, LSB.</summary>
    AdcOffset,
    /// <summary>IEEE Std 1241 gain error, fraction of full scale.</summary>
    AdcGain,
    /// <summary>IEEE Std 1241 integral nonlinearity, LSB, as a bow between the end points.</summary>
    AdcInl,
    BufferOffset,
    /// <summary>The op-amp's offset drift, spread over ±|drift| (V/K).</summary>
    BufferDrift,
    BufferBias,
    /// <summary>The reference's tempco, spread over ±|tempco| (a fixed reference only).</summary>
    ReferenceTempco,
    /// <summary>ADC pin leakage, as a fraction of its nominal value.</summary>
    Leakage,
    /// <summary>A current source's current, as a fraction (cancels with a reference resistor).</summary>
    Current,
    /// <summary>A current source's tempco, spread over ±|tempco|.</summary>
    CurrentTempco,
    /// <summary>The ratiometric reference resistor, as a fraction.</summary>
    ReferenceResistance,
    /// <summary>The reference resistor's tempco, spread over ±|tempco|.</summary>
    ReferenceResistorTempco,
    /// <summary>3 wires: the mismatch of the second current against the first, spread over ±|mismatch|.</summary>
    CurrentMismatch,
    /// <summary>A bridge's opposite half, the resistor from the excitation to the negative output, as a fraction.</summary>
    BridgeHighResistance,
    /// <summary>Its tempco, spread over ±|tempco|.</summary>
    BridgeHighTempco,
    /// <summary>A bridge's opposite half, the resistor from the negative output to ground, as a fraction.</summary>
    BridgeLowResistance,
    /// <summary>Its tempco, spread over ±|tempco|.</summary>
    BridgeLowTempco,
    /// <summary>A bridge amplifier's offset, spread over ±|offset| (V).</summary>
    AmplifierOffset,
    /// <summary>Its offset drift, spread over ±|drift| (V/K).</summary>
    AmplifierDrift,
    /// <summary>Its gain error, spread over ±|error| (a fraction).</summary>
    AmplifierGainError,
    /// <summary>Its common-mode gain over its differential gain, spread over ±10^(−CMRR/20).</summary>
    AmplifierCommonMode,
    /// <summary>Its input bias current, spread over ±|current| (A).</summary>
    AmplifierBias,
    /// <summary>The clamp diodes' net reverse leakage, spread over ±|leakage| (one diode or the other leaking).</summary>
    ClampLeakage,
    /// <summary>The programmable-gain stage's gain error, spread over ±|error| (a fraction).</summary>
    GainStageGain,
    /// <summary>The programmable-gain stage's input current, spread over ±|current|.</summary>
    GainStageInputCurrent,
    /// <summary>A netlist part's value ([[netlist.part]] tolerance), as a fraction; the element is <see cref="ToleranceParameter.Element"/>.</summary>
    NetlistPartValue,
    /// <summary>A netlist resistor's tempco, spread over ±|tempco|; the element is <see cref="ToleranceParameter.Element"/>.</summary>
    NetlistPartTempco,
    /// <summary>A delta-sigma converter's input buffer current (adc.input_current), spread over ±|current| when written as a bound.</summary>
    DeltaSigmaInputCurrent,
    /// <summary>3 wires in a bridge: the sensor arm's lead against the adjacent arm's, spread over ±|mismatch|.</summary>
    LeadMismatch,
}
