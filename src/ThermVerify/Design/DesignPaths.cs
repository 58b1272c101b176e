using ThermVerify.Files;
using ThermVerify.Limits;

namespace ThermVerify.Design;

/// <summary>
/// Files named by a design (R–T table, op-amp subcircuit) are resolved against the design's folder and must stay
/// inside it where they really are, so a design shared with a colleague carries everything it needs and reads
/// nothing else: every link on the path is followed before the check (docs/design-file.md, "Paths"). A path may
/// not hold quotes or control characters (it must not be able to say anything to a SPICE engine or a terminal), and
/// the file must be a regular file of one name within the size limit (<see cref="InputFile"/>). The file is read
/// once, here, so what is checked is what is used.
/// </summary>
internal static class DesignPaths
{
    public static (string FullPath, InputText Content) Read(TomlSection section, string key, string relative)
    {
        if (string.IsNullOrWhiteSpace(relative))
            throw section.ErrorAtValue(key, "empty file name", "Name a file next to the design file, e.g. \"rt.csv\".");
        if (relative.IndexOfAny(['"', '\'', '`', '\\']) is var quote and >= 0)
            throw section.ErrorAtValue(key, $"the path holds the character {relative[quote]}",
                "Rename the file (and its folders) to plain letters, digits, '-', '_', '.' and '/'.");
        if (Path.IsPathRooted(relative))
            throw section.ErrorAtValue(key, $"\"{relative}\" points outside the design's folder (it is an absolute path)",
                "Put the file in the design file's folder (or below it) and give its path relative to the design file.");
        try
        {
            return InputFile.ReadInside(section.BaseDirectory, relative, Work.Limits.MaximumFileBytes);
        }
        catch (InputFileException e)
        {
            var problem = e.Problem.StartsWith("leads outside", StringComparison.Ordinal)
                ? $"\"{relative}\" {e.Problem}"
                : $"file \"{relative}\" {e.Problem}";
            throw section.ErrorAtValue(key, problem, e.Hint);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            throw section.ErrorAtValue(key, $"file \"{relative}\" cannot be read ({e.Message.TrimEnd('.')})", "Check the name and the file's permissions.");
        }
    }
}
