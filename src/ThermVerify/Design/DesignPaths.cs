namespace ThermVerify.Design;

/// <summary>
/// Files named by a design (R–T table, op-amp subcircuit) are resolved against the design's folder and must
/// stay inside it, so a design shared with a colleague carries everything it needs and reads nothing else.
/// </summary>
internal static class DesignPaths
{
    public static string Resolve(TomlSection section, string key, string relative)
    {
        if (string.IsNullOrWhiteSpace(relative))
            throw section.ErrorAtValue(key, "empty file name", "Name a file next to the design file, e.g. \"rt.csv\".");
        var root = Path.GetFullPath(section.BaseDirectory);
        var full = Path.GetFullPath(Path.Combine(root, relative));
        var rootWithSeparator = root.EndsWith(Path.DirectorySeparatorChar) ? root : root + Path.DirectorySeparatorChar;
        if (Path.IsPathRooted(relative) || !full.StartsWith(rootWithSeparator, StringComparison.Ordinal))
            throw section.ErrorAtValue(key, $"\"{relative}\" points outside the design's folder",
                "Put the file in the design file's folder (or below it) and give its path relative to the design file.");
        if (!File.Exists(full))
            throw section.ErrorAtValue(key, $"file \"{relative}\" not found (looked for {full})", "Check the name; paths are relative to the design file.");
        // A link inside the folder may still lead out of it: follow it only to check where it ends.
        if (new FileInfo(full).ResolveLinkTarget(returnFinalTarget: true) is { } target
            && !Path.GetFullPath(target.FullName).StartsWith(rootWithSeparator, StringComparison.Ordinal))
            throw section.ErrorAtValue(key, $"\"{relative}\" is a link that leads outside the design's folder",
                "Copy the file into the design file's folder instead of linking to it.");
        return full;
    }
}
