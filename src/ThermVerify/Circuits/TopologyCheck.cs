namespace ThermVerify.Circuits;

/// <summary>
/// Connection checks made before any matrix is built, so that an unsolvable circuit is reported by node
/// and element name instead of as a singular matrix: no ground, floating nodes, loops of
/// voltage-defined branches (sources, inductors), and nodes without a DC path to ground.
/// </summary>
internal static class TopologyCheck
{
    /// <param name="checkDcPaths">False when no DC solution is needed (a transient continued from a state).</param>
    /// <param name="holdInitialConditions">Capacitors with an initial voltage count as DC paths
    /// (the start of a transient with initial conditions).</param>
    public static void Run(Circuit circuit, bool holdInitialConditions = false, bool checkDcPaths = true)
    {
        var elements = circuit.Elements;
        if (!elements.Any(e => e.Nodes.Contains(Circuit.Ground)))
            throw new TopologyException("The circuit has no connection to ground node \"0\"; connect the reference node of the circuit to \"0\".",
                [], [.. elements.Select(e => e.Name)]);

        CheckFloating(circuit);
        CheckVoltageLoops(circuit);
        if (checkDcPaths)
            CheckDcPaths(circuit, holdInitialConditions);
    }

    private static void CheckFloating(Circuit circuit)
    {
        var count = new Dictionary<string, List<string>>();
        foreach (var e in circuit.Elements)
            foreach (var node in e.Nodes)
                if (node != Circuit.Ground)
                {
                    if (!count.TryGetValue(node, out var list))
                        count[node] = list = [];
                    list.Add(e.Name);
                }
        var floating = count.Where(kv => kv.Value.Count == 1).ToList();
        if (floating.Count > 0)
            throw new TopologyException(
                $"Floating node(s): {string.Join(", ", floating.Select(kv => $"'{kv.Key}' (only {kv.Value[0]})"))}. " +
                "A node needs at least two connections; connect it or remove the element.",
                [.. floating.Select(kv => kv.Key)], [.. floating.Select(kv => kv.Value[0])]);
    }

    private static void CheckVoltageLoops(Circuit circuit)
    {
        var sets = new UnionFind();
        var edges = new List<(string A, string B, string Element)>();
        foreach (var e in circuit.Elements)
            foreach (var (a, b) in e.VoltageDefinedPaths)
            {
                if (sets.Find(a) == sets.Find(b))
                {
                    var path = PathBetween(edges, a, b);
                    var names = path.Select(p => p.Element).Append(e.Name).ToList();
                    var nodes = path.SelectMany(p => new[] { p.A, p.B }).Append(a).Append(b).Distinct().ToList();
                    throw new TopologyException(
                        $"Loop of voltage sources/inductors: {string.Join(", ", names)} through nodes {string.Join(", ", nodes)}. " +
                        "Their voltages are not independent; add a series resistance or remove one of them.",
                        nodes, names);
                }
                sets.Union(a, b);
                edges.Add((a, b, e.Name));
            }
    }

    private static void CheckDcPaths(Circuit circuit, bool holdInitialConditions)
    {
        var sets = new UnionFind();
        foreach (var e in circuit.Elements)
            foreach (var (a, b) in holdInitialConditions ? e.DcPathsHoldingInitialConditions.Concat(e.DcPaths) : e.DcPaths)
                sets.Union(a, b);
        var ground = sets.Find(Circuit.Ground);
        var cut = circuit.NodeNames.Where(n => sets.Find(n) != ground).ToList();
        if (cut.Count == 0)
            return;
        var touching = circuit.Elements.Where(e => e.Nodes.Any(cut.Contains)).Select(e => e.Name).ToList();
        throw new TopologyException(
            $"No DC path to ground from node(s) {string.Join(", ", cut)} (reached only through capacitors or current sources: {string.Join(", ", touching)}). " +
            "Add a resistive path to ground, or give the capacitors initial voltages and use initial conditions.",
            cut, touching);
    }

    private static List<(string A, string B, string Element)> PathBetween(List<(string A, string B, string Element)> edges, string from, string to)
    {
        var previous = new Dictionary<string, (string Node, (string A, string B, string Element) Edge)>();
        var queue = new Queue<string>([from]);
        var seen = new HashSet<string> { from };
        while (queue.Count > 0)
        {
            var node = queue.Dequeue();
            if (node == to)
                break;
            foreach (var edge in edges)
            {
                var other = edge.A == node ? edge.B : edge.B == node ? edge.A : null;
                if (other is not null && seen.Add(other))
                {
                    previous[other] = (node, edge);
                    queue.Enqueue(other);
                }
            }
        }
        var path = new List<(string, string, string)>();
        for (var n = to; n != from && previous.TryGetValue(n, out var p); n = p.Node)
            path.Add(p.Edge);
        return path;
    }

    private sealed class UnionFind
    {
        private readonly Dictionary<string, string> parent = [];

        public string Find(string x)
        {
            if (!parent.TryGetValue(x, out var p))
                return parent[x] = x;
            return p == x ? x : parent[x] = Find(p);
        }

        public void Union(string a, string b) => parent[Find(a)] = Find(b);
    }
}
