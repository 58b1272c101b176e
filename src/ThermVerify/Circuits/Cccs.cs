using ThermVerify.Circuits.Spice;

namespace ThermVerify.Circuits;

/// <summary>An element whose output follows the current through a voltage source of the same circuit (SPICE's F and H).</summary>
internal interface ICurrentControlled
{
    /// <summary>The voltage source whose current (from its + node through it to its − node, SPICE's sense) controls the output.</summary>
    string ControlSource { get; }
}

/// <summary>
/// Current-controlled current source (SPICE's F): a current Gain·I(ControlSource) flows from Positive through the
/// source to Negative, I(ControlSource) being the current from the controlling source's + node through it to its −
/// node (SPICE convention).
/// </summary>
internal sealed record Cccs(string Name, string Positive, string Negative, string ControlSource, double Gain) : Element(Name), ICurrentControlled
{
    public override IReadOnlyList<string> Nodes => [Positive, Negative];

    internal override void Validate()
    {
        base.Validate();
        ElementChecks.DistinctNodes(this, Positive, Negative);
        ElementChecks.Finite(this, Gain, "gain");
    }

    internal override void WriteSpice(SpiceLines deck) =>
        deck.Line($"{SpiceLines.InstanceName('F', Name)} {Positive} {Negative} {SpiceLines.InstanceName('V', ControlSource)} {SpiceNumber.Format(Gain)}");
}
