using ThermVerify.Circuits.Spice;

namespace ThermVerify.Circuits;

/// <summary>
/// Resistor with a quadratic temperature coefficient about <see cref="ReferenceCelsius"/>:
/// R(T) = R·(1 + tc1·ΔT + tc2·ΔT²), ΔT = T − T_ref, T the circuit temperature.
/// </summary>
internal sealed record Resistor(string Name, string NodeA, string NodeB, double ResistanceOhms,
    double Tc1PerKelvin = 0, double Tc2PerKelvinSquared = 0, double ReferenceCelsius = 25) : Element(Name)
{
    public override IReadOnlyList<string> Nodes => [NodeA, NodeB];

    internal override IEnumerable<(string A, string B)> DcPaths => [(NodeA, NodeB)];

    public bool DependsOnTemperature => Tc1PerKelvin != 0 || Tc2PerKelvinSquared != 0;

    public double ResistanceOhmsAt(double temperatureCelsius)
    {
        var dt = temperatureCelsius - ReferenceCelsius;
        return ResistanceOhms * (1 + Tc1PerKelvin * dt + Tc2PerKelvinSquared * dt * dt);
    }

    internal override void Validate()
    {
        base.Validate();
        ElementChecks.DistinctNodes(this, NodeA, NodeB);
        ElementChecks.Positive(this, ResistanceOhms, "resistance");
        ElementChecks.Finite(this, Tc1PerKelvin, "tc1");
        ElementChecks.Finite(this, Tc2PerKelvinSquared, "tc2");
        ElementChecks.Finite(this, ReferenceCelsius, "reference temperature");
    }

    /// <summary>tc1/tc2 as SPICE instance parameters when referenced to 25 °C (the deck's TNOM); else the same quadratic as an expression.</summary>
    internal override void WriteSpice(SpiceLines deck)
    {
        var name = SpiceLines.InstanceName('R', Name);
        if (!DependsOnTemperature)
            deck.Line($"{name} {NodeA} {NodeB} {SpiceNumber.Format(ResistanceOhms)}");
        else if (ReferenceCelsius == SpiceDeckWriter.NominalCelsius)
            deck.Line($"{name} {NodeA} {NodeB} {SpiceNumber.Format(ResistanceOhms)} tc1={SpiceNumber.Format(Tc1PerKelvin)} tc2={SpiceNumber.Format(Tc2PerKelvinSquared)}");
        else if (!deck.SweepsTemperature)
            deck.Line($"{name} {NodeA} {NodeB} {SpiceNumber.Format(ResistanceOhmsAt(deck.TemperatureCelsius))}");
        else
        {
            var dt = $"(temper-{SpiceNumber.Format(ReferenceCelsius)})";
            deck.Line($"{name} {NodeA} {NodeB} r='{SpiceNumber.Format(ResistanceOhms)}*(1+{SpiceNumber.Format(Tc1PerKelvin)}*{dt}+{SpiceNumber.Format(Tc2PerKelvinSquared)}*{dt}*{dt})'");
        }
    }
}
