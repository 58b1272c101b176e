using ThermVerify.Simulation.Mna;
using ThermVerify.Simulation.Stamps;

namespace ThermVerify.Circuits;

/// <summary>
/// Resistor with a quadratic temperature coefficient about <see cref="ReferenceCelsius"/>:
/// R(T) = R·(1 + tc1·ΔT + tc2·ΔT²), ΔT = T − T_ref, T the circuit temperature.
/// </summary>
public sealed record Resistor(string Name, string NodeA, string NodeB, double ResistanceOhms,
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

    internal override Stamp Bind(BindContext context) => new ResistorStamp(this, context);

    internal override void WriteSpice(SpiceDeckBuilder deck)
    {
        var r = SpiceDeckBuilder.Number(ResistanceOhms);
        var value = DependsOnTemperature
            ? $"r='{r}*(1+({SpiceDeckBuilder.Number(Tc1PerKelvin)})*(temper-({SpiceDeckBuilder.Number(ReferenceCelsius)}))" +
              $"+({SpiceDeckBuilder.Number(Tc2PerKelvinSquared)})*(temper-({SpiceDeckBuilder.Number(ReferenceCelsius)}))*(temper-({SpiceDeckBuilder.Number(ReferenceCelsius)})))'"
            : r;
        deck.Card($"{SpiceDeckBuilder.Name('R', Name)} {NodeA} {NodeB} {value}");
    }
}
