using ThermVerify.Design;

namespace ThermVerify.Check.Remedies;

/// <summary>
/// Remedies that change a netlist's own parts ([netlist]): the tempco a [[netlist.part]] resistor needs (a bound
/// the check spreads at both signs), the value of the resistor `fixed` names (in the netlist, where the user changes it),
/// and a switched excitation's `switch_on_lead`. Each is applied to a copy of the netlist as parsed (its ideal transfer,
/// the closed form, follows) and proven by the full check of the changed design, as every remedy is (<see cref="RemedyFinder"/>).
/// </summary>
internal static class NetlistKnobs
{
    /// <summary>The tempco of a [[netlist.part]] resistor, searched towards zero (its sign kept where it was written with one).</summary>
    public static Knob PartTempco(NetlistPartSpec part) => new($"netlist.part.{part.Name}.tempco", "ppm/K", Better.Lower,
        d => Math.Abs(d.Netlist!.Part(part.Name)!.TempcoPerKelvin),
        (d, v) => d with { Netlist = d.Netlist!.WithPart(part.Name, p => p with { TempcoPerKelvin = (p.TempcoPerKelvin < 0 ? -1 : 1) * v }) },
        _ => 0, $"give {part.Name} ([[netlist.part]]) a tempco of at most")
    {
        Removal = $"give {part.Name} a negligible tempco",
    };

    /// <summary>
    /// The fixed resistor's value, searched down to a hundredth of it: a lower value lowers the resistance the pin
    /// sees, so leakage, the sampling current and the reservoir's charging move it less (the slope it costs is in the
    /// changed design's check). The user changes it in the netlist file; its tolerance and tempco stay.
    /// </summary>
    public static Knob FixedValue(NetlistSpec netlist)
    {
        var name = netlist.FixedElement!;
        return new Knob($"netlist.fixed ({name} in {netlist.File})", "Ω", Better.Lower,
            d => d.Netlist!.Parsed.Find(name)!.Value,
            (d, v) => d with { Netlist = d.Netlist!.WithValue(name, v) },
            d => d.Netlist!.Parsed.Find(name)!.Value / 100, $"change {name} in {netlist.File} to at most");
    }

    /// <summary>
    /// The switch-on lead, searched up to half the reading interval (or 100 times the lead without one), and no further
    /// than a PULSE excitation stays on: its rise and width less one acquisition window (the loader's own limit).
    /// </summary>
    public static readonly Knob SwitchOnLead = new("netlist.switch_on_lead", "s", Better.Higher,
        d => d.Netlist!.SwitchOnLeadSeconds,
        (d, v) => d with { Netlist = d.Netlist! with { SwitchOnLeadSeconds = v } },
        LeadLimit, "switch the excitation on at least this long before the first acquisition window:");

    private static double LeadLimit(FrontEndDesign d)
    {
        var n = d.Netlist!;
        var limit = n.ReadingIntervalSeconds is { } interval ? interval / 2 : 100 * n.SwitchOnLeadSeconds!.Value;
        foreach (var p in n.Parsed.Elements.Select(e => e.Pulse).OfType<Design.Netlists.NetlistPulse>())
            limit = Math.Min(limit, p.RiseSeconds + p.WidthSeconds - d.Adc.AcquisitionTimeSeconds);
        return limit;
    }

    /// <summary>The netlist knobs that can shrink a finding, to try after the design's others.</summary>
    public static IReadOnlyList<Knob> For(string findingId, FrontEndDesign design, CheckPoint worst)
    {
        if (design.Netlist is not { } netlist) return [];
        var fixedValue = netlist.FixedElement is null ? Array.Empty<Knob>() : [FixedValue(netlist)];
        return findingId switch
        {
            "dc-loading" => [.. netlist.Parts.Where(p => p.TempcoPerKelvin != 0).Select(PartTempco), .. design.Adc.PinLeakageAmperes != 0 ? fixedValue : []],
            "settling" when netlist.SwitchOnLeadSeconds is not null && worst.FirstConversion => [SwitchOnLead, .. fixedValue],
            "settling" or "reservoir-recovery" => fixedValue,
            _ => [],
        };
    }
}
