namespace ThermVerify.Design.Netlists;

/// <summary>Where an element of a netlist was written: the file, the card's position and its text, for every message about it.</summary>
internal sealed record NetlistPlace(string FileName, int Line, int Column, string Card)
{
    public override string ToString() => $"{FileName}:{Line}:{Column}";
}

/// <summary>A SPICE PULSE source (v1 v2 td tr tf pw per), its values read as SPICE reads them.</summary>
internal sealed record NetlistPulse(double Initial, double Pulsed, double DelaySeconds, double RiseSeconds, double FallSeconds,
    double WidthSeconds, double PeriodSeconds);

/// <summary>
/// One element of a netlist after its parameters are evaluated and its subcircuits expanded: its SPICE letter (R, C,
/// L, V, I, D, E, F, G, H), its name (an element inside an instance is named instance.element, as SPICE names it), its nodes
/// (lower case, ground "0"), its value (ohms, farads, henries, the DC value of a source, the gain or transconductance
/// of E and G, the gain of F, the transresistance of H; unused for D), and what else its card gave.
/// </summary>
internal sealed record NetlistElement(char Kind, string Name, IReadOnlyList<string> Nodes, double Value, NetlistPlace At)
{
    /// <summary>R: tc1 and tc2 (per kelvin, per kelvin squared). D: the model's is, n, rs, eg and xti.</summary>
    public IReadOnlyDictionary<string, double> Parameters { get; init; } = new Dictionary<string, double>();

    /// <summary>F and H: the voltage source whose current they sense (its flat name, an instance's prefix included).</summary>
    public string? Control { get; init; }

    /// <summary>V and I: the pulse the source gives over time; null for a DC source.</summary>
    public NetlistPulse? Pulse { get; init; }

    public double Parameter(string name, double fallback) => Parameters.TryGetValue(name, out var v) ? v : fallback;
}

/// <summary>A netlist read strictly by <see cref="NetlistParser"/>: its title and its elements, flat, in the order written.</summary>
internal sealed record ParsedNetlist(string Title, IReadOnlyList<NetlistElement> Elements)
{
    /// <summary>Every node the elements use, ground included, in order of first use.</summary>
    public IReadOnlyList<string> Nodes => [.. Elements.SelectMany(e => e.Nodes).Distinct()];

    public NetlistElement? Find(string name) =>
        Elements.FirstOrDefault(e => e.Name.Equals(name, StringComparison.OrdinalIgnoreCase));
}
