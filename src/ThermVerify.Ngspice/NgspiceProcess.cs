using System.Diagnostics;
using ThermVerify.Limits;

namespace ThermVerify.Ngspice;

/// <summary>
/// Runs a deck in a child <c>ngspice -b</c> process: slower than the shared library, but a deck that would bring the
/// engine down cannot take thermverify with it. ngspice runs with <c>-n</c> (no start-up file: neither a
/// .spiceinit in the folder it was started from nor one in the user's home is read) in a private temporary folder
/// that is its working directory and its HOME, and that is removed afterwards whatever happens. The run observes
/// the run's cancellation (Ctrl+C, --timeout) and a time limit of its own; the child is killed when either stops it.
/// </summary>
internal static class NgspiceProcess
{
    public const string InstallHint =
        "the ngspice program was not found on PATH; install it, on Debian or Ubuntu with 'apt-get install ngspice'";

    /// <summary>A deck that runs longer than this is taken as hung.</summary>
    public static readonly TimeSpan DefaultTimeLimit = TimeSpan.FromMinutes(5);

    /// <summary>Largest raw file read back (a transient of a million points of ten vectors is about 250 MB as text).</summary>
    private const long MaximumRawBytes = 1L << 30;

    public static bool IsAvailable => FindExecutable() is not null;

    public static NgspiceResult Run(string deck, TimeSpan? timeLimit = null)
    {
        var executable = FindExecutable() ?? throw new NgspiceUnavailableException(InstallHint);
        var folder = TemporaryFolders.Create();
        try
        {
            var deckPath = Path.Combine(folder.FullName, "deck.cir");
            var rawPath = Path.Combine(folder.FullName, "out.raw");
            File.WriteAllText(deckPath, deck);
            var start = new ProcessStartInfo(executable, ["-b", "-n", "-r", rawPath, deckPath])
            {
                RedirectStandardOutput = true, RedirectStandardError = true, RedirectStandardInput = true, UseShellExecute = false,
                WorkingDirectory = folder.FullName,
            };
            start.Environment["SPICE_ASCIIRAWFILE"] = "1";
            start.Environment["HOME"] = folder.FullName;
            using var process = Process.Start(start) ?? throw new NgspiceUnavailableException(InstallHint);
            process.StandardInput.Close();
            var stdout = process.StandardOutput.ReadToEndAsync();
            var stderr = process.StandardError.ReadToEndAsync();
            WaitOrKill(process, timeLimit ?? DefaultTimeLimit);
            var output = (stdout.Result + "\n" + stderr.Result).Split('\n').Select(l => l.TrimEnd()).Where(l => l.Length > 0).ToList();
            var errors = NgspiceSession.ErrorLines([.. stderr.Result.Split('\n').Where(l => l.Trim().Length > 0).Select(l => "stderr " + l)]);
            if (errors.Count > 0 || !File.Exists(rawPath))
                throw new NgspiceException($"ngspice could not run the deck: {(errors.Count > 0 ? string.Join("; ", errors) : $"exit code {process.ExitCode}, no results")}", output);
            var size = new FileInfo(rawPath).Length;
            if (size > MaximumRawBytes)
                throw new NgspiceException($"ngspice wrote {size} bytes of results, more than the {MaximumRawBytes} thermverify reads back; ask for fewer points", output);
            return new NgspiceResult(AsciiRawReader.Read(File.ReadAllText(rawPath)), output);
        }
        finally
        {
            TemporaryFolders.Delete(folder);
        }
    }

    /// <summary>Waits for the child; on the run's cancellation or the time limit the child and its children are killed.</summary>
    private static void WaitOrKill(Process process, TimeSpan timeLimit)
    {
        using var limit = new CancellationTokenSource(timeLimit);
        using var either = CancellationTokenSource.CreateLinkedTokenSource(limit.Token, Work.Cancel);
        try
        {
            process.WaitForExitAsync(either.Token).GetAwaiter().GetResult();
        }
        catch (OperationCanceledException)
        {
            Kill(process);
            Work.ThrowIfCancelled();
            throw new NgspiceException($"ngspice did not finish the deck within {timeLimit.TotalSeconds:0} s and was stopped", []);
        }
    }

    private static void Kill(Process process)
    {
        try
        {
            process.Kill(entireProcessTree: true);
            process.WaitForExit();
        }
        catch (InvalidOperationException)
        {
            // it ended by itself in the meantime
        }
    }

    /// <summary>The version <c>ngspice -v</c> reports ("39"), or null when it reports none.</summary>
    public static string? Version()
    {
        if (FindExecutable() is not { } executable) return null;
        var start = new ProcessStartInfo(executable, ["-v"])
        {
            RedirectStandardOutput = true, RedirectStandardError = true, RedirectStandardInput = true, UseShellExecute = false,
        };
        using var process = Process.Start(start);
        if (process is null) return null;
        process.StandardInput.Close();
        var stdout = process.StandardOutput.ReadToEndAsync();
        _ = process.StandardError.ReadToEndAsync();
        WaitOrKill(process, TimeSpan.FromSeconds(30));
        return NgspiceBanner.Version(stdout.Result.Split('\n'));
    }

    private static string? FindExecutable()
    {
        var path = Environment.GetEnvironmentVariable("PATH") ?? "";
        return path.Split(Path.PathSeparator)
            .Where(dir => dir.Length > 0 && Path.IsPathRooted(dir)) // never the current folder: it may hold a planted "ngspice"
            .Select(dir => Path.Combine(dir, "ngspice"))
            .FirstOrDefault(File.Exists);
    }
}
