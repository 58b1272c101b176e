namespace ThermVerify.Circuits;

/// <summary>A circuit is malformed: a bad element value, a duplicate name, a missing node.</summary>
public class CircuitException : Exception
{
    public CircuitException(string message) : base(message) { }

    public CircuitException(string message, Exception inner) : base(message, inner) { }
}

/// <summary>
/// The connections make the circuit unsolvable (floating node, no DC path to ground, a loop of
/// voltage-defined branches). Names the nodes and elements concerned.
/// </summary>
public sealed class TopologyException : CircuitException
{
    public TopologyException(string message, IReadOnlyList<string> nodes, IReadOnlyList<string> elements)
        : base(message)
    {
        Nodes = nodes;
        Elements = elements;
    }

    public IReadOnlyList<string> Nodes { get; }

    public IReadOnlyList<string> Elements { get; }
}
