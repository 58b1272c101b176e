using ThermVerify.Circuits.Spice;

namespace ThermVerify.Circuits;

/// <summary>
/// Independent voltage source: V(Positive) − V(Negative) = waveform(t). Its branch current flows from
/// Positive through the source to Negative (SPICE convention). <see cref="AcMagnitude"/> drives AC analysis.
/// </summary>
internal sealed record VoltageSource(string Name, string Positive, string Negative, Waveform Waveform,
    double AcMagnitude = 0, double AcPhaseDegrees = 0) : Element(Name)
{
    public override IReadOnlyList<string> Nodes => [Positive, Negative];

    internal override IEnumerable<(string A, string B)> DcPaths => [(Positive, Negative)];

    internal override IEnumerable<(string A, string B)> VoltageDefinedPaths => [(Positive, Negative)];

    internal override IReadOnlyList<ExtraUnknown> ExtraUnknowns => [ExtraUnknown.Current($"I({Name})")];

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
        deck.Line($"{SpiceLines.InstanceName('V', Name)} {Positive} {Negative} {Waveform.ToSpice()}{SpiceSource.Ac(AcMagnitude, AcPhaseDegrees)}");
}
