using System.Text;
using static ThermVerify.Circuits.Spice.SpiceNumber;

namespace ThermVerify.Circuits.Spice;

/// <summary>
/// A timed switch's schedule as the control voltage of a SPICE voltage-controlled switch (1 V closed, 0 V open,
/// threshold 0.5 V). SPICE flips a switch at the first time point past the threshold, so the edges are 1 ps ramps:
/// closing edges are centred on the closing time, opening edges start at the opening time, so a sample read at the
/// opening time still sees the switch closed, as the built-in engine's [close, open) intervals do.
/// </summary>
internal static class SwitchControl
{
    public const double EdgeSeconds = 1e-12;

    public static string Waveform(SwitchSchedule schedule, double? stopSeconds) => schedule switch
    {
        PeriodicSchedule p when Pulse(p, stopSeconds) is { } pulse => pulse,
        _ => Piecewise(schedule, stopSeconds),
    };

    /// <summary>A repeating PULSE when the count does not end before the stop time (or there is no stop time).</summary>
    private static string? Pulse(PeriodicSchedule p, double? stopSeconds)
    {
        // Without a stop time (DC, AC, noise decks) only the state at t = 0 matters, and the pulse has it.
        if (p.Count is { } n && stopSeconds is { } stop && p.DelaySeconds + n * p.PeriodSeconds < stop)
            return n <= 2000 ? null : throw new EngineUnsupportedException(
                $"A periodic switch limited to {n} closures that end before the stop time would need a control waveform of {4 * n} corners; simulate a shorter time.");
        if (p.DelaySeconds == 0)
        {
            // Closed at t = 0: start high, fall at the first opening, rise centred on each period start.
            return $"PULSE(1 0 {Format(p.ClosedSeconds)} {Format(EdgeSeconds)} {Format(EdgeSeconds)} " +
                   $"{Format(p.PeriodSeconds - p.ClosedSeconds - 1.5 * EdgeSeconds)} {Format(p.PeriodSeconds)})";
        }
        var delay = Math.Max(0, p.DelaySeconds - EdgeSeconds / 2);
        return $"PULSE(0 1 {Format(delay)} {Format(EdgeSeconds)} {Format(EdgeSeconds)} " +
               $"{Format(p.DelaySeconds + p.ClosedSeconds - delay - EdgeSeconds)} {Format(p.PeriodSeconds)})";
    }

    private static string Piecewise(SwitchSchedule schedule, double? stopSeconds)
    {
        var edges = new List<double>();
        schedule.CollectEdges(0, stopSeconds ?? double.MaxValue, edges);
        edges.Sort();
        var text = new StringBuilder("PWL(");
        var closed = schedule.IsClosed(0);
        text.Append($"0 {(closed ? 1 : 0)}");
        foreach (var edge in edges.Distinct())
        {
            if (edge <= 0) continue;
            var after = schedule.IsClosed(edge);
            if (after == closed) continue;
            var (start, end) = after ? (edge - EdgeSeconds / 2, edge + EdgeSeconds / 2) : (edge, edge + EdgeSeconds);
            text.Append($" {Format(Math.Max(start, EdgeSeconds / 4))} {(closed ? 1 : 0)} {Format(end)} {(after ? 1 : 0)}");
            closed = after;
        }
        return text.Append(')').ToString();
    }
}
