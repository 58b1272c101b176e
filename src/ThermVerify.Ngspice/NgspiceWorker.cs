using System.Diagnostics;
using System.Runtime.InteropServices;
using System.Text;
using ThermVerify.Limits;

namespace ThermVerify.Ngspice;

/// <summary>
/// One ngspice worker process: this assembly started again as a program (<see cref="WorkerLoop"/>), holding the
/// shared library, so that a library that hangs or crashes on a deck costs a process, never thermverify: a hang
/// meets the run's cancellation (Ctrl+C, --timeout) or the deck's time limit and the worker is killed; a crash is
/// read as the end of its output and reported with the signal. The worker runs in a private folder that is removed
/// when it ends; if thermverify itself is killed, the worker sees its input end and goes too.
/// </summary>
internal sealed class NgspiceWorker : IDisposable
{
    private const int KeptErrorCharacters = 4000;

    private readonly Process process;
    private readonly DirectoryInfo folder;
    private readonly BinaryWriter requests;
    private readonly BinaryReader answers;
    private readonly StringBuilder errors = new();

    private NgspiceWorker(Process process, DirectoryInfo folder)
    {
        this.process = process;
        this.folder = folder;
        requests = new BinaryWriter(process.StandardInput.BaseStream);
        answers = new BinaryReader(process.StandardOutput.BaseStream);
        process.ErrorDataReceived += (_, e) =>
        {
            if (e.Data is null) return;
            lock (errors)
            {
                errors.AppendLine(e.Data);
                if (errors.Length > KeptErrorCharacters) errors.Remove(0, errors.Length - KeptErrorCharacters);
            }
        };
        process.BeginErrorReadLine();
    }

    /// <summary>False once the worker has ended or the library stopped itself: the engine starts another.</summary>
    public bool Usable { get; private set; } = true;

    /// <param name="library">A build of the shared library to load instead of the system's; null for the usual search.</param>
    public static NgspiceWorker Start(string? library = null)
    {
        var folder = TemporaryFolders.Create();
        try
        {
            var (host, leading) = Command();
            var start = new ProcessStartInfo(host)
            {
                RedirectStandardInput = true, RedirectStandardOutput = true, RedirectStandardError = true, UseShellExecute = false,
                WorkingDirectory = folder.FullName,
            };
            foreach (var argument in leading) start.ArgumentList.Add(argument);
            start.ArgumentList.Add(WorkerLoop.Argument);
            start.ArgumentList.Add(folder.FullName);
            start.Environment["HOME"] = folder.FullName;
            if (library is not null) start.Environment[NgspiceLibrary.LibraryVariable] = library;
            var process = Process.Start(start) ?? throw new NgspiceUnavailableException("the ngspice worker process could not be started");
            return new NgspiceWorker(process, folder);
        }
        catch
        {
            TemporaryFolders.Delete(folder);
            throw;
        }
    }

    /// <summary>Runs one deck; the run's cancellation or <paramref name="timeLimit"/> kills the worker.</summary>
    public NgspiceResult Run(string deck, TimeSpan timeLimit)
    {
        if (!Usable) throw new InvalidOperationException("this worker has ended");
        using var limit = new CancellationTokenSource(timeLimit);
        using var either = CancellationTokenSource.CreateLinkedTokenSource(limit.Token, Work.Cancel);
        var reading = Task.Run(() =>
        {
            WorkerProtocol.WriteRequest(requests, deck);
            var started = WorkerProtocol.ReadAnswer(answers);
            return started.Status == WorkerStatus.Started ? WorkerProtocol.ReadAnswer(answers) : started;
        });
        try
        {
            reading.Wait(either.Token);
        }
        catch (OperationCanceledException)
        {
            Kill();
            Work.ThrowIfCancelled();
            throw new NgspiceException($"the ngspice library did not finish the deck within {timeLimit.TotalSeconds:0} s; its worker process was stopped", []);
        }
        catch (AggregateException e) when (e.InnerException is EndOfStreamException or IOException or InvalidDataException)
        {
            throw Crashed();
        }
        var (status, message, output, plots) = reading.Result;
        switch (status)
        {
            case WorkerStatus.Done:
                return new NgspiceResult(plots, output);
            case WorkerStatus.Unavailable:
                Usable = false;
                throw new NgspiceUnavailableException(message);
            case WorkerStatus.FailedAndStopped:
                Usable = false;
                throw new NgspiceException(message, output);
            default:
                throw new NgspiceException(message, output);
        }
    }

    private NgspiceException Crashed()
    {
        Usable = false;
        if (!process.WaitForExit(TimeSpan.FromSeconds(10))) Kill();
        var code = process.HasExited ? process.ExitCode : -1;
        string detail;
        lock (errors) detail = errors.ToString().Trim();
        var how = code > 128 ? $"it was ended by signal {code - 128}{SignalName(code - 128)}" : $"it exited with code {code}";
        return new NgspiceException($"the ngspice library crashed while running the deck ({how}); thermverify is unharmed, but this deck cannot be simulated" +
                                    (detail.Length > 0 ? $"; the worker's last words: {LastLine(detail)}" : ""), detail.Split('\n'));
    }

    private static string SignalName(int signal) => signal switch
    {
        6 => " (SIGABRT)",
        9 => " (SIGKILL)",
        11 => " (SIGSEGV, a memory fault)",
        _ => "",
    };

    private static string LastLine(string text) => text.Split('\n')[^1].Trim();

    private void Kill()
    {
        Usable = false;
        try
        {
            process.Kill(entireProcessTree: true);
            process.WaitForExit();
        }
        catch (InvalidOperationException)
        {
            // it had ended already
        }
    }

    public void Dispose()
    {
        if (!process.HasExited)
        {
            try
            {
                process.StandardInput.Close(); // the worker's signal to leave: it removes its folder and ends
            }
            catch (IOException)
            {
                // its input is gone already
            }
            if (!process.WaitForExit(TimeSpan.FromSeconds(10))) Kill();
        }
        process.Dispose();
        TemporaryFolders.Delete(folder);
    }

    /// <summary>How to start this assembly as a program: the .NET host this process runs on, "exec" and the assembly.</summary>
    private static (string Host, IReadOnlyList<string> Arguments) Command()
    {
        var assembly = typeof(NgspiceWorker).Assembly.Location;
        var runtimeDirectory = RuntimeEnvironment.GetRuntimeDirectory(); // <root>/shared/Microsoft.NETCore.App/<version>/
        var root = Path.GetFullPath(Path.Combine(runtimeDirectory, "..", "..", ".."));
        var host = Path.Combine(root, OperatingSystem.IsWindows() ? "dotnet.exe" : "dotnet");
        if (!File.Exists(host))
            throw new NgspiceUnavailableException($"the .NET host was not found at {host}, so the ngspice worker cannot be started");
        var configuration = Path.ChangeExtension(assembly, ".runtimeconfig.json");
        if (File.Exists(configuration))
            return (host, ["exec", assembly]);
        // Referenced as a library, the assembly's own runtime configuration may not have been copied: use the program's.
        var program = Path.Combine(AppContext.BaseDirectory, Path.GetFileNameWithoutExtension(Environment.GetCommandLineArgs()[0]) + ".runtimeconfig.json");
        return (host, ["exec", "--runtimeconfig", program, assembly]);
    }
}
