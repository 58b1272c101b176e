namespace ThermVerify.Files;

/// <summary>
/// Writes an output file so that readers only ever see the old file or the complete new one: the content goes
/// to a temporary file in the same folder, which then replaces the target in one rename.
/// </summary>
internal static class AtomicFile
{
    public static void WriteAllText(string path, string content, bool overwrite = true) =>
        Write(path, overwrite, temporary => File.WriteAllText(temporary, content));

    public static void WriteAllBytes(string path, byte[] content, bool overwrite = true) =>
        Write(path, overwrite, temporary => File.WriteAllBytes(temporary, content));

    public static void Write(string path, bool overwrite, Action<string> writeTemporary)
    {
        var full = Path.GetFullPath(path);
        if (!overwrite && File.Exists(full))
            throw new OutputExistsException($"{path} exists already; pass --force to replace it");
        var folder = Path.GetDirectoryName(full)!;
        Directory.CreateDirectory(folder);
        var temporary = Path.Combine(folder, $".{Path.GetFileName(full)}.{Guid.NewGuid():N}.tmp");
        try
        {
            writeTemporary(temporary);
            File.Move(temporary, full, overwrite);
        }
        finally
        {
            if (File.Exists(temporary)) File.Delete(temporary);
        }
    }
}

/// <summary>An output file exists and the user did not ask to replace it.</summary>
public sealed class OutputExistsException(string message) : IOException(message);
