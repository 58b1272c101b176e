using ThermVerify.Circuits.Spice;

namespace ThermVerify.Circuits;

/// <summary>
/// Capacitor. <see cref="InitialVoltage"/> (V(A) − V(B) at the start) is used when a transient runs
/// with <c>UseInitialConditions</c>; otherwise the start comes from the operating point.
/// </summary>
internal sealed record Capacitor(string Name, string NodeA, string NodeB, double CapacitanceFarads,
    double? InitialVoltage = null) : Element(Name)
{
    public override IReadOnlyList<string> Nodes => [NodeA, NodeB];

    internal override IEnumerable<(string A, string B)> DcPathsHoldingInitialConditions =>
        InitialVoltage is null ? [] : [(NodeA, NodeB)];

    internal override void Validate()
    {
        base.Validate();
        ElementChecks.DistinctNodes(this, NodeA, NodeB);
        ElementChecks.Positive(this, CapacitanceFarads, "capacitance");
        if (InitialVoltage is { } v)
            ElementChecks.Finite(this, v, "initial voltage");
    }

    internal override void WriteSpice(SpiceLines deck) =>
        deck.Line($"{SpiceLines.InstanceName('C', Name)} {NodeA} {NodeB} {SpiceNumber.Format(CapacitanceFarads)}" +
                  (InitialVoltage is { } v ? $" ic={SpiceNumber.Format(v)}" : ""));
}
