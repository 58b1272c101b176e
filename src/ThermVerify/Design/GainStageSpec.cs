namespace ThermVerify.Design;

/// <summary>
/// A programmable-gain amplifier between the pin and the converter ([adc] gain, pga_gain_error, pga_input_current).
/// The converter sees G·(1 + e)·V_pin, so full scale at the pin is the reference over the gain; the pin is loaded by
/// the amplifier's input current alone. On a successive-approximation converter the sampling switch and capacitor sit
/// behind the amplifier, which drives them, so the pin no longer feels the acquisition's charge. On a delta-sigma
/// converter the gain is <see cref="DeltaSigmaSpec.Gain"/> (the same key) and the input keys there say what the pin sees.
/// </summary>
/// <param name="Gain">G, the nominal gain (a plain number; below 1 attenuates).</param>
/// <param name="GainError">e, the gain's error as a fraction: a bound without a sign, this unit's value with one.</param>
/// <param name="InputCurrentAmperes">The amplifier's input current, positive into the pin; a bound without a sign.</param>
public sealed record GainStageSpec(double Gain, double GainError = 0, double InputCurrentAmperes = 0)
{
    public bool GainErrorSigned { get; init; }
    public bool InputCurrentSigned { get; init; }
}
