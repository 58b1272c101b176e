namespace ThermVerify.Design;

/// <summary>
/// What a bridge asks of the rest of the design: a buffer would follow one output only (the bridge is read
/// differentially by the converter itself), and a delta-sigma converter's check reads a single-ended input; both are
/// refused rather than guessed.
/// </summary>
internal static class BridgeRules
{
    public static void Check(TomlSection root, FrontEndDesign design)
    {
        if (design.Buffer is not null)
            throw root.ErrorAtKey("buffer", "a buffer behind a bridge is not modelled",
                "Remove [buffer]: the converter reads the bridge's two outputs directly (add a series resistor and reservoir in [filter] if it needs one).");
        if (design.Amplifier is not null && design.Adc.Input != AdcInput.SingleEnded)
            throw root.Section("adc")!.ErrorAtValue("input", "behind an amplifier the converter reads its single output",
                "Remove input (single-ended), or remove [amplifier] to read the bridge with two sampled inputs.");
        if (design.Adc.DeltaSigma is not null)
            throw root.Section("adc")!.ErrorAtValue("kind", "a bridge read by a delta-sigma converter is not modelled yet",
                "Use the successive-approximation converter (remove kind), or a [divider] for a delta-sigma converter.");
    }
}
