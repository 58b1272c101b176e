using ThermVerify.Simulation.Mna;
using ThermVerify.Simulation.Stamps;

namespace ThermVerify.Circuits;

/// <summary>
/// Capacitor. <see cref="InitialVoltage"/> (V(A) − V(B) at the start) is used when a transient runs
/// with <c>UseInitialConditions</c>; otherwise the start comes from the operating point.
/// </summary>
public sealed record Capacitor(string Name, string NodeA, string NodeB, double CapacitanceFarads,
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

    internal override Stamp Bind(BindContext context) => new CapacitorStamp(this, context);

    internal override void WriteSpice(SpiceDeckBuilder deck) =>
        deck.Card($"{SpiceDeckBuilder.Name('C', Name)} {NodeA} {NodeB} {SpiceDeckBuilder.Number(CapacitanceFarads)}"
            + (InitialVoltage is { } v ? $" ic={SpiceDeckBuilder.Number(v)}" : ""));
}
