using System.Collections.Concurrent;
using System.Runtime.InteropServices;
using Microsoft.Win32.SafeHandles;

namespace ThermVerify.Ngspice;

/// <summary>
/// The worker's side (this assembly started as a process by <see cref="NgspiceWorker"/>): it loads the ngspice
/// shared library, runs the decks it is sent one at a time and answers with the plots. It runs in a private empty
/// folder (its working directory and HOME), so the library finds no .spiceinit there; the user's own start-up file
/// is switched off where the library can be told to, and otherwise refused (<see cref="StartupFiles"/>). Standard
/// output is kept for the answers and the library's own prints go to standard error. When its standard input ends,
/// thermverify has gone (even killed outright): the worker removes its folder and ends, even in the middle of a deck.
/// </summary>
internal static class WorkerLoop
{
    public const string Argument = "--thermverify-ngspice-worker";

    public static int Run(string[] args)
    {
        if (args.Length != 2 || args[0] != Argument)
        {
            Console.Error.WriteLine("This is thermverify's ngspice worker; thermverify starts it. Run 'thermverify check --engine ngspice'.");
            return 2;
        }
        var folder = args[1];
        var answers = new BinaryWriter(TakeStandardOutput());
        var requests = new BlockingCollection<string>();
        var reader = new Thread(() => ReadRequests(requests, folder)) { IsBackground = true, Name = "requests" };
        reader.Start();
        foreach (var deck in requests.GetConsumingEnumerable())
        {
            WorkerProtocol.WriteStarted(answers);
            if (StartupFiles.Refusal() is { } refusal)
            {
                WorkerProtocol.WriteAnswer(answers, WorkerStatus.Unavailable, refusal, [], []);
                continue;
            }
            try
            {
                var result = NgspiceSession.Run(deck);
                WorkerProtocol.WriteAnswer(answers, WorkerStatus.Done, "", result.Output, result.Plots);
            }
            catch (NgspiceUnavailableException e)
            {
                WorkerProtocol.WriteAnswer(answers, WorkerStatus.Unavailable, e.Message, [], []);
            }
            catch (NgspiceException e)
            {
                var stopped = NgspiceSession.Stopped;
                WorkerProtocol.WriteAnswer(answers, stopped ? WorkerStatus.FailedAndStopped : WorkerStatus.Failed, e.Message, e.EngineOutput, []);
                if (stopped) return 0;
            }
        }
        return 0;
    }

    /// <summary>The one reader of standard input; its end means thermverify is gone, so the worker goes too.</summary>
    private static void ReadRequests(BlockingCollection<string> requests, string folder)
    {
        using var input = new BinaryReader(Console.OpenStandardInput());
        while (WorkerProtocol.ReadRequest(input) is { } deck)
            requests.Add(deck);
        try
        {
            if (Directory.Exists(folder)) Directory.Delete(folder, recursive: true);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            // the parent's sweep of abandoned folders removes it later
        }
        Environment.Exit(0);
    }

    /// <summary>A private copy of standard output for the answers; descriptor 1 then points at standard error.</summary>
    private static Stream TakeStandardOutput()
    {
        if (!OperatingSystem.IsLinux() && !OperatingSystem.IsMacOS())
            return Console.OpenStandardOutput();
        var copy = Dup(1);
        if (copy < 0 || Dup2(2, 1) < 0)
            return Console.OpenStandardOutput();
        return new FileStream(new SafeFileHandle(copy, ownsHandle: true), FileAccess.Write, bufferSize: 1 << 16);
    }

    [DllImport("libc", EntryPoint = "dup", SetLastError = true)]
    private static extern int Dup(int descriptor);

    [DllImport("libc", EntryPoint = "dup2", SetLastError = true)]
    private static extern int Dup2(int descriptor, int target);
}
