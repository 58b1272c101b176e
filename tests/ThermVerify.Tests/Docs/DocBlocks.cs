using System.Text.RegularExpressions;

namespace ThermVerify.Tests.Docs;

/// <summary>
/// Blocks of a Markdown document that a test produces: a line <c>&lt;!-- generated: NAME --&gt;</c> followed by a fenced
/// block. <see cref="AssertCurrent"/> fails when a block differs from what the tool produces now, naming the document
/// and the block; with THERMVERIFY_REWRITE_DOCS=1 it rewrites the block instead (and still fails, so that a rewrite
/// is never silent).
/// </summary>
internal static partial class DocBlocks
{
    public static void AssertCurrent(string documentPath, string name, string content)
    {
        var text = File.ReadAllText(documentPath);
        var match = Block(name).Match(text);
        Assert.True(match.Success, $"{documentPath} has no block '<!-- generated: {name} -->' followed by a fenced block");
        var expected = Normalise(content);
        var actual = match.Groups["body"].Value;
        if (actual == expected) return;
        if (Environment.GetEnvironmentVariable("THERMVERIFY_REWRITE_DOCS") == "1")
        {
            File.WriteAllText(documentPath, text[..match.Groups["body"].Index] + expected + text[(match.Groups["body"].Index + match.Groups["body"].Length)..]);
            Assert.Fail($"{documentPath}: block '{name}' rewritten; run the tests again");
        }
        Assert.Equal(expected, actual);
    }

    /// <summary>
    /// The same for a Markdown table the tool produces: a line <c>&lt;!-- generated: NAME --&gt;</c> followed by the
    /// table's lines (each starting with "|") up to the first line that does not.
    /// </summary>
    public static void AssertCurrentTable(string documentPath, string name, string table)
    {
        var text = File.ReadAllText(documentPath).Replace("\r\n", "\n");
        var marker = $"<!-- generated: {name} -->\n";
        var start = text.IndexOf(marker, StringComparison.Ordinal);
        Assert.True(start >= 0, $"{documentPath} has no line '<!-- generated: {name} -->' before a table");
        start += marker.Length;
        var end = start;
        while (end < text.Length && text[end] == '|')
            end = text.IndexOf('\n', end) is var n and >= 0 ? n + 1 : text.Length;
        var expected = Normalise(table);
        var actual = text[start..end];
        if (actual == expected) return;
        if (Environment.GetEnvironmentVariable("THERMVERIFY_REWRITE_DOCS") == "1")
        {
            File.WriteAllText(documentPath, text[..start] + expected + text[end..]);
            Assert.Fail($"{documentPath}: table '{name}' rewritten; run the tests again");
        }
        Assert.Equal(expected, actual);
    }

    private static string Normalise(string content) => content.Replace("\r\n", "\n").TrimEnd('\n') + "\n";

    private static Regex Block(string name) =>
        new($@"<!-- generated: {Regex.Escape(name)} -->\n```[^\n]*\n(?<body>.*?)```", RegexOptions.Singleline);
}
