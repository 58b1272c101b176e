namespace ThermVerify.Design;

/// <summary>
/// What the excitation asks of the rest of the design: exactly one of [divider] and [current_source]; a current source
/// reads against a fixed reference, or ratiometrically through its reference resistor, never against itself; and the
/// parts not yet modelled (a buffer behind a current source, 3 or 4 wires to a divider's sensor) are refused rather
/// than guessed.
/// </summary>
internal static class ExcitationRules
{
    /// <summary>
    /// Before the sections are read: [bridge] beside [divider] or [current_source] is refused at the bridge, rather than
    /// at whatever the other section then lacks.
    /// </summary>
    public static void CheckOneShape(TomlSection root)
    {
        if (root.Section("bridge") is null) return;
        foreach (var other in new[] { "divider", "current_source" })
            if (root.Section(other) is not null)
                throw root.ErrorAtKey("bridge", $"both [bridge] and [{other}]",
                    "A sensor is excited one way: keep [bridge] (the sensor's half and the opposite half) or the other section.");
    }

    public static void Check(TomlSection root, FrontEndDesign design)
    {
        if (design.Adc.Input != AdcInput.SingleEnded && design.Bridge is null && design.Netlist is null)
            throw root.Section("adc")!.ErrorAtValue("input", "a differential input reads a bridge's two outputs, and this design has no bridge",
                "Write input = \"single-ended\" (or remove it), or describe the front end as a [bridge] (or a [netlist] with negative_pin).");
        if (design.Netlist is not null)
        {
            NetlistRules.Check(root, design);
            return;
        }
        if (design.Divider is null && design.CurrentSource is null)
            throw new DesignException(root.SourceName, 1, 1, "divider", "missing section [divider] or [current_source]",
                "Add a [divider] section (sensor_side, fixed_resistor, excitation) for a voltage-excited divider, a [bridge] section for a Wheatstone bridge, or a [current_source] section (current) for a current through the sensor.");
        if (design.Divider is not null && design.CurrentSource is not null)
            throw root.ErrorAtKey("current_source", "both [divider] and [current_source]",
                "A sensor is excited one way: keep [divider] (a voltage and a fixed resistor) or [current_source] (a current through the sensor).");
        if (design.Wiring is { Wires: not 2 } && design.CurrentSource is null)
            BridgeWiringRules.Check(root, design);
        if (design.Wiring is { LeadMismatch: not 0 } && (design.Bridge is null || design.Wiring.Wires != 3))
            throw root.Section("wiring")!.ErrorAtKey("lead_mismatch", "lead_mismatch is the mismatch of the leads in a bridge's arms (3 wires in a [bridge])",
                "Remove it; with a [current_source] the 3-wire mismatch is current_mismatch (the two currents).");
        if (design.Amplifier is not null && design.Bridge is null)
            throw root.ErrorAtKey("amplifier", "an amplifier is modelled between a bridge's two outputs, and this design has no bridge",
                "Describe the front end as a [bridge], or use [buffer] for an op-amp stage behind a divider.");
        if (design.Bridge is not null)
            BridgeRules.Check(root, design);
        if (design.CurrentSource is not { } source) return;
        if (design.Buffer is not null)
            throw root.ErrorAtKey("buffer", "a buffer behind a current-excited sensor is not modelled",
                "Remove [buffer]: the converter reads the sensor's voltage directly (add a series resistor and reservoir in [filter] if the converter needs one).");
        var adc = root.Section("adc")!;
        if (source.ReferenceResistorOhms is null && design.Adc.IsRatiometric)
            throw adc.ErrorAtValue("reference", "a current source has no voltage for the converter to be ratiometric to",
                "Give the converter's reference as a voltage, or add reference_resistor to [current_source] (its voltage is then the reference).");
        if (source.ReferenceResistorOhms is not null && !design.Adc.IsRatiometric)
            throw adc.ErrorAtValue("reference", "with a reference resistor the converter's reference is that resistor's voltage",
                "Write reference = \"ratiometric\", or remove reference_resistor from [current_source] to read against this fixed reference.");
    }
}
