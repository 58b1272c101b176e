namespace ThermVerify.Files;

/// <summary>
/// The checks an output path passes before any work is done, and again just before the file is replaced: its folder
/// exists (no folder is guessed into being from a typo), the path is not a folder, a link, a device, a FIFO or a
/// socket (a link could lead anywhere, and renaming over /dev/null would replace the device), and an existing file is
/// replaced only when the user said --force.
/// </summary>
internal static class OutputTarget
{
    /// <param name="parentMayBeCreated">True for a file inside an output folder (a report), whose folders are made when the set is written.</param>
    public static void CheckFile(string path, bool overwrite, bool parentMayBeCreated = false)
    {
        var full = Path.GetFullPath(path);
        CheckParent(path, Path.GetDirectoryName(full)!, parentMayBeCreated);
        switch (KindOf(full))
        {
            case null:
                return;
            case FileKind.Regular when overwrite:
                return;
            case FileKind.Regular:
                throw new OutputExistsException($"{path} exists already; pass --force to replace it");
            case var kind:
                throw new OutputPathException($"{path} {Describe(kind.Value)}; thermverify writes only regular files and never replaces anything else. Name another file");
        }
    }

    /// <summary>A folder that will hold outputs (the report): created when missing, but its own folder must exist.</summary>
    public static void CheckFolder(string path, bool createdWhenMissing = true)
    {
        var full = Path.GetFullPath(path);
        switch (KindOf(full))
        {
            case FileKind.Directory:
                return;
            case null:
                if (!createdWhenMissing)
                    throw new OutputPathException($"the folder {path} does not exist; create it first");
                CheckParent(path, Path.GetDirectoryName(full)!, mayBeCreated: false);
                return;
            case FileKind.SymbolicLink when Directory.Exists(full):
                return; // a link to a folder the user chose: the files inside are written as regular files
            case var kind:
                throw new OutputPathException($"{path} {Describe(kind.Value)}, where a folder is needed. Name a folder");
        }
    }

    /// <summary>
    /// The folders between an output folder and a file in it (a report's plots/) must be real folders: a link planted
    /// there would send the file anywhere.
    /// </summary>
    public static void CheckSubfolders(string folder, string relativePath)
    {
        var current = Path.GetFullPath(folder);
        foreach (var part in (Path.GetDirectoryName(relativePath) ?? "").Split(Path.DirectorySeparatorChar, StringSplitOptions.RemoveEmptyEntries))
        {
            current = Path.Combine(current, part);
            if (KindOf(current) is { } kind and not FileKind.Directory)
                throw new OutputPathException($"{Path.Combine(folder, relativePath)}: {current} {Describe(kind)}, where a folder of the report is needed; remove it");
        }
    }

    private static void CheckParent(string path, string parent, bool mayBeCreated)
    {
        if (Directory.Exists(parent)) return;
        if (File.Exists(parent))
            throw new OutputPathException($"{path}: {parent} is a file, where a folder is needed. Name a path inside a folder");
        if (!mayBeCreated)
            throw new OutputPathException($"{path}: the folder {parent} does not exist; create it first, or name a file in an existing folder");
        if (Path.GetDirectoryName(parent) is { } above && above != parent)
            CheckParent(path, above, mayBeCreated: true);
    }

    /// <summary>What is at <paramref name="full"/> itself (a link is a link); null when nothing is.</summary>
    internal static FileKind? KindOf(string full)
    {
        if (UnixFileStatus.Supported)
            return UnixFileStatus.OfPath(full)?.Kind;
        var info = new FileInfo(full);
        if (info.LinkTarget is not null) return FileKind.SymbolicLink;
        if (Directory.Exists(full)) return FileKind.Directory;
        return info.Exists ? FileKind.Regular : null;
    }

    private static string Describe(FileKind kind) => kind switch
    {
        FileKind.Directory => "is a folder",
        FileKind.SymbolicLink => "is a link",
        FileKind.CharacterDevice or FileKind.BlockDevice => "is a device",
        FileKind.Fifo => "is a FIFO (named pipe)",
        FileKind.Socket => "is a socket",
        FileKind.Regular => "is a file",
        _ => "is not a regular file",
    };
}

/// <summary>An output path names something thermverify will not write to (a folder, a link, a device, a missing folder).</summary>
public sealed class OutputPathException(string message) : IOException(message);
