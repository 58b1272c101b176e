using System.Collections.Immutable;
using ThermVerify.Quantities;

namespace ThermVerify.Circuits;

/// <summary>
/// A netlist: elements on named nodes ("0" is ground) at one circuit temperature. Immutable;
/// <c>circuit with { TemperatureCelsius = 80 }</c> gives the same netlist at another temperature.
/// Every element is validated and names are unique when the circuit is made.
/// </summary>
internal sealed record Circuit
{
    public const string Ground = "0";

    public Circuit(IEnumerable<Element> elements, double temperatureCelsius = 25)
    {
        Elements = [.. elements];
        var seen = new HashSet<string>(StringComparer.Ordinal);
        foreach (var e in Elements)
        {
            if (e is null)
                throw new CircuitException("The circuit holds a null element; remove it.");
            e.Validate();
            if (!seen.Add(e.Name))
                throw new CircuitException($"Two elements are named '{e.Name}'; element names must be unique.");
        }
        // SPICE's F and H sense the current of a voltage source of the same circuit.
        foreach (var e in Elements)
            if (e is ICurrentControlled c && !Elements.Any(x => x is VoltageSource && x.Name == c.ControlSource))
                throw new CircuitException($"{e.Describe} senses the current of '{c.ControlSource}', which is no voltage source of the circuit; name a voltage source (a 0 V source in series measures a branch's current).");
        TemperatureCelsius = temperatureCelsius;
    }

    public ImmutableArray<Element> Elements { get; }

    /// <summary>The temperature every temperature-dependent element sees, in °C.</summary>
    public double TemperatureCelsius
    {
        get;
        init => field = CheckTemperature(value);
    }

    /// <summary>Returns a usable circuit temperature or throws naming it.</summary>
    public static double CheckTemperature(double celsius) =>
        double.IsFinite(celsius) && celsius > -PhysicalConstants.ZeroCelsiusInKelvin
            ? celsius
            : throw new CircuitException($"Circuit temperature {celsius} °C is not a physical temperature; give a finite value above −273.15 °C.");

    public Element this[string name] =>
        Elements.FirstOrDefault(e => e.Name == name)
        ?? throw new CircuitException($"The circuit has no element named '{name}'.");

    /// <summary>Every node name except ground, in order of first appearance.</summary>
    public IReadOnlyList<string> NodeNames =>
        Elements.SelectMany(e => e.Nodes).Where(n => n != Ground).Distinct().ToList();

    public Circuit Add(Element element) => new(Elements.Add(element), TemperatureCelsius);

    /// <summary>The same circuit with the element of the same name replaced.</summary>
    public Circuit Replace(Element element)
    {
        var i = Elements.IndexOf(this[element.Name]);
        return new Circuit(Elements.SetItem(i, element), TemperatureCelsius);
    }

    public bool Equals(Circuit? other) =>
        other is not null && TemperatureCelsius.Equals(other.TemperatureCelsius) && Elements.SequenceEqual(other.Elements);

    public override int GetHashCode() => HashCode.Combine(TemperatureCelsius, Elements.Length);
}
