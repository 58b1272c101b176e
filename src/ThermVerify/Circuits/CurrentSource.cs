using ThermVerify.Circuits.Spice;

namespace ThermVerify.Circuits;

/// <summary>
/// Independent current source: the current flows from Positive through the source to Negative
/// (SPICE convention), i.e. it is drawn out of Positive and pushed into Negative.
/// </summary>
internal sealed record CurrentSource(string Name, string Positive, string Negative, Waveform Waveform,
    double AcMagnitude = 0, double AcPhaseDegrees = 0) : Element(Name)
{
    public override IReadOnlyList<string> Nodes => [Positive, Negative];

    internal override void Validate()
    {
        base.Validate();
        ElementChecks.DistinctNodes(this, Positive, Negative);
        if (Waveform is null)
            throw new CircuitException($"{Describe} has no waveform; give a DC value, a pulse or a PWL.");
        Waveform.Validate(this);
        ElementChecks.Finite(this, AcMagnitude, "AC magnitude");
        ElementChecks.Finite(this, AcPhaseDegrees, "AC phase");
    }

    internal override void WriteSpice(SpiceLines deck) =>
        deck.Line($"{SpiceLines.InstanceName('I', Name)} {Positive} {Negative} {Waveform.ToSpice()}{SpiceSource.Ac(AcMagnitude, AcPhaseDegrees)}");
}
