using ThermVerify.Sensors;

namespace ThermVerify.Circuits;

/// <summary>
/// Whether two circuits are the same netlist: the same elements in the same order, each with the same values, at the
/// same temperature. Element records compare by value; a sensor model (a class, built afresh for every circuit) compares
/// by its type and the parameters that define its curve. Where a member compares by reference (an immutable array of a
/// schedule or a waveform, a sensor type not listed here) two equal circuits may be called different, never the reverse:
/// a cache keyed on this can only miss, not return another circuit's result.
/// </summary>
internal sealed class CircuitContent : IEqualityComparer<Circuit>
{
    public static readonly CircuitContent Comparer = new();

    public bool Equals(Circuit? x, Circuit? y)
    {
        if (ReferenceEquals(x, y)) return true;
        if (x is null || y is null) return false;
        if (x.TemperatureCelsius != y.TemperatureCelsius || x.Elements.Length != y.Elements.Length) return false;
        for (var i = 0; i < x.Elements.Length; i++)
            if (!SameElement(x.Elements[i], y.Elements[i]))
                return false;
        return true;
    }

    public int GetHashCode(Circuit circuit)
    {
        var hash = new HashCode();
        hash.Add(circuit.TemperatureCelsius);
        foreach (var e in circuit.Elements)
            hash.Add(e is SensorResistor s ? HashCode.Combine(s.Name, s.NodeA, s.NodeB, SensorParameters(s.Sensor)) : e.GetHashCode());
        return hash.ToHashCode();
    }

    private static bool SameElement(Element a, Element b) => a is SensorResistor sa && b is SensorResistor sb
        ? sa.Name == sb.Name && sa.NodeA == sb.NodeA && sa.NodeB == sb.NodeB && SameSensor(sa.Sensor, sb.Sensor)
        : a.Equals(b);

    private static bool SameSensor(ISensorModel a, ISensorModel b) =>
        ReferenceEquals(a, b) || (a.GetType() == b.GetType() && SensorParameters(a) is { } p && p.Equals(SensorParameters(b)));

    /// <summary>The parameters that fix a sensor's curve, as a value; null for a model not listed (compared by reference).</summary>
    private static object? SensorParameters(ISensorModel sensor) => sensor switch
    {
        BetaThermistor m => (m.R0Ohms, m.Beta, m.T0Celsius, m.ValidRange),
        PlatinumRtd m => (m.R0Ohms, m.CoefficientA, m.CoefficientB, m.CoefficientC, m.ValidRange),
        SteinhartHartThermistor m => (m.A, m.B, m.C, m.D, m.ValidRange),
        _ => null,
    };
}
