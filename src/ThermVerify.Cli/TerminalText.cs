using System.Text;

namespace ThermVerify.Cli;

/// <summary>
/// Standard output and error as the user's terminal receives them: every control character except newline and tab,
/// and every bidirectional override, is shown as a visible escape (\e, \u202E), so no text from a design (a name,
/// a quoted value, a path) can move the cursor, recolour the terminal, set its title or reorder what is shown.
/// The progress bar's own carriage return goes through <see cref="Raw"/>.
/// </summary>
internal sealed class TerminalText(TextWriter raw) : TextWriter
{
    public TextWriter Raw { get; } = raw;

    public override Encoding Encoding => Raw.Encoding;

    public override void Write(char value)
    {
        if (Escape(value) is { } escaped) Raw.Write(escaped);
        else Raw.Write(value);
    }

    public override void Write(string? value)
    {
        if (value is null) return;
        if (!value.Any(c => Escape(c) is not null))
        {
            Raw.Write(value);
            return;
        }
        var b = new StringBuilder(value.Length + 8);
        for (var i = 0; i < value.Length; i++)
        {
            var c = value[i];
            // A line end of CR LF (Windows) is a line end, not a cursor movement.
            if (c == '\r' && i + 1 < value.Length && value[i + 1] == '\n') b.Append(c);
            else b.Append(Escape(c) ?? c.ToString());
        }
        Raw.Write(b.ToString());
    }

    public override void WriteLine() => Raw.WriteLine();

    public override void Write(char[] buffer, int index, int count) => Write(new string(buffer, index, count));

    public override void WriteLine(string? value)
    {
        Write(value);
        Raw.WriteLine();
    }

    public override void Flush() => Raw.Flush();

    /// <summary>The visible form of a character that must not reach a terminal raw; null for any other.</summary>
    internal static string? Escape(char c) => c switch
    {
        '\n' or '\t' => null,
        '\u001b' => "\\e",
        '\r' => "\\r",
        _ when char.IsControl(c) || c is >= '\u202A' and <= '\u202E' or >= '\u2066' and <= '\u2069' => $"\\u{(int)c:X4}",
        _ => null,
    };
}
