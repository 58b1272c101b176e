using System.Diagnostics;

namespace ThermVerify.Ngspice;

/// <summary>
/// The private folders ngspice runs in (mode 700, under the system's temporary folder), named after the process
/// that made them: thermverify-ngspice-PID-XXXX. They are removed when the run ends, whatever happens; when a process
/// was killed outright (SIGKILL) and could not, the next run removes the folders of processes that no longer exist.
/// </summary>
internal static class TemporaryFolders
{
    private const string Prefix = "thermverify-ngspice-";
    private static int swept;

    public static DirectoryInfo Create()
    {
        SweepOnce();
        return Directory.CreateTempSubdirectory($"{Prefix}{Environment.ProcessId}-");
    }

    /// <summary>Sweeps the abandoned folders the first time this process asks.</summary>
    public static void SweepOnce()
    {
        if (Interlocked.Exchange(ref swept, 1) == 0) SweepAbandoned();
    }

    public static void Delete(DirectoryInfo folder)
    {
        try
        {
            folder.Refresh();
            if (folder.Exists) folder.Delete(recursive: true);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            // a file still held open by a dying child; the next run's sweep removes it
        }
    }

    /// <summary>Removes the folders of thermverify processes that ended without removing their own.</summary>
    internal static void SweepAbandoned()
    {
        try
        {
            foreach (var folder in new DirectoryInfo(Path.GetTempPath()).EnumerateDirectories(Prefix + "*"))
            {
                var rest = folder.Name[Prefix.Length..];
                var dash = rest.IndexOf('-');
                if (dash <= 0 || !int.TryParse(rest[..dash], out var pid) || pid == Environment.ProcessId || IsAlive(pid)) continue;
                if (folder.LinkTarget is not null) continue; // never follow a link planted in the shared temporary folder
                Delete(folder);
            }
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            // the sweep is housekeeping; a run never fails for it
        }
    }

    private static bool IsAlive(int pid)
    {
        try
        {
            using var process = Process.GetProcessById(pid);
            return !process.HasExited;
        }
        catch (ArgumentException)
        {
            return false;
        }
        catch (InvalidOperationException)
        {
            return false;
        }
    }
}
