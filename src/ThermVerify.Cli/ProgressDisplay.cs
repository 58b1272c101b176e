using ThermVerify.Tolerances;

namespace ThermVerify.Cli;

/// <summary>
/// Progress of a long run on standard error: a bar redrawn in place on a terminal, a plain line every tenth of the
/// run when the output goes to a file or a pipe (so that logs stay readable). Safe to call from worker threads.
/// </summary>
internal sealed class ProgressDisplay(TextWriter error, bool terminal, string what) : IProgress<RunProgress>
{
    private const int BarWidth = 40;
    private readonly Lock gate = new();
    private readonly System.Diagnostics.Stopwatch clock = System.Diagnostics.Stopwatch.StartNew();
    private int lastTenth = -1;
    private int lastDone;

    /// <summary>A bar when <paramref name="error"/> is the process's own standard error and that is a terminal.</summary>
    public static ProgressDisplay For(TextWriter error, string what) => error switch
    {
        TerminalText { Raw: var raw } when ReferenceEquals(raw, Console.Error) && !Console.IsErrorRedirected => new(raw, true, what),
        _ => new(error, ReferenceEquals(error, Console.Error) && !Console.IsErrorRedirected, what),
    };

    public void Report(RunProgress value)
    {
        lock (gate)
        {
            if (value.Done < lastDone) return; // reports from worker threads may arrive out of order
            lastDone = value.Done;
            var fraction = (double)value.Done / value.Total;
            if (terminal)
            {
                var filled = (int)(fraction * BarWidth);
                error.Write($"\r{what} [{new string('#', filled)}{new string('.', BarWidth - filled)}] {value.Done}/{value.Total} {clock.Elapsed.TotalSeconds:0.0} s");
                if (value.Done == value.Total) error.WriteLine();
                return;
            }
            var tenth = (int)(fraction * 10);
            if (tenth == lastTenth) return;
            lastTenth = tenth;
            error.WriteLine($"{what}: {value.Done}/{value.Total} ({100 * fraction:0} %), {clock.Elapsed.TotalSeconds:0.0} s");
        }
    }
}
