using ThermVerify.Circuits.Spice;

namespace ThermVerify.Circuits;

/// <summary>
/// A switch driven by time alone: <see cref="OnResistanceOhms"/> while the schedule says closed,
/// <see cref="OffResistanceOhms"/> otherwise. Edges are exact breakpoints; there is no control voltage.
/// </summary>
internal sealed record TimedSwitch(string Name, string NodeA, string NodeB, double OnResistanceOhms,
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

    /// <summary>A voltage-controlled switch on its own control node, driven by the schedule (see <see cref="SwitchControl"/>).</summary>
    internal override void WriteSpice(SpiceLines deck)
    {
        var control = $"{Name}_ctl";
        var model = $"{Name}_model";
        deck.Line($"{SpiceLines.InstanceName('V', control)} {control} 0 {SwitchControl.Waveform(Schedule, deck.StopTimeSeconds)}");
        deck.Line($"{SpiceLines.InstanceName('S', Name)} {NodeA} {NodeB} {control} 0 {model}");
        deck.Definition(model, $".model {model} sw vt=0.5 vh=0 ron={SpiceNumber.Format(OnResistanceOhms)} roff={SpiceNumber.Format(OffResistanceOhms)}");
    }
}
