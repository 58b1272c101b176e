namespace ThermVerify.Files;

/// <summary>
/// One output file written atomically: readers only ever see the old file or the complete new one (a temporary file
/// beside it, then one rename). The same checks as <see cref="OutputSet"/>: no folder, link or device is replaced, and
/// an existing file only when <paramref name="overwrite"/> is set.
/// </summary>
internal static class AtomicFile
{
    public static void WriteAllText(string path, string content, bool overwrite) =>
        new OutputSet(overwrite).Add(path, () => content).Write();

    public static void WriteAllBytes(string path, byte[] content, bool overwrite) =>
        new OutputSet(overwrite).Add(path, () => content).Write();
}

/// <summary>An output file exists and the user did not ask to replace it.</summary>
public sealed class OutputExistsException(string message) : IOException(message);
