using ThermVerify.Design.Subcircuits;

namespace ThermVerify.Design.Netlists;

/// <summary>
/// Evaluates the arithmetic a netlist may compute with, as SPICE's .param does: numbers (with SPICE's scale factors),
/// parameter names, + − * /, unary signs and parentheses; nothing else (no functions, powers, comparisons or strings),
/// so an expression can only ever be a number. Errors give the column inside the text where it went wrong.
/// </summary>
internal sealed class NetlistArithmetic
{
    private const int MaximumLength = 512;
    private const int MaximumDepth = 16;

    private readonly string text;
    private readonly Func<string, int, double> lookup;
    private readonly Func<int, string, string, DesignException> error;
    private int position;
    private int depth;

    private NetlistArithmetic(string text, Func<string, int, double> lookup, Func<int, string, string, DesignException> error)
    {
        this.text = text;
        this.lookup = lookup;
        this.error = error;
    }

    /// <param name="lookup">A parameter's value by name (and offset, for its own error when it is not defined).</param>
    /// <param name="error">Makes the error at an offset inside <paramref name="text"/>: (offset, problem, hint).</param>
    public static double Evaluate(string text, Func<string, int, double> lookup, Func<int, string, string, DesignException> error)
    {
        if (text.Length > MaximumLength)
            throw error(0, $"an expression of more than {MaximumLength} characters", "Split it over parameters (.param).");
        var e = new NetlistArithmetic(text, lookup, error);
        var value = e.Sum();
        e.SkipBlanks();
        if (e.position < text.Length)
            throw error(e.position, $"'{text[e.position]}' is not part of an arithmetic expression", "Use numbers, parameter names, + - * / and parentheses.");
        if (!double.IsFinite(value))
            throw error(0, $"the expression {{{text}}} is not a finite number (a division by zero, or too large)", "Check its parameters.");
        return value;
    }

    private double Sum()
    {
        var value = Product();
        while (Peek() is '+' or '-')
            value = text[position++] == '+' ? value + Product() : value - Product();
        return value;
    }

    private double Product()
    {
        var value = Unary();
        while (Peek() is '*' or '/')
        {
            if (position + 1 < text.Length && text[position] == '*' && text[position + 1] == '*')
                throw error(position, "powers (**) are not accepted", "Write the product out, or compute the value in a parameter.");
            value = text[position++] == '*' ? value * Unary() : value / Unary();
        }
        return value;
    }

    private double Unary()
    {
        if (Peek() is '+' or '-')
            return text[position++] == '-' ? -Unary() : Unary();
        return Primary();
    }

    private double Primary()
    {
        var c = Peek();
        if (c == '(')
        {
            if (++depth > MaximumDepth)
                throw error(position, $"parentheses nested more than {MaximumDepth} deep", "Compute parts of it in parameters.");
            position++;
            var inner = Sum();
            if (Peek() != ')')
                throw error(position, "a '(' is not closed", "Add the ')'.");
            position++;
            depth--;
            return inner;
        }
        if (c is { } ch && (char.IsAsciiDigit(ch) || ch == '.'))
        {
            var start = position;
            while (position < text.Length && (char.IsAsciiLetterOrDigit(text[position]) || text[position] == '.'
                                              || (text[position] is '+' or '-' && text[position - 1] is 'e' or 'E' && IsMantissa(start, position - 1))))
                position++;
            var word = text[start..position];
            if (!SpiceNumberText.TryParse(word, out var value))
                throw error(start, $"\"{word}\" is not a number", "Write a number with an optional scale factor, e.g. 4.7k or 100n.");
            return value;
        }
        if (c is { } letter && (char.IsAsciiLetter(letter) || letter == '_'))
        {
            var start = position;
            while (position < text.Length && (char.IsAsciiLetterOrDigit(text[position]) || text[position] == '_'))
                position++;
            var name = text[start..position];
            if (Peek() == '(')
                throw error(position, $"a function call ({name}(...)) is not accepted", "Only + - * / and parentheses; compute the value in a parameter.");
            return lookup(name, start);
        }
        throw error(position, c is null ? "the expression ends where a number or a name is needed" : $"'{c}' where a number or a name is needed",
            "Write a number or a parameter's name there.");
    }

    /// <summary>Whether text[start..end) is all digits and dots, so that an 'e' there starts an exponent (not "meg").</summary>
    private bool IsMantissa(int start, int end)
    {
        for (var i = start; i < end; i++)
            if (!(char.IsAsciiDigit(text[i]) || text[i] == '.')) return false;
        return end > start;
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
