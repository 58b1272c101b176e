namespace ThermVerify.Design.Netlists;

/// <summary>
/// Makes the errors of one netlist file: file:line:column, the design key that named it, what (with the card quoted
/// where there is one) and how to fix it.
/// </summary>
internal sealed class NetlistErrors(string fileName, string keyPath)
{
    private const int QuotedCharacters = 100;

    public string FileName { get; } = fileName;
    public string KeyPath { get; } = keyPath;

    public DesignException At(int line, int column, string problem, string hint) =>
        new(FileName, line, column, KeyPath, problem, hint);

    public DesignException At(Subcircuits.SpiceToken token, string problem, string hint) => At(token.Line, token.Column, problem, hint);

    /// <summary>An error about a card, quoting it ("in the card 'R1 a b {x}'").</summary>
    public DesignException At(Subcircuits.SpiceToken token, string problem, string hint, string card) =>
        At(token.Line, token.Column, $"{problem} (in the card '{Quote(card)}')", hint);

    /// <summary>A card's text, shortened and made printable for a message.</summary>
    public static string Quote(string card)
    {
        var text = new string([.. card.Select(c => c is >= ' ' and <= '~' ? c : '?')]);
        return text.Length <= QuotedCharacters ? text : text[..(QuotedCharacters - 3)] + "...";
    }
}
