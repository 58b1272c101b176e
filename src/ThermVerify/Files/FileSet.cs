using System.Security.Cryptography;

namespace ThermVerify.Files;

/// <summary>
/// The contents of a set of files, by SHA-256, so that a change is noticed however an editor saves (in place, or a
/// new file renamed over the old one) and a save that changes nothing is not. A missing file has no hash.
/// </summary>
internal sealed class FileSet
{
    private readonly IReadOnlyList<string> paths;
    private readonly string?[] hashes;

    public FileSet(IEnumerable<string> paths)
    {
        this.paths = [.. paths.Select(Path.GetFullPath).Distinct()];
        hashes = [.. this.paths.Select(HashOf)];
    }

    public IReadOnlyList<string> Paths => paths;

    /// <summary>The files whose content differs from when this set was taken (or from the last call).</summary>
    public IReadOnlyList<string> Changed()
    {
        var changed = new List<string>();
        for (var i = 0; i < paths.Count; i++)
        {
            var now = HashOf(paths[i]);
            if (now == hashes[i]) continue;
            hashes[i] = now;
            changed.Add(paths[i]);
        }
        return changed;
    }

    /// <summary>Polls until a file changes; returns the files that did. Throws when <paramref name="cancel"/> fires.</summary>
    public async Task<IReadOnlyList<string>> WaitForChangeAsync(TimeSpan interval, CancellationToken cancel)
    {
        while (true)
        {
            await Task.Delay(interval, cancel);
            if (Changed() is { Count: > 0 } changed)
                return changed;
        }
    }

    private static string? HashOf(string path)
    {
        try
        {
            using var stream = new FileStream(path, FileMode.Open, FileAccess.Read, FileShare.ReadWrite | FileShare.Delete);
            return Convert.ToHexString(SHA256.HashData(stream));
        }
        catch (IOException)
        {
            return null; // missing or being replaced: the next poll sees the new file
        }
        catch (UnauthorizedAccessException)
        {
            return null;
        }
    }
}
