using System.Text;

namespace ThermVerify.Design.Subcircuits;

/// <summary>
/// The arithmetic a subcircuit file may compute with: numbers, parameter names, + − * /, unary signs and
/// parentheses, nothing else (no functions, no strings). Read strictly and written back token by token with the
/// numbers in plain form and the parameter names through <c>rename</c>, in braces.
/// </summary>
internal sealed class SpiceExpression
{
    private const int MaximumLength = 512;
    private const int MaximumDepth = 16;

    private readonly List<string> tokens = [];
    private readonly string text;
    private int position;
    private int depth;

    private SpiceExpression(string text) => this.text = text;

    /// <summary>The parameter names the expression uses, in order.</summary>
    public List<string> Names { get; } = [];

    private IEnumerable<string> Tokens => tokens;

    /// <summary>Reads <paramref name="text"/>; the error names the column inside the expression where it went wrong.</summary>
    public static SpiceExpression Parse(string text, Func<int, string, DesignException> error)
    {
        if (text.Length > MaximumLength)
            throw error(0, $"an expression of more than {MaximumLength} characters");
        var e = new SpiceExpression(text);
        e.Sum(error);
        e.SkipBlanks();
        if (e.position < text.Length)
            throw error(e.position, $"'{text[e.position]}' is not part of an arithmetic expression (numbers, parameter names, + - * / and parentheses)");
        if (e.tokens.Count == 0)
            throw error(0, "an empty expression");
        return e;
    }

    /// <summary>The expression in braces, with each parameter name replaced by <paramref name="rename"/>.</summary>
    public string Write(Func<string, string> rename)
    {
        var b = new StringBuilder("{");
        foreach (var t in Tokens)
            b.Append(t.Length > 0 && (char.IsAsciiLetter(t[0]) || t[0] == '_') ? rename(t) : t);
        return b.Append('}').ToString();
    }

    private void Sum(Func<int, string, DesignException> error)
    {
        Product(error);
        while (Peek() is '+' or '-')
        {
            tokens.Add(text[position++].ToString());
            Product(error);
        }
    }

    private void Product(Func<int, string, DesignException> error)
    {
        Unary(error);
        while (Peek() is '*' or '/')
        {
            if (position + 1 < text.Length && text[position] == '*' && text[position + 1] == '*')
                throw error(position, "powers (**) are not accepted; write the product out");
            tokens.Add(text[position++].ToString());
            Unary(error);
        }
    }

    private void Unary(Func<int, string, DesignException> error)
    {
        if (Peek() is '+' or '-')
        {
            tokens.Add(text[position++].ToString());
            Unary(error);
            return;
        }
        Primary(error);
    }

    private void Primary(Func<int, string, DesignException> error)
    {
        var c = Peek();
        if (c == '(')
        {
            if (++depth > MaximumDepth)
                throw error(position, $"parentheses nested more than {MaximumDepth} deep");
            tokens.Add("(");
            position++;
            Sum(error);
            if (Peek() != ')')
                throw error(position, "a '(' is not closed");
            tokens.Add(")");
            position++;
            depth--;
            return;
        }
        if (c is { } ch && (char.IsAsciiDigit(ch) || ch == '.'))
        {
            var start = position;
            while (position < text.Length && (char.IsAsciiLetterOrDigit(text[position]) || text[position] == '.'
                                              || (text[position] is '+' or '-' && text[position - 1] is 'e' or 'E' && char.IsAsciiDigit(text[start]))))
                position++;
            var word = text[start..position];
            if (!SpiceNumberText.TryParse(word, out var value))
                throw error(start, $"\"{word}\" is not a number");
            tokens.Add(SpiceNumberText.Format(value));
            return;
        }
        if (c is { } letter && (char.IsAsciiLetter(letter) || letter == '_'))
        {
            var start = position;
            while (position < text.Length && (char.IsAsciiLetterOrDigit(text[position]) || text[position] == '_'))
                position++;
            var name = text[start..position];
            if (Peek() == '(')
                throw error(position, $"a function call ({name}(...)) is not accepted; only + - * / and parentheses");
            tokens.Add(name);
            Names.Add(name);
            return;
        }
        throw error(position, c is null ? "the expression ends where a number or a name is needed" : $"'{c}' where a number or a name is needed");
    }

    private char? Peek()
    {
        SkipBlanks();
        return position < text.Length ? text[position] : null;
    }

    private void SkipBlanks()
    {
        while (position < text.Length && text[position] is ' ' or '\t') position++;
    }
}
