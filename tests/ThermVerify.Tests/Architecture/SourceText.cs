using System.Text;

namespace ThermVerify.Tests.Architecture;

/// <summary>C# source with comments and the text of string and character literals blanked out, line breaks kept.</summary>
internal static class SourceText
{
    public static string CodeOnly(string source)
    {
        var code = new StringBuilder(source.Length);
        var i = 0;
        while (i < source.Length)
        {
            var c = source[i];
            var next = i + 1 < source.Length ? source[i + 1] : '\0';
            if (c == '/' && next == '/')
                i = Blank(source, code, i, source.IndexOf('\n', i) is var end and >= 0 ? end : source.Length);
            else if (c == '/' && next == '*')
                i = Blank(source, code, i, source.IndexOf("*/", i + 2, StringComparison.Ordinal) is var end and >= 0 ? end + 2 : source.Length);
            else if (c == '"' && source.AsSpan(i).StartsWith("\"\"\""))
                i = Blank(source, code, i, source.IndexOf("\"\"\"", i + 3, StringComparison.Ordinal) is var end and >= 0 ? end + 3 : source.Length);
            else if (c == '"' || c == '\'')
                i = Blank(source, code, i, EndOfQuoted(source, i, verbatim: i > 0 && (source[i - 1] == '@' || (i > 1 && source[i - 2] == '@'))));
            else
            {
                code.Append(c);
                i++;
            }
        }
        return code.ToString();
    }

    private static int EndOfQuoted(string source, int start, bool verbatim)
    {
        var quote = source[start];
        for (var i = start + 1; i < source.Length; i++)
        {
            if (!verbatim && source[i] == '\\') { i++; continue; }
            if (source[i] == quote)
            {
                if (verbatim && i + 1 < source.Length && source[i + 1] == quote) { i++; continue; }
                return i + 1;
            }
            if (!verbatim && source[i] == '\n') return i; // an unterminated literal ends with its line
        }
        return source.Length;
    }

    private static int Blank(string source, StringBuilder code, int from, int to)
    {
        for (var i = from; i < to; i++)
            code.Append(source[i] == '\n' ? '\n' : ' ');
        return to;
    }
}
