using ThermVerify.Circuits.Spice;
using ThermVerify.Simulation.Mna;
using ThermVerify.Simulation.Stamps;

namespace ThermVerify.Circuits;

/// <summary>
/// Junction diode, Shockley equation I = Is·(exp(V/(n·Vt)) − 1) with Vt = kT/q at the circuit
/// temperature, and an optional series resistance. Is does not scale with temperature here (give the
/// value for the temperature studied); no junction capacitance, no breakdown. Meant for input clamps.
/// </summary>
public sealed record Diode(string Name, string Anode, string Cathode, double SaturationCurrentAmperes = 1e-14,
    double EmissionCoefficient = 1, double SeriesResistanceOhms = 0) : Element(Name)
{
    public override IReadOnlyList<string> Nodes => [Anode, Cathode];

    internal override IEnumerable<(string A, string B)> DcPaths => [(Anode, Cathode)];

    internal override IReadOnlyList<Unknown> ExtraUnknowns =>
        SeriesResistanceOhms > 0 ? [Unknown.Voltage($"{Name}#junction")] : [];

    internal override void Validate()
    {
        base.Validate();
        ElementChecks.DistinctNodes(this, Anode, Cathode);
        ElementChecks.Positive(this, SaturationCurrentAmperes, "saturation current");
        ElementChecks.Positive(this, EmissionCoefficient, "emission coefficient");
        ElementChecks.NonNegative(this, SeriesResistanceOhms, "series resistance");
    }

    /// <summary>xti = 0 and eg = 0 keep Is fixed with temperature, as in the built-in model.</summary>
    internal override void WriteSpice(SpiceLines deck)
    {
        var model = $"{Name}_model";
        deck.Line($"{SpiceLines.InstanceName('D', Name)} {Anode} {Cathode} {model}");
        deck.Definition(model, $".model {model} d is={SpiceNumber.Format(SaturationCurrentAmperes)} n={SpiceNumber.Format(EmissionCoefficient)} " +
                               $"rs={SpiceNumber.Format(SeriesResistanceOhms)} xti=0 eg=0 cjo=0");
    }

    internal override Stamp Bind(BindContext context) => new DiodeStamp(this, context);
}
