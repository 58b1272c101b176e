using ThermVerify.Circuits.Spice;

namespace ThermVerify.Circuits;

/// <summary>
/// Voltage-controlled current source: a current Gm·(V(CP) − V(CN)) flows from Positive through the
/// source to Negative (SPICE convention).
/// </summary>
internal sealed record Vccs(string Name, string Positive, string Negative, string ControlPositive,
    string ControlNegative, double TransconductanceSiemens) : Element(Name)
{
    public override IReadOnlyList<string> Nodes => [Positive, Negative, ControlPositive, ControlNegative];

    internal override void Validate()
    {
        base.Validate();
        ElementChecks.DistinctNodes(this, Positive, Negative);
        ElementChecks.Finite(this, TransconductanceSiemens, "transconductance");
    }

    internal override void WriteSpice(SpiceLines deck) =>
        deck.Line($"{SpiceLines.InstanceName('G', Name)} {Positive} {Negative} {ControlPositive} {ControlNegative} {SpiceNumber.Format(TransconductanceSiemens)}");
}
