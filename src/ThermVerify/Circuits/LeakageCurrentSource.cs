using ThermVerify.Circuits.Spice;

namespace ThermVerify.Circuits;

/// <summary>
/// A DC current that doubles every <see cref="DoublingKelvin"/>: I(T) = I25·2^((T − 25 °C)/N), the usual
/// description of an input pin's leakage (common practice, no source). Direction as for
/// <see cref="CurrentSource"/>: out of Positive, into Negative; a pin leaking to ground is (pin, "0").
/// </summary>
internal sealed record LeakageCurrentSource(string Name, string Positive, string Negative,
    double CurrentAt25CelsiusAmperes, double DoublingKelvin = 10) : Element(Name)
{
    public override IReadOnlyList<string> Nodes => [Positive, Negative];

    public double CurrentAmperesAt(double temperatureCelsius) =>
        CurrentAt25CelsiusAmperes * Math.Exp(Math.Log(2) * (temperatureCelsius - 25) / DoublingKelvin);

    internal override void Validate()
    {
        base.Validate();
        ElementChecks.DistinctNodes(this, Positive, Negative);
        ElementChecks.Finite(this, CurrentAt25CelsiusAmperes, "current at 25 °C");
        ElementChecks.Positive(this, DoublingKelvin, "doubling interval");
    }

    /// <summary>A behavioural current source, so that the current follows <c>temper</c> in a temperature sweep.</summary>
    internal override void WriteSpice(SpiceLines deck) =>
        deck.Line($"{SpiceLines.InstanceName('B', Name)} {Positive} {Negative} I={SpiceNumber.Format(CurrentAt25CelsiusAmperes)}" +
                  $"*pow(2,(temper-25)/{SpiceNumber.Format(DoublingKelvin)})");
}
