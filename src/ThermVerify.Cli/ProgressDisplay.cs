using ThermVerify.Limits;
using ThermVerify.Tolerances;

namespace ThermVerify.Cli;

/// <summary>
/// Progress of a long run: a bar on an interactive terminal, redrawn in place, with the time spent and the time the
/// rest should take at the rate so far. Nothing at all when standard error goes to a file or a pipe, or with
/// --quiet: logs and CI output stay exactly the command's results, unless --progress asks for plain lines (one per
/// tenth of the run). Safe to call from worker threads.
/// </summary>
internal sealed class ProgressDisplay(TextWriter terminal, string what, Func<TimeSpan> elapsed, bool plainLines = false) : IProgress<RunProgress>
{
    private const int BarWidth = 30;
    private readonly Lock gate = new();
    private int lastDone = -1;
    private int lastPercent = -1;
    private int lastTenth = -1;

    /// <summary>
    /// A bar when <paramref name="error"/> is the process's own standard error, that is a terminal and the run is not
    /// quiet; plain lines on <paramref name="error"/> when <paramref name="linesAsked"/>; otherwise none (null), so the
    /// library does no reporting work either.
    /// </summary>
    public static ProgressDisplay? For(TextWriter error, string what, bool quiet = false, bool linesAsked = false)
    {
        var raw = error is TerminalText text ? text.Raw : error;
        var terminal = ReferenceEquals(raw, Console.Error) && !Console.IsErrorRedirected;
        if (quiet || !(terminal || linesAsked)) return null;
        var clock = System.Diagnostics.Stopwatch.StartNew();
        return terminal ? new ProgressDisplay(raw, what, () => clock.Elapsed) : new ProgressDisplay(error, what, () => clock.Elapsed, plainLines: true);
    }

    public void Report(RunProgress value)
    {
        lock (gate)
        {
            if (value.Done <= lastDone) return; // reports from worker threads may arrive out of order
            lastDone = value.Done;
            // A redraw only when the percentage moves: a terminal redrawn 10,000 times slows the run.
            var percent = (int)(Fraction(value) * 100);
            if (percent == lastPercent && value.Done != value.Total) return;
            lastPercent = percent;
            if (plainLines)
            {
                if (percent / 10 == lastTenth && value.Done != value.Total) return;
                lastTenth = percent / 10;
                terminal.WriteLine($"{what}: {value.Done}/{value.Total} ({percent} %), {Duration(elapsed())}");
                return;
            }
            terminal.Write($"\r{Line(value, elapsed())}");
            if (value.Done == value.Total) terminal.WriteLine();
        }
    }

    /// <summary>One line of the bar: what, bar, count, percentage, time spent and, once measurable, the time left.</summary>
    internal string Line(RunProgress value, TimeSpan spent)
    {
        var fraction = Fraction(value);
        var filled = (int)(fraction * BarWidth);
        var bar = $"{what} [{new string('#', filled)}{new string('.', BarWidth - filled)}] {value.Done}/{value.Total} ({100 * fraction:0} %), {Duration(spent)}";
        if (value.Done == 0 || value.Done == value.Total) return bar + "   ";
        var left = TimeSpan.FromTicks((long)(spent.Ticks * (value.Total - value.Done) / (double)value.Done));
        return $"{bar}, about {Duration(left)} left   "; // trailing blanks clear a longer previous line
    }

    private static double Fraction(RunProgress value) => value.Total > 0 ? Math.Clamp((double)value.Done / value.Total, 0, 1) : 1;

    private static string Duration(TimeSpan span) => span.TotalSeconds < 60
        ? $"{span.TotalSeconds:0.0} s"
        : span.TotalMinutes < 60 ? $"{(int)span.TotalMinutes} min {span.Seconds:00} s" : $"{(int)span.TotalHours} h {span.Minutes:00} min";
}
