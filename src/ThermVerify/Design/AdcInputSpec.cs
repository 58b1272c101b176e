namespace ThermVerify.Design;

/// <summary>How the converter takes its input.</summary>
public enum AdcInput
{
    /// <summary>One input against ground (or against a lead or a bridge's second output read at its DC level).</summary>
    SingleEnded,
    /// <summary>Two sampled inputs, code = 2^N·(V+ − V−)/V_ref, signed: −2^(N−1) .. 2^(N−1) − 1 (two's complement).</summary>
    Differential,
    /// <summary>Two sampled inputs, code = 2^N·(V+ − V−)/V_ref, unsigned: 0 .. 2^N − 1 (the negative input at or near ground, or at a bridge's second output).</summary>
    PseudoDifferential,
}

/// <summary>
/// The negative input's own sampling network, for a differential or pseudo-differential converter: its sampling
/// capacitor and switch (sampled with the positive input's schedule), its precharge (the positive input's, or a fixed
/// level of its own), its pin capacitance and its leakage (doubling as the positive pin's does). Each value defaults to
/// the positive input's.
/// </summary>
public sealed record NegativeInputSpec
{
    public required double SamplingCapacitanceFarads { get; init; }
    public required double SwitchResistanceOhms { get; init; }
    public double PinCapacitanceFarads { get; init; }
    /// <summary>Positive flows into the pin, as the positive input's.</summary>
    public double PinLeakageAmperes { get; init; }
    public bool PinLeakageSigned { get; init; }
    /// <summary>A level the negative capacitor is held at before every acquisition (a converter that resets that side to a fixed voltage); null: precharged as the positive input is.</summary>
    public double? PrechargeVolts { get; init; }
}
