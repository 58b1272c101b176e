using ThermVerify.Circuits.Spice;

namespace ThermVerify.Circuits;

/// <summary>Voltage-controlled voltage source: V(P) − V(N) = Gain·(V(CP) − V(CN)).</summary>
internal sealed record Vcvs(string Name, string Positive, string Negative, string ControlPositive,
    string ControlNegative, double Gain) : Element(Name)
{
    public override IReadOnlyList<string> Nodes => [Positive, Negative, ControlPositive, ControlNegative];

    internal override IEnumerable<(string A, string B)> DcPaths => [(Positive, Negative)];

    internal override IEnumerable<(string A, string B)> VoltageDefinedPaths => [(Positive, Negative)];

    internal override IReadOnlyList<ExtraUnknown> ExtraUnknowns => [ExtraUnknown.Current($"I({Name})")];

    internal override void Validate()
    {
        base.Validate();
        ElementChecks.DistinctNodes(this, Positive, Negative);
        ElementChecks.Finite(this, Gain, "gain");
    }

    internal override void WriteSpice(SpiceLines deck) =>
        deck.Line($"{SpiceLines.InstanceName('E', Name)} {Positive} {Negative} {ControlPositive} {ControlNegative} {SpiceNumber.Format(Gain)}");
}
