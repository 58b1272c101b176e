namespace ThermVerify.Design.Subcircuits;

/// <summary>
/// Splits a SPICE file into cards: '*' lines are comments, ';' and " $" start a comment to the end of the line, a
/// line starting with '+' continues the card before it. Outside comments only printable ASCII is accepted, and a
/// double quote only around a path (.include). Tokens are words, '=', parentheses, commas, and expressions in braces
/// or single quotes.
/// </summary>
internal static class SpiceCardReader
{
    public const int MaximumCards = 100_000;
    public const int MaximumTokensPerCard = 2_000;

    public static List<SpiceCard> Read(string text, SubcircuitErrors errors)
    {
        var cards = new List<SpiceCard>();
        List<SpiceToken>? current = null;
        var lines = text.Split('\n');
        for (var l = 0; l < lines.Length; l++)
        {
            var line = StripComment(lines[l].TrimEnd('\r'));
            var start = 0;
            while (start < line.Length && line[start] is ' ' or '\t') start++;
            if (start == line.Length || line[start] == '*') continue;
            for (var c = start; c < line.Length; c++)
                if (line[c] is not ('\t' or (>= ' ' and <= '~')))
                    throw errors.At(l + 1, c + 1, $"the character U+{(int)line[c]:X4} is not accepted outside comments",
                        "Write the subcircuit in plain ASCII; names, numbers and expressions need no other characters.");
            if (line[start] == '+')
            {
                if (current is null)
                    throw errors.At(l + 1, start + 1, "a continuation line ('+') with no line before it", "Join it to the line it continues.");
                Tokenize(line, start + 1, l + 1, current, errors);
            }
            else
            {
                if (cards.Count >= MaximumCards)
                    throw errors.At(l + 1, 1, $"more than {MaximumCards} lines of netlist", "An op-amp subcircuit needs far fewer; check the file.");
                current = [];
                cards.Add(new SpiceCard(current));
                Tokenize(line, start, l + 1, current, errors);
            }
            if (current.Count > MaximumTokensPerCard)
                throw errors.At(l + 1, 1, $"a line of more than {MaximumTokensPerCard} items", "Split the element or model over fewer items.");
        }
        return cards;
    }

    /// <summary>The line up to a ';' or a '$' after a blank (ngspice's end-of-line comments), outside braces and quotes.</summary>
    private static string StripComment(string line)
    {
        var inBraces = 0;
        char? quote = null;
        for (var i = 0; i < line.Length; i++)
        {
            var c = line[i];
            if (quote is { } q) { if (c == q) quote = null; continue; }
            switch (c)
            {
                case '\'' or '"': quote = c; break;
                case '{': inBraces++; break;
                case '}': inBraces = Math.Max(0, inBraces - 1); break;
                case ';' when inBraces == 0: return line[..i];
                case '$' when inBraces == 0 && (i == 0 || line[i - 1] is ' ' or '\t'): return line[..i];
            }
        }
        return line;
    }

    private static void Tokenize(string line, int from, int lineNumber, List<SpiceToken> into, SubcircuitErrors errors)
    {
        var i = from;
        while (i < line.Length)
        {
            var c = line[i];
            var column = i + 1;
            switch (c)
            {
                case ' ' or '\t':
                    i++;
                    continue;
                case '=':
                    into.Add(new SpiceToken(SpiceTokenKind.Equals, "=", lineNumber, column));
                    i++;
                    continue;
                case '(':
                    into.Add(new SpiceToken(SpiceTokenKind.Open, "(", lineNumber, column));
                    i++;
                    continue;
                case ')':
                    into.Add(new SpiceToken(SpiceTokenKind.Close, ")", lineNumber, column));
                    i++;
                    continue;
                case ',':
                    into.Add(new SpiceToken(SpiceTokenKind.Comma, ",", lineNumber, column));
                    i++;
                    continue;
                case '{' or '\'' or '"':
                {
                    var close = c switch { '{' => '}', _ => c };
                    var end = line.IndexOf(close, i + 1);
                    if (end < 0)
                        throw errors.At(lineNumber, column, $"'{c}' is not closed on this line", $"Close it with '{close}'.");
                    var inner = line[(i + 1)..end];
                    if (c == '{' && inner.Contains('{'))
                        throw errors.At(lineNumber, column, "braces inside braces", "Write one expression in one pair of braces.");
                    into.Add(new SpiceToken(c == '"' ? SpiceTokenKind.Quoted : SpiceTokenKind.Expression, inner, lineNumber, column));
                    i = end + 1;
                    continue;
                }
                case '}':
                    throw errors.At(lineNumber, column, "'}' with no '{' before it", "Remove it, or open the expression with '{'.");
                default:
                {
                    var end = i;
                    while (end < line.Length && line[end] is not (' ' or '\t' or '=' or '(' or ')' or ',' or '{' or '}' or '\'' or '"'))
                        end++;
                    into.Add(new SpiceToken(SpiceTokenKind.Word, line[i..end], lineNumber, column));
                    i = end;
                    continue;
                }
            }
        }
    }
}
