namespace ThermVerify.Design;

/// <summary>
/// Bounds a TOML text must keep before the TOML library sees it, because the library's time grows faster than the
/// text on some shapes (a dotted key of 65,000 segments took it 112 s) and its recursion on deep nesting: a dotted key
/// has at most <see cref="MaximumKeySegments"/> segments and arrays and inline tables nest at most
/// <see cref="MaximumNesting"/> deep. A design file needs two segments and two levels. The scan knows just enough TOML
/// to tell keys from values: strings (basic, literal, multi-line), comments, headers, inline tables and arrays.
/// </summary>
internal static class TomlBounds
{
    public const int MaximumKeySegments = 16;
    public const int MaximumNesting = 32;

    public static void Check(string text, string sourceName)
    {
        var nesting = new Stack<char>();
        var keyContext = true;
        var segments = 1;
        var inHeader = false;
        for (var i = 0; i < text.Length; i++)
        {
            var c = text[i];
            switch (c)
            {
                case '#':
                    while (i + 1 < text.Length && text[i + 1] != '\n') i++;
                    break;
                case '"' or '\'':
                    i = SkipString(text, i);
                    break;
                case '\n':
                    if (nesting.Count == 0)
                    {
                        keyContext = true;
                        inHeader = false;
                        segments = 1;
                    }
                    break;
                case '.' when keyContext || inHeader:
                    if (++segments > MaximumKeySegments)
                        throw Error(text, i, sourceName, $"a dotted key with more than {MaximumKeySegments} parts",
                            "A design file's keys have one or two parts (check.region); shorten the key.");
                    break;
                case '[' when keyContext && nesting.Count == 0:
                    inHeader = true;
                    keyContext = false;
                    break;
                case ']' when inHeader:
                    break;
                case '=' when keyContext:
                    keyContext = false;
                    segments = 1;
                    break;
                case '{' or '[' when !keyContext && !inHeader:
                    nesting.Push(c);
                    if (nesting.Count > MaximumNesting)
                        throw Error(text, i, sourceName, $"arrays or inline tables nested more than {MaximumNesting} deep",
                            "A design file nests at most two levels; flatten the value.");
                    keyContext = c == '{';
                    segments = 1;
                    break;
                case '}' or ']' when nesting.Count > 0:
                    nesting.Pop();
                    keyContext = false;
                    break;
                case ',' when nesting.Count > 0:
                    keyContext = nesting.Peek() == '{';
                    segments = 1;
                    break;
            }
        }
    }

    /// <summary>The index of the string's closing quote (or the end of the text; the TOML parser reports an unclosed string).</summary>
    private static int SkipString(string text, int start)
    {
        var quote = text[start];
        var triple = start + 2 < text.Length && text[start + 1] == quote && text[start + 2] == quote;
        var i = start + (triple ? 3 : 1);
        while (i < text.Length)
        {
            var c = text[i];
            if (quote == '"' && c == '\\')
            {
                i += 2;
                continue;
            }
            if (!triple && c == '\n') return i - 1;
            if (c == quote && (!triple || (i + 2 < text.Length && text[i + 1] == quote && text[i + 2] == quote)))
                return triple ? i + 2 : i;
            i++;
        }
        return text.Length - 1;
    }

    private static DesignException Error(string text, int offset, string sourceName, string problem, string hint)
    {
        var at = SourcePosition.At(text, offset);
        return new DesignException(sourceName, at.Line, at.Column, "", problem, hint);
    }
}
