using ThermVerify.Circuits.Spice;

namespace ThermVerify.Circuits;

/// <summary>
/// An op-amp given as the user's own SPICE subcircuit: <see cref="SubcircuitName"/> in the file
/// <see cref="SubcircuitPath"/>, pins in the order non-inverting input, inverting input, positive supply, negative
/// supply, output (the usual order of five-pin op-amp subcircuits). Only a SPICE engine can run it; the built-in
/// engine refuses it with <see cref="EngineUnsupportedException"/>.
/// </summary>
internal sealed record ExternalOpAmp(string Name, string NonInverting, string Inverting, string Output,
    string SubcircuitPath, string SubcircuitName, double SupplyLowVolts, double SupplyHighVolts) : Element(Name)
{
    public override IReadOnlyList<string> Nodes => [NonInverting, Inverting, Output];

    // For the topology check only: the output is driven, as by any op-amp.
    internal override IEnumerable<(string A, string B)> DcPaths => [(Output, Circuit.Ground)];

    internal override void Validate()
    {
        base.Validate();
        ElementChecks.DistinctNodes(this, NonInverting, Inverting);
        if (string.IsNullOrWhiteSpace(SubcircuitPath) || string.IsNullOrWhiteSpace(SubcircuitName) || SubcircuitName.Any(char.IsWhiteSpace))
            throw new CircuitException($"{Describe}: give the subcircuit file and a subcircuit name without spaces.");
        if (!(SupplyLowVolts < SupplyHighVolts))
            throw new CircuitException($"{Describe}: supply {SupplyLowVolts} V .. {SupplyHighVolts} V is empty; give low < high.");
    }

    internal override void WriteSpice(SpiceLines deck)
    {
        var positive = $"{Name}_vcc".ToLowerInvariant();
        var negative = $"{Name}_vee".ToLowerInvariant();
        deck.Include(SubcircuitPath);
        deck.Line($"{SpiceLines.InstanceName('V', positive)} {positive} 0 dc {SpiceNumber.Format(SupplyHighVolts)}");
        deck.Line($"{SpiceLines.InstanceName('V', negative)} {negative} 0 dc {SpiceNumber.Format(SupplyLowVolts)}");
        deck.Line($"{SpiceLines.InstanceName('X', Name)} {NonInverting} {Inverting} {positive} {negative} {Output} {SubcircuitName}");
    }
}
