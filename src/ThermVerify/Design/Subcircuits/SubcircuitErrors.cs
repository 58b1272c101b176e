namespace ThermVerify.Design.Subcircuits;

/// <summary>Makes the errors of one subcircuit file: file:line:column, the design key that named it, what and how to fix it.</summary>
internal sealed class SubcircuitErrors(string fileName, string keyPath)
{
    public string FileName { get; } = fileName;

    public DesignException At(int line, int column, string problem, string hint) =>
        new(FileName, line, column, keyPath, problem, hint);

    public DesignException At(SpiceToken token, string problem, string hint) => At(token.Line, token.Column, problem, hint);
}
