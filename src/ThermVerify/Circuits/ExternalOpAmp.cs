using ThermVerify.Circuits.Spice;
using ThermVerify.Design;

namespace ThermVerify.Circuits;

/// <summary>
/// An op-amp given as the user's own SPICE subcircuit: <see cref="SubcircuitName"/> in the file
/// <see cref="SubcircuitPath"/>, pins in the order non-inverting input, inverting input, positive supply, negative
/// supply, output (the usual order of five-pin op-amp subcircuits). Only a SPICE engine can run it; the built-in
/// engine refuses it with <see cref="EngineUnsupportedException"/>. The deck carries the subcircuit as the design
/// loader re-emitted it, element by element, never the file itself (no .include: the file is untrusted).
/// </summary>
internal sealed record ExternalOpAmp(string Name, string NonInverting, string Inverting, string Output,
    SubcircuitRef Subcircuit, double SupplyLowVolts, double SupplyHighVolts) : Element(Name)
{
    public string SubcircuitName => Subcircuit.Name;

    /// <summary>The file as the design names it.</summary>
    public string SubcircuitPath => Subcircuit.File;

    public override IReadOnlyList<string> Nodes => [NonInverting, Inverting, Output];

    // For the topology check only: the output is driven, as by any op-amp.
    internal override IEnumerable<(string A, string B)> DcPaths => [(Output, Circuit.Ground)];

    internal override void Validate()
    {
        base.Validate();
        ElementChecks.DistinctNodes(this, NonInverting, Inverting);
        if (string.IsNullOrWhiteSpace(Subcircuit.Netlist) || !Subcircuit.SpiceName.All(c => char.IsAsciiLetterOrDigit(c) || c == '_'))
            throw new CircuitException($"{Describe}: the subcircuit was not read from its file (load the design with the design loader).");
        if (!(SupplyLowVolts < SupplyHighVolts))
            throw new CircuitException($"{Describe}: supply {SupplyLowVolts} V .. {SupplyHighVolts} V is empty; give low < high.");
    }

    internal override void WriteSpice(SpiceLines deck)
    {
        var positive = $"{Name}_vcc".ToLowerInvariant();
        var negative = $"{Name}_vee".ToLowerInvariant();
        deck.Definition("subcircuit file " + Subcircuit.FullPath, Subcircuit.Netlist);
        deck.Line($"{SpiceLines.InstanceName('V', positive)} {positive} 0 dc {SpiceNumber.Format(SupplyHighVolts)}");
        deck.Line($"{SpiceLines.InstanceName('V', negative)} {negative} 0 dc {SpiceNumber.Format(SupplyLowVolts)}");
        deck.Line($"{SpiceLines.InstanceName('X', Name)} {NonInverting} {Inverting} {positive} {negative} {Output} {Subcircuit.SpiceName}");
    }
}
