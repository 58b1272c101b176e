namespace ThermVerify.Design;

/// <summary>A 1-based line and column in a design file.</summary>
internal readonly record struct SourcePosition(int Line, int Column)
{
    public static SourcePosition Start { get; } = new(1, 1);

    /// <summary>The position of a 0-based character offset in <paramref name="text"/>.</summary>
    public static SourcePosition At(string text, int offset)
    {
        offset = Math.Clamp(offset, 0, text.Length);
        var line = 1;
        var lineStart = 0;
        for (var i = 0; i < offset; i++)
        {
            if (text[i] == '\n')
            {
                line++;
                lineStart = i + 1;
            }
        }
        return new SourcePosition(line, offset - lineStart + 1);
    }
}
