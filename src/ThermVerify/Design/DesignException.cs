namespace ThermVerify.Design;

/// <summary>
/// A design file that cannot be used. The message reads
/// <c>file:line:column: key.path: problem. hint</c>; line and column are 1-based.
/// </summary>
public sealed class DesignException : Exception
{
    public DesignException(string sourceName, int line, int column, string keyPath, string problem, string hint)
        : base(Compose(sourceName, line, column, keyPath, problem, hint))
    {
        SourceName = sourceName;
        Line = line;
        Column = column;
        KeyPath = keyPath;
        Problem = problem;
        Hint = hint;
    }

    public string SourceName { get; }
    public int Line { get; }
    public int Column { get; }
    /// <summary>Dotted path of the key, e.g. "adc.bits"; empty for syntax errors.</summary>
    public string KeyPath { get; }
    public string Problem { get; }
    public string Hint { get; }

    private static string Compose(string sourceName, int line, int column, string keyPath, string problem, string hint)
    {
        var where = keyPath.Length == 0 ? "" : $"{keyPath}: ";
        var tail = hint.Length == 0 ? "" : " " + hint;
        return $"{sourceName}:{line}:{column}: {where}{problem.TrimEnd('.')}.{tail}";
    }
}
