using ThermVerify.Circuits;
namespace ThermVerify.Simulation.Mna;

/// <summary>What an element sees while it binds its stamp: node indices, its extra unknowns, slots, state.</summary>
internal sealed class BindContext(MnaLayout layout)
{
    private readonly List<bool> stateIsCurrent = [];
    private readonly List<string> stateOwners = [];

    public MnaLayout Layout => layout;

    internal int ExtraStart { get; set; }

    /// <summary>Name of the element binding now, recorded as the owner of the states it reserves.</summary>
    internal string ElementName { get; set; } = "";

    public int Node(string name) => layout.IndexOfNode(name);

    /// <summary>Index of this element's k-th extra unknown.</summary>
    public int Extra(int k) => ExtraStart + k;

    public int Slot(int row, int column) => layout.Slot(row, column);

    /// <summary>The index of the branch current of the voltage source <paramref name="source"/> (what SPICE's F and H sense).</summary>
    public int BranchCurrent(string source)
    {
        var i = Array.IndexOf(layout.UnknownNames, $"I({source})");
        return i >= 0 ? i : throw new CircuitException($"No branch current of '{source}' to sense; name a voltage source of the circuit.");
    }

    /// <summary>
    /// Reserves an integrated state: [value, derivative]. Returns the index of the value; the derivative
    /// follows it. <paramref name="isCurrent"/> picks the absolute tolerance used for its truncation error.
    /// </summary>
    public int State(bool isCurrent)
    {
        var index = stateIsCurrent.Count * 2;
        stateIsCurrent.Add(isCurrent);
        stateOwners.Add(ElementName);
        return index;
    }

    public int StateCount => stateIsCurrent.Count;

    public bool[] StateIsCurrent => [.. stateIsCurrent];

    /// <summary>The element of every state, for messages.</summary>
    public string[] StateOwners => [.. stateOwners];
}
