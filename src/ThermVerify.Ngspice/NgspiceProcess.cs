using System.Diagnostics;

namespace ThermVerify.Ngspice;

/// <summary>
/// Runs a deck in a child <c>ngspice -b</c> process: slower than the shared library, but a deck that would bring
/// the engine down cannot take thermverify with it.
/// </summary>
internal static class NgspiceProcess
{
    public const string InstallHint =
        "the ngspice program was not found on PATH; install it, on Debian or Ubuntu with 'apt-get install ngspice'";

    public static bool IsAvailable => FindExecutable() is not null;

    public static NgspiceResult Run(string deck, TimeSpan? timeout = null)
    {
        var executable = FindExecutable() ?? throw new NgspiceUnavailableException(InstallHint);
        var folder = Directory.CreateTempSubdirectory("thermverify-ngspice-");
        try
        {
            var deckPath = Path.Combine(folder.FullName, "deck.cir");
            var rawPath = Path.Combine(folder.FullName, "out.raw");
            File.WriteAllText(deckPath, deck);
            var start = new ProcessStartInfo(executable, ["-b", "-r", rawPath, deckPath])
            {
                RedirectStandardOutput = true, RedirectStandardError = true, UseShellExecute = false,
                WorkingDirectory = folder.FullName,
            };
            start.Environment["SPICE_ASCIIRAWFILE"] = "1";
            using var process = Process.Start(start) ?? throw new NgspiceUnavailableException(InstallHint);
            var stdout = process.StandardOutput.ReadToEndAsync();
            var stderr = process.StandardError.ReadToEndAsync();
            if (!process.WaitForExit(timeout ?? TimeSpan.FromMinutes(2)))
            {
                process.Kill(entireProcessTree: true);
                throw new NgspiceException("ngspice did not finish in time and was stopped", []);
            }
            var output = (stdout.Result + "\n" + stderr.Result).Split('\n').Select(l => l.TrimEnd()).Where(l => l.Length > 0).ToList();
            var errors = NgspiceSession.ErrorLines([.. stderr.Result.Split('\n').Where(l => l.Trim().Length > 0).Select(l => "stderr " + l)]);
            if (errors.Count > 0 || !File.Exists(rawPath))
                throw new NgspiceException($"ngspice could not run the deck: {(errors.Count > 0 ? string.Join("; ", errors) : $"exit code {process.ExitCode}, no results")}", output);
            return new NgspiceResult(AsciiRawReader.Read(File.ReadAllText(rawPath)), output);
        }
        finally
        {
            folder.Delete(recursive: true);
        }
    }

    private static string? FindExecutable()
    {
        var path = Environment.GetEnvironmentVariable("PATH") ?? "";
        return path.Split(Path.PathSeparator)
            .Select(dir => Path.Combine(dir, "ngspice"))
            .FirstOrDefault(File.Exists);
    }
}
