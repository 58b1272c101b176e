using ThermVerify.Circuits;

namespace ThermVerify.Simulation.Mna;

/// <summary>
/// Numbering of the unknowns: circuit nodes first, then each element's extra unknowns. Ground gets the
/// index <see cref="Size"/>, one past the last unknown, so vectors carry a ground cell that stays 0 and
/// matrix slots touching ground fall into one trash cell: stamps never test for ground.
/// </summary>
internal sealed class MnaLayout
{
    public MnaLayout(Circuit circuit)
    {
        var names = new List<string>();
        var isCurrent = new List<bool>();
        foreach (var element in circuit.Elements)
            foreach (var node in element.Nodes)
                if (node != Circuit.Ground && !NodeIndex.ContainsKey(node))
                {
                    NodeIndex[node] = names.Count;
                    names.Add(node);
                    isCurrent.Add(false);
                }
        NodeCount = names.Count;
        ExtraStart = new int[circuit.Elements.Length];
        for (var e = 0; e < circuit.Elements.Length; e++)
        {
            ExtraStart[e] = names.Count;
            foreach (var u in circuit.Elements[e].ExtraUnknowns)
            {
                names.Add(u.Label);
                isCurrent.Add(u.IsCurrent);
            }
        }
        UnknownNames = [.. names];
        IsCurrent = [.. isCurrent];
        Size = names.Count;
        Touching = BuildTouching(circuit);
    }

    public Dictionary<string, int> NodeIndex { get; } = new(StringComparer.Ordinal);

    public int NodeCount { get; }

    public int Size { get; }

    public int Ground => Size;

    public int Trash => Size * Size;

    public int MatrixLength => Size * Size + 1;

    public int VectorLength => Size + 1;

    public string[] UnknownNames { get; }

    public bool[] IsCurrent { get; }

    public int[] ExtraStart { get; }

    /// <summary>Names of the elements touching each unknown, for error messages.</summary>
    public List<string>[] Touching { get; }

    public int IndexOfNode(string node)
    {
        if (node == Circuit.Ground)
            return Ground;
        return NodeIndex.TryGetValue(node, out var i)
            ? i
            : throw new CircuitException($"The circuit has no node named '{node}'. Nodes: {string.Join(", ", NodeIndex.Keys)}.");
    }

    public int Slot(int row, int column) => row == Ground || column == Ground ? Trash : row * Size + column;

    private List<string>[] BuildTouching(Circuit circuit)
    {
        var touching = new List<string>[Size];
        for (var i = 0; i < Size; i++)
            touching[i] = [];
        for (var e = 0; e < circuit.Elements.Length; e++)
        {
            var element = circuit.Elements[e];
            foreach (var node in element.Nodes.Distinct())
                if (node != Circuit.Ground)
                    touching[NodeIndex[node]].Add(element.Name);
            for (var k = 0; k < element.ExtraUnknowns.Count; k++)
                touching[ExtraStart[e] + k].Add(element.Name);
        }
        return touching;
    }
}
