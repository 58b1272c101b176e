using ThermVerify.Design.Subcircuits;

namespace ThermVerify.Design;

/// <summary>
/// A file that a SPICE file of the design includes (a netlist, an op-amp subcircuit file): resolved like every path of a
/// design, inside the design's folder, and counted among the files the design was read from.
/// </summary>
internal static class SpiceIncludes
{
    /// <param name="fail">The reader's own positioned error: (where, what, how to fix).</param>
    public static (string FileName, string Text) Read(TomlSection s, string included, SpiceToken at,
        Func<SpiceToken, string, string, DesignException> fail)
    {
        if (included.Length == 0 || included.Any(c => c is '"' or '\'' or '`' or '\\' || char.IsControl(c)) || Path.IsPathRooted(included))
            throw fail(at, $".include \"{included}\": the path must be relative, without quotes or control characters",
                "Include a file in the design's folder by its path relative to the design file.");
        try
        {
            var (_, content) = Files.InputFile.ReadInside(s.BaseDirectory, included, Limits.Work.Limits.MaximumFileBytes);
            s.NoteFileRead(included, content.Sha256);
            return (included, content.Text);
        }
        catch (Files.InputFileException e)
        {
            throw fail(at, $".include \"{included}\": the file {e.Problem}", e.Hint);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            throw fail(at, $".include \"{included}\": the file cannot be read ({e.Message.TrimEnd('.')})", "Check the name and permissions.");
        }
    }
}
