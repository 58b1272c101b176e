using ThermVerify.Design.Netlists;

namespace ThermVerify.Design;

/// <summary>
/// What a netlist front end asks of the rest of the design: the netlist replaces the built-in shape, so [divider],
/// [current_source], [wiring], [buffer], [filter] and [protection] go (their parts belong in the netlist); a ratiometric
/// converter reads against the netlist's reference node, a fixed reference needs none.
/// </summary>
internal static class NetlistRules
{
    private static readonly string[] Shape = ["divider", "bridge", "amplifier", "current_source", "wiring", "buffer", "filter", "protection"];

    public static void Check(TomlSection root, FrontEndDesign design)
    {
        foreach (var key in Shape)
            if (root.Has(key))
                throw root.ErrorAtKey(key, $"[{key}] beside [netlist]",
                    $"The netlist is the whole front end: draw the {key.Replace('_', ' ')}'s parts in the netlist and remove [{key}].");
        var netlist = design.Netlist!;
        var section = root.Section("netlist")!;
        if (design.Adc.IsRatiometric && netlist.ReferenceNode is null)
            throw root.Section("adc")!.ErrorAtValue("reference", "a ratiometric converter with a netlist needs the netlist's reference node",
                "Add reference = \"NODE\" to [netlist] (the node whose voltage is the converter's reference), or give the reference as a voltage.");
        if (!design.Adc.IsRatiometric && netlist.ReferenceNode is not null)
            throw section.ErrorAtValue("reference", "a reference node with a converter whose reference is a fixed voltage",
                "Remove reference here, or write reference = \"ratiometric\" in [adc].");
        if (design.Adc.Input != AdcInput.SingleEnded && netlist.NegativePinNode is null)
            throw section.ErrorAtKey("pin", $"a {(design.Adc.Input == AdcInput.Differential ? "differential" : "pseudo-differential")} input with a netlist needs the node its negative input reads",
                "Add negative_pin = \"NODE\" to [netlist] (the node the converter's negative input reads), or write input = \"single-ended\" in [adc].");
        if (design.Adc.Input == AdcInput.SingleEnded && netlist.NegativePinNode is not null)
            throw section.ErrorAtValue("negative_pin", "a negative input node with a single-ended converter",
                "Write input = \"differential\" (or \"pseudo-differential\") in [adc], or remove negative_pin.");
        // The delta-sigma converter's channel settling takes its switch-on from a divider (ChannelSettling): not a netlist's yet.
        if (netlist.SwitchOnLeadSeconds is not null && design.Adc.DeltaSigma is not null)
            throw section.ErrorAtKey("switch_on_lead", "a switched netlist excitation read by a delta-sigma converter is not checked yet",
                "Remove switch_on_lead (and give the PULSE source its DC value), or check the front end with a successive-approximation converter.");
        if (netlist.SwitchOnLeadSeconds is { } lead)
            foreach (var pulsed in netlist.Parsed.Elements.Where(e => e.Pulse is not null))
            {
                // The first acquisition window closes lead + t_acq after the switch-on; the pulse must still be on then.
                var p = pulsed.Pulse!;
                var sample = lead + design.Adc.AcquisitionTimeSeconds;
                if (p.RiseSeconds + p.WidthSeconds < sample)
                    throw new DesignException(pulsed.At.FileName, pulsed.At.Line, pulsed.At.Column, section.KeyPath("switch_on_lead"),
                        $"the PULSE of {pulsed.Name} ends before the first sample (TR + PW = {p.RiseSeconds + p.WidthSeconds:G4} s, switch_on_lead + acquisition = {sample:G4} s; in the card '{NetlistErrors.Quote(pulsed.At.Card)}')",
                        "Make the pulse's width PW cover switch_on_lead and one acquisition window, or shorten switch_on_lead.");
            }
    }
}
