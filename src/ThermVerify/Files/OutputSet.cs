using System.Text;

namespace ThermVerify.Files;

/// <summary>
/// The outputs of one run, written as one set: every target is checked before the work (<see cref="CheckTargets"/>),
/// every content is rendered before anything is written, every file goes to a temporary file beside its target, and
/// only when all of them are complete are they renamed over their targets, one after the other. A failure or a
/// cancellation before that leaves every target as it was and no temporary file behind.
/// </summary>
internal sealed class OutputSet(bool overwrite)
{
    private readonly List<(string Path, Func<byte[]> Content)> files = [];
    private readonly List<(string Folder, Func<IReadOnlyList<(string RelativePath, byte[] Content)>> Contents, IReadOnlyList<string> Expected)> folders = [];

    public bool IsEmpty => files.Count == 0 && folders.Count == 0;

    /// <summary>A text file (UTF-8, no byte-order mark), rendered when the set is written.</summary>
    public OutputSet Add(string path, Func<string> text) => Add(path, () => new UTF8Encoding(false).GetBytes(text()));

    public OutputSet Add(string path, Func<byte[]> content)
    {
        files.Add((path, content));
        return this;
    }

    /// <summary>
    /// A folder of files whose names are known only once rendered (a report and its plots); the files named in
    /// <paramref name="expected"/> are known before and are checked with the other targets, before the work.
    /// </summary>
    public OutputSet AddFolder(string folder, Func<IReadOnlyList<(string RelativePath, byte[] Content)>> contents, IReadOnlyList<string>? expected = null)
    {
        folders.Add((folder, contents, expected ?? []));
        return this;
    }

    /// <summary>Refuses, before any work, a target that exists without --force, a folder, a link, a device or a missing folder.</summary>
    public void CheckTargets()
    {
        var seen = new HashSet<string>(StringComparer.Ordinal);
        foreach (var (path, _) in files)
        {
            if (!seen.Add(Path.GetFullPath(path)))
                throw new OutputPathException($"{path} is named for two outputs; give each its own file");
            OutputTarget.CheckFile(path, overwrite);
        }
        foreach (var (folder, _, expected) in folders)
        {
            OutputTarget.CheckFolder(folder);
            foreach (var file in expected)
                OutputTarget.CheckFile(Path.Combine(folder, file), overwrite, parentMayBeCreated: true);
        }
    }

    /// <summary>Renders, writes and renames the whole set; returns the files written (full paths).</summary>
    public IReadOnlyList<string> Write()
    {
        CheckTargets();
        var rendered = new List<(string Shown, string Full, byte[] Content, bool InFolder)>();
        foreach (var (path, content) in files)
            rendered.Add((path, Path.GetFullPath(path), Render(path, content), false));
        foreach (var (folder, contents, _) in folders)
        {
            foreach (var (relative, content) in Render(folder, contents))
            {
                OutputTarget.CheckSubfolders(folder, relative);
                var shown = Path.Combine(folder, relative);
                rendered.Add((shown, Path.GetFullPath(shown), content, true));
            }
        }
        foreach (var (shown, _, _, inFolder) in rendered)
            OutputTarget.CheckFile(shown, overwrite, inFolder);

        var temporaries = new List<(string Temporary, string Full)>();
        try
        {
            foreach (var (_, full, content, _) in rendered)
            {
                var folder = Path.GetDirectoryName(full)!;
                Directory.CreateDirectory(folder);
                var temporary = Path.Combine(folder, $".{Path.GetFileName(full)}.{Environment.ProcessId}-{Guid.NewGuid():N}.tmp");
                temporaries.Add((temporary, full));
                using (var stream = new FileStream(temporary, FileMode.CreateNew, FileAccess.Write))
                    stream.Write(content);
            }
            // Just before the renames, the targets once more: nothing became a link or a device in the meantime.
            foreach (var (shown, _, _, inFolder) in rendered)
                OutputTarget.CheckFile(shown, overwrite, inFolder);
            foreach (var (temporary, full) in temporaries)
                File.Move(temporary, full, overwrite);
        }
        finally
        {
            foreach (var (temporary, _) in temporaries)
                if (File.Exists(temporary)) File.Delete(temporary);
        }
        return [.. rendered.Select(r => r.Full)];
    }

    private static T Render<T>(string path, Func<T> render)
    {
        try
        {
            return render();
        }
        catch (Exception e) when (e is not OperationCanceledException && OutputRenderException.Explains(e))
        {
            throw new OutputRenderException(path, e);
        }
    }
}
