using System.Text;

namespace ThermVerify.Files;

/// <summary>
/// Reads the files a run is given: the design file a user names, and the files a design names (an R–T table, a
/// subcircuit), which are untrusted. Only regular files are read, never a device, a FIFO, a socket or a folder, and
/// never more than a size limit, so /dev/zero, a FIFO or a 2 GB file is refused at once instead of exhausting memory
/// or blocking. A file a design names must lie inside the design's folder where it really is: the path is resolved
/// component by component, following every link, before the folder check, and on Linux the file is then opened
/// without following links and the kernel's own path of the open file is checked again, so a link swapped in
/// between is caught. A file with more than one name (a hard link) is refused: its other names may lie outside the
/// folder, and nothing on the file says where they are.
/// </summary>
internal static class InputFile
{
    /// <summary>Links followed while resolving one path; more is a loop (Linux gives up at 40 as well).</summary>
    private const int MaximumLinkHops = 40;

    /// <summary>A file the user names directly (the design itself): any path, links allowed, but only a regular file of bounded size.</summary>
    public static string ReadText(string path, long maximumBytes) => Read(path, maximumBytes).Text;

    /// <summary>As <see cref="ReadText"/>, with the SHA-256 of the bytes read (what every output names the design by).</summary>
    public static InputText Read(string path, long maximumBytes)
    {
        var full = Path.GetFullPath(path);
        if (!UnixFileStatus.Supported)
            return ReadPortable(full, maximumBytes, checkLinks: false);
        var real = RealPath(full);
        return ReadOpened(real, maximumBytes, requireSingleName: false, expectedRealPath: null);
    }

    /// <summary>
    /// A file a design names, relative to <paramref name="folder"/>: resolved to its real location, refused unless
    /// that lies inside the real <paramref name="folder"/>; returns the real path and the text with its SHA-256.
    /// </summary>
    public static (string RealPath, InputText Content) ReadInside(string folder, string relative, long maximumBytes)
    {
        var (real, _) = ResolveInside(folder, relative);
        if (!UnixFileStatus.Supported)
            return (real, ReadPortable(real, maximumBytes, checkLinks: true));
        return (real, ReadOpened(real, maximumBytes, requireSingleName: true, expectedRealPath: real));
    }

    /// <summary>Where <paramref name="relative"/> really leads from <paramref name="folder"/>, refused when that is outside it.</summary>
    public static (string RealPath, string RealFolder) ResolveInside(string folder, string relative)
    {
        if (Path.IsPathRooted(relative))
            throw new InputFileException("is an absolute path", "Give the path relative to the design file, inside its folder.");
        var root = RealPath(Path.GetFullPath(folder));
        var real = Resolve(root, relative);
        var inside = root.EndsWith(Path.DirectorySeparatorChar) ? root : root + Path.DirectorySeparatorChar;
        if (!real.StartsWith(inside, StringComparison.Ordinal))
            throw new InputFileException($"leads outside the design's folder (it resolves to {real})",
                "Copy the file into the design file's folder (or below it) and give its path relative to the design file.");
        return (real, root);
    }

    /// <summary>The real location of an absolute path: every link in it followed, "." and ".." applied physically.</summary>
    public static string RealPath(string absolute) => Resolve(Path.GetPathRoot(absolute) ?? "/", Path.GetRelativePath(Path.GetPathRoot(absolute) ?? "/", absolute));

    private static string Resolve(string start, string relative)
    {
        var pending = new Stack<string>(Split(relative).Reverse());
        var current = start;
        var hops = 0;
        while (pending.Count > 0)
        {
            var part = pending.Pop();
            if (part is "" or ".") continue;
            if (part == "..")
            {
                current = Path.GetDirectoryName(current) ?? current;
                continue;
            }
            var next = Path.Join(current, part);
            var link = LinkTarget(next);
            if (link is null)
            {
                current = next;
                continue;
            }
            if (++hops > MaximumLinkHops)
                throw new InputFileException("goes through more than 40 links (a loop?)", "Name the file itself.");
            if (Path.IsPathRooted(link))
                current = Path.GetPathRoot(link) ?? "/";
            foreach (var piece in Split(link).Reverse())
                pending.Push(piece);
        }
        return current;
    }

    private static IEnumerable<string> Split(string path) =>
        path.Split(Path.DirectorySeparatorChar, Path.AltDirectorySeparatorChar);

    private static string? LinkTarget(string path)
    {
        try
        {
            var info = new FileInfo(path);
            return info.LinkTarget;
        }
        catch (IOException)
        {
            return null;
        }
        catch (UnauthorizedAccessException)
        {
            return null;
        }
    }

    private static InputText ReadOpened(string real, long maximumBytes, bool requireSingleName, string? expectedRealPath)
    {
        var before = UnixFileStatus.OfPath(real) ?? throw new InputFileException("was not found", "Check the name; paths are relative to the design file.");
        RequireRegular(before.Kind);
        using var handle = UnixFileStatus.OpenForReading(real);
        var status = UnixFileStatus.OfHandle(handle);
        RequireRegular(status.Kind);
        if (status.Inode != before.Inode || status.Device != before.Device)
            throw new InputFileException("changed while it was being opened", "Run again when nothing else is writing to the folder.");
        if (requireSingleName && status.LinkCount > 1)
            throw new InputFileException($"has {status.LinkCount} names (hard links); its other names may lie outside the design's folder",
                "Copy the file (cp, not ln) into the design file's folder.");
        if (expectedRealPath is not null && UnixFileStatus.PathOf(handle) is { } opened && opened != expectedRealPath)
            throw new InputFileException("changed while it was being opened (a folder on its path was replaced)", "Run again when nothing else is writing to the folder.");
        if (status.SizeBytes > maximumBytes)
            throw TooLarge(status.SizeBytes, maximumBytes);
        using var stream = new FileStream(handle, FileAccess.Read, bufferSize: 1);
        return Decode(stream, maximumBytes);
    }

    private static InputText ReadPortable(string path, long maximumBytes, bool checkLinks)
    {
        var info = new FileInfo(path);
        if (!info.Exists)
            throw new InputFileException(Directory.Exists(path) ? "is a folder, not a file" : "was not found", "Check the name.");
        if (checkLinks && info.LinkTarget is not null)
            throw new InputFileException("is a link", "Name the file itself, not a link to it.");
        if (info.Length > maximumBytes)
            throw TooLarge(info.Length, maximumBytes);
        using var stream = new FileStream(path, FileMode.Open, FileAccess.Read, FileShare.Read, bufferSize: 1);
        return Decode(stream, maximumBytes);
    }

    /// <summary>Reads at most the limit (a file that grows while it is read is caught too) and decodes UTF-8, a byte-order mark allowed.</summary>
    private static InputText Decode(Stream stream, long maximumBytes)
    {
        var buffer = new MemoryStream();
        var chunk = new byte[81920];
        int read;
        while ((read = stream.Read(chunk, 0, chunk.Length)) > 0)
        {
            buffer.Write(chunk, 0, read);
            if (buffer.Length > maximumBytes) throw TooLarge(buffer.Length, maximumBytes);
        }
        var bytes = buffer.GetBuffer().AsSpan(0, (int)buffer.Length);
        var sha256 = Convert.ToHexStringLower(System.Security.Cryptography.SHA256.HashData(bytes));
        using var reader = new StreamReader(new MemoryStream(buffer.GetBuffer(), 0, (int)buffer.Length), new UTF8Encoding(false), detectEncodingFromByteOrderMarks: true);
        return new InputText(reader.ReadToEnd(), sha256);
    }

    private static void RequireRegular(FileKind kind)
    {
        if (kind == FileKind.Regular) return;
        throw new InputFileException(kind switch
        {
            FileKind.Directory => "is a folder, not a file",
            FileKind.CharacterDevice or FileKind.BlockDevice => "is a device, not a file",
            FileKind.Fifo => "is a FIFO (named pipe), not a file",
            FileKind.Socket => "is a socket, not a file",
            FileKind.SymbolicLink => "is a link",
            _ => "is not a regular file",
        }, "Name a regular file.");
    }

    private static InputFileException TooLarge(long bytes, long maximumBytes) =>
        new($"is larger than the limit of {maximumBytes} bytes (at least {bytes} bytes)",
            "A design file, table or subcircuit of this size is not plausible; if it is really meant, raise --max-file-size.");
}

/// <summary>A file's text and the SHA-256 of its bytes as read (before decoding), in lower-case hex.</summary>
internal readonly record struct InputText(string Text, string Sha256);
