using ThermVerify.Simulation.Mna;
using ThermVerify.Simulation.Stamps;

namespace ThermVerify.Circuits;

/// <summary>
/// A switch driven by time alone: <see cref="OnResistanceOhms"/> while the schedule says closed,
/// <see cref="OffResistanceOhms"/> otherwise. Edges are exact breakpoints; there is no control voltage.
/// </summary>
public sealed record TimedSwitch(string Name, string NodeA, string NodeB, double OnResistanceOhms,
    double OffResistanceOhms, SwitchSchedule Schedule) : Element(Name)
{
    public override IReadOnlyList<string> Nodes => [NodeA, NodeB];

    internal override IEnumerable<(string A, string B)> DcPaths => [(NodeA, NodeB)];

    internal override void Validate()
    {
        base.Validate();
        ElementChecks.DistinctNodes(this, NodeA, NodeB);
        ElementChecks.Positive(this, OnResistanceOhms, "on resistance");
        ElementChecks.Positive(this, OffResistanceOhms, "off resistance");
        if (Schedule is null)
            throw new CircuitException($"{Describe} has no schedule; give intervals or a periodic schedule.");
        Schedule.Validate(this);
    }

    internal override Stamp Bind(BindContext context) => new TimedSwitchStamp(this, context);

    /// <summary>A SPICE switch on a 0/1 V control node driven by the schedule with 1 ps edges.</summary>
    internal override void WriteSpice(SpiceDeckBuilder deck)
    {
        var control = $"{Name}_control";
        var model = $"{Name}_model";
        deck.Card($"{SpiceDeckBuilder.Name('S', Name)} {NodeA} {NodeB} {control} 0 {model}");
        deck.Card($"{SpiceDeckBuilder.Name('V', control)} {control} 0 {Schedule.ToSpiceControl()}");
        deck.Model($".model {model} sw vt=0.5 vh=0 ron={SpiceDeckBuilder.Number(OnResistanceOhms)} roff={SpiceDeckBuilder.Number(OffResistanceOhms)}");
    }
}
