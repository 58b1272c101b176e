using ThermVerify.Circuits.Spice;

namespace ThermVerify.Circuits;

/// <summary>
/// Current-controlled voltage source (SPICE's H): V(Positive) − V(Negative) = Transresistance·I(ControlSource), the
/// current from the controlling source's + node through it to its − node (SPICE convention).
/// </summary>
internal sealed record Ccvs(string Name, string Positive, string Negative, string ControlSource, double TransresistanceOhms)
    : Element(Name), ICurrentControlled
{
    public override IReadOnlyList<string> Nodes => [Positive, Negative];

    internal override IEnumerable<(string A, string B)> DcPaths => [(Positive, Negative)];

    internal override IEnumerable<(string A, string B)> VoltageDefinedPaths => [(Positive, Negative)];

    internal override IReadOnlyList<ExtraUnknown> ExtraUnknowns => [ExtraUnknown.Current($"I({Name})")];

    internal override void Validate()
    {
        base.Validate();
        ElementChecks.DistinctNodes(this, Positive, Negative);
        ElementChecks.Finite(this, TransresistanceOhms, "transresistance");
    }

    internal override void WriteSpice(SpiceLines deck) =>
        deck.Line($"{SpiceLines.InstanceName('H', Name)} {Positive} {Negative} {SpiceLines.InstanceName('V', ControlSource)} {SpiceNumber.Format(TransresistanceOhms)}");
}
