using ThermVerify.Circuits.Spice;

namespace ThermVerify.Circuits;

/// <summary>Inductor; current flows from A to B through it. A short at DC.</summary>
internal sealed record Inductor(string Name, string NodeA, string NodeB, double InductanceHenries,
    double? InitialCurrent = null) : Element(Name)
{
    public override IReadOnlyList<string> Nodes => [NodeA, NodeB];

    internal override IEnumerable<(string A, string B)> DcPaths => [(NodeA, NodeB)];

    internal override IEnumerable<(string A, string B)> VoltageDefinedPaths => [(NodeA, NodeB)];

    internal override IReadOnlyList<ExtraUnknown> ExtraUnknowns => [ExtraUnknown.Current($"I({Name})")];

    internal override void Validate()
    {
        base.Validate();
        ElementChecks.DistinctNodes(this, NodeA, NodeB);
        ElementChecks.Positive(this, InductanceHenries, "inductance");
        if (InitialCurrent is { } i)
            ElementChecks.Finite(this, i, "initial current");
    }

    internal override void WriteSpice(SpiceLines deck) =>
        deck.Line($"{SpiceLines.InstanceName('L', Name)} {NodeA} {NodeB} {SpiceNumber.Format(InductanceHenries)}" +
                  (InitialCurrent is { } i ? $" ic={SpiceNumber.Format(i)}" : ""));
}
