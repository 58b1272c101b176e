using System.Runtime.InteropServices;

namespace ThermVerify.Cli;

/// <summary>
/// Ctrl+C (SIGINT) and SIGTERM, handled for the whole life of the process: the first cancels <see cref="Token"/> (every
/// analysis observes it and cleans up, and the command exits 130); every later one is absorbed, so pressing Ctrl+C
/// again while the run is stopping never ends the process half-way through its clean-up. (System.CommandLine's own
/// handling dropped its signal registration as soon as the command returned, and a second Ctrl+C arriving in the
/// clean-up after that killed the process.) A clean-up that takes longer than <see cref="Grace"/> ends with 130 anyway.
/// </summary>
internal static class Interruption
{
    private static readonly CancellationTokenSource Source = new();
    private static readonly TimeSpan Grace = TimeSpan.FromSeconds(60);
    private static PosixSignalRegistration[]? registrations;
    private static int signalled;

    /// <summary>Cancelled by the first Ctrl+C or SIGTERM after <see cref="Listen"/>; never cancelled without it (a program embedding the CLI).</summary>
    public static CancellationToken Token => Source.Token;

    /// <summary>Takes over SIGINT and SIGTERM until the process ends (the registrations are kept, never disposed).</summary>
    public static void Listen() => registrations ??=
    [
        PosixSignalRegistration.Create(PosixSignal.SIGINT, OnSignal),
        PosixSignalRegistration.Create(PosixSignal.SIGTERM, OnSignal),
    ];

    private static void OnSignal(PosixSignalContext context)
    {
        context.Cancel = true;
        if (Interlocked.Exchange(ref signalled, 1) == 1) return;
        Source.Cancel();
        _ = Task.Delay(Grace).ContinueWith(_ => Environment.Exit(ExitCodes.Cancelled), TaskScheduler.Default);
    }
}
