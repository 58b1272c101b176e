using ThermVerify.Circuits.Spice;
using ThermVerify.Sensors;

namespace ThermVerify.Circuits;

/// <summary>A resistive temperature sensor at the circuit temperature: R = sensor.ResistanceOhms(T).</summary>
internal sealed record SensorResistor(string Name, string NodeA, string NodeB, ISensorModel Sensor) : Element(Name)
{
    public override IReadOnlyList<string> Nodes => [NodeA, NodeB];

    internal override IEnumerable<(string A, string B)> DcPaths => [(NodeA, NodeB)];

    internal override void Validate()
    {
        base.Validate();
        ElementChecks.DistinctNodes(this, NodeA, NodeB);
        if (Sensor is null)
            throw new CircuitException($"{Describe} has no sensor model; give it one.");
    }

    /// <summary>The sensor's resistance at <paramref name="temperatureCelsius"/>, checked to be usable.</summary>
    public double ResistanceOhmsAt(double temperatureCelsius)
    {
        double r;
        try
        {
            r = Sensor.ResistanceOhms(temperatureCelsius);
        }
        catch (SensorRangeException e)
        {
            throw new CircuitException($"{Describe}: {e.Message}", e);
        }
        if (!double.IsFinite(r) || r <= 0)
            throw new CircuitException($"{Describe}: the sensor gives {r:G6} Ω at {temperatureCelsius:G6} °C; a resistance must be finite and positive.");
        return r;
    }

    internal override void WriteSpice(SpiceLines deck)
    {
        var name = SpiceLines.InstanceName('R', Name);
        if (deck.SweepsTemperature)
            deck.Line($"{name} {NodeA} {NodeB} r='{SensorExpression.For(Sensor)}'");
        else
            deck.Line($"{name} {NodeA} {NodeB} {SpiceNumber.Format(ResistanceOhmsAt(deck.TemperatureCelsius))}");
    }
}
