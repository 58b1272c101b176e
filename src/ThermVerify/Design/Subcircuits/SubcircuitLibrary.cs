using System.Text;

namespace ThermVerify.Design.Subcircuits;

/// <summary>One card of the re-emitted netlist: a function that writes it once the global names are known.</summary>
internal delegate string CardWriter(Func<string, string> globalName);

/// <summary>A .subckt of the user's file: its pins and its cards, each re-emitted from what was read.</summary>
internal sealed record SubcircuitDefinition(string Name, IReadOnlyList<string> Pins, IReadOnlyList<CardWriter> Cards, int Line, IReadOnlyList<string> Uses);

/// <summary>
/// What a subcircuit file (and the files it includes) defines, read strictly by <see cref="SubcircuitParser"/>: its
/// subcircuits, its top-level models and parameters. <see cref="Spice"/> writes it back element by element, never the
/// file's own text, so nothing but the accepted elements reaches an engine. Global names (subcircuits, top-level
/// models and parameters) get the prefix <see cref="Prefix"/>, so they cannot collide with thermverify's own names in
/// a deck.
/// </summary>
internal sealed record SubcircuitLibrary(IReadOnlyList<SubcircuitDefinition> Subcircuits, IReadOnlyList<CardWriter> TopLevel)
{
    public const string Prefix = "u_";

    public SubcircuitDefinition? Find(string name) =>
        Subcircuits.FirstOrDefault(s => s.Name.Equals(name, StringComparison.OrdinalIgnoreCase));

    /// <summary>The name a global definition has in the re-emitted netlist.</summary>
    public static string GlobalName(string name) => Prefix + name.ToLowerInvariant();

    /// <summary>The accepted cards, as a SPICE netlist fragment (top-level models and parameters first, then the subcircuits).</summary>
    public string Spice(string sourceName)
    {
        var b = new StringBuilder();
        b.Append("* subcircuit file ").Append(OneLine(sourceName)).AppendLine(", read by thermverify and written back element by element");
        foreach (var card in TopLevel)
            b.AppendLine(card(GlobalName));
        foreach (var s in Subcircuits)
        {
            foreach (var card in s.Cards)
                b.AppendLine(card(GlobalName));
        }
        return b.ToString();
    }

    private static string OneLine(string text) => new([.. text.Select(c => c is >= ' ' and <= '~' ? c : '?')]);
}
