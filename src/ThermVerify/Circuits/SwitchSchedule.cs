using System.Collections.Immutable;

namespace ThermVerify.Circuits;

/// <summary>
/// When a <see cref="TimedSwitch"/> is closed. Intervals are half-open, [close, open): at an edge the
/// state of the step that ends there is the state before the edge. Every edge is a breakpoint.
/// </summary>
public abstract record SwitchSchedule
{
    public abstract bool IsClosed(double timeSeconds);

    internal abstract void CollectEdges(double fromSeconds, double toSeconds, List<double> into);

    internal abstract void Validate(Element owner);

    /// <summary>A SPICE source for a 0/1 V control node following the schedule with 1 ps edges.</summary>
    internal abstract string ToSpiceControl();

    /// <summary>Length of the control edges in the SPICE deck.</summary>
    internal const double SpiceEdgeSeconds = 1e-12;
}

/// <summary>Closed during each listed [close, open) interval.</summary>
public sealed record IntervalSchedule(ImmutableArray<(double CloseSeconds, double OpenSeconds)> Intervals) : SwitchSchedule
{
    public IntervalSchedule(params (double CloseSeconds, double OpenSeconds)[] intervals) : this(intervals.ToImmutableArray()) { }

    public override bool IsClosed(double timeSeconds)
    {
        foreach (var (c, o) in Intervals)
            if (timeSeconds >= c && timeSeconds < o)
                return true;
        return false;
    }

    internal override void CollectEdges(double fromSeconds, double toSeconds, List<double> into)
    {
        foreach (var (c, o) in Intervals)
        {
            if (c >= fromSeconds && c <= toSeconds) into.Add(c);
            if (o >= fromSeconds && o <= toSeconds) into.Add(o);
        }
    }

    internal override string ToSpiceControl()
    {
        var corners = new List<string> { "0 0" };
        foreach (var (c, o) in Intervals.OrderBy(i => i.CloseSeconds))
        {
            corners.Add($"{SpiceDeckBuilder.Number(c)} 0");
            corners.Add($"{SpiceDeckBuilder.Number(c + SpiceEdgeSeconds)} 1");
            corners.Add($"{SpiceDeckBuilder.Number(double.IsFinite(o) ? o : 1e30)} 1");
            corners.Add($"{SpiceDeckBuilder.Number(double.IsFinite(o) ? o + SpiceEdgeSeconds : 1e30 + 1)} 0");
        }
        if (Intervals.Length > 0 && Intervals.Min(i => i.CloseSeconds) <= 0)
            corners.RemoveAt(0);
        return $"pwl({string.Join(" ", corners)})";
    }

    internal override void Validate(Element owner)
    {
        if (Intervals.IsDefault)
            throw new CircuitException($"{owner.Describe}: the interval schedule is empty; give at least one (close, open) pair or use a fixed switch.");
        for (var i = 0; i < Intervals.Length; i++)
        {
            var (c, o) = Intervals[i];
            ElementChecks.Finite(owner, c, $"close time #{i + 1}");
            if (double.IsNaN(o) || o <= c)
                throw new CircuitException($"{owner.Describe}: interval #{i + 1} opens at {o:G6} s, not after it closes at {c:G6} s; give open > close.");
        }
    }
}

/// <summary>
/// Closed for <see cref="ClosedSeconds"/> at the start of each period, first at <see cref="DelaySeconds"/>,
/// <see cref="Count"/> times (null: for ever). An ADC's acquisition windows are the typical use.
/// </summary>
public sealed record PeriodicSchedule(double DelaySeconds, double PeriodSeconds, double ClosedSeconds, int? Count = null) : SwitchSchedule
{
    public override bool IsClosed(double timeSeconds)
    {
        var tau = timeSeconds - DelaySeconds;
        if (tau < 0)
            return false;
        var k = Math.Floor(tau / PeriodSeconds);
        if (Count is { } n && k >= n)
            return false;
        return tau - k * PeriodSeconds < ClosedSeconds;
    }

    internal override void CollectEdges(double fromSeconds, double toSeconds, List<double> into)
    {
        var first = Math.Max(0, Math.Floor((fromSeconds - DelaySeconds) / PeriodSeconds) - 1);
        for (var k = first; Count is not { } n || k < n; k++)
        {
            var close = DelaySeconds + k * PeriodSeconds;
            if (close > toSeconds)
                return;
            if (close >= fromSeconds) into.Add(close);
            var open = close + ClosedSeconds;
            if (open >= fromSeconds && open <= toSeconds) into.Add(open);
        }
    }

    internal override string ToSpiceControl()
    {
        static string N(double v) => SpiceDeckBuilder.Number(v);
        var pulses = Count is { } n ? $" {n}" : "";
        return $"pulse(0 1 {N(DelaySeconds)} {N(SpiceEdgeSeconds)} {N(SpiceEdgeSeconds)} {N(ClosedSeconds - SpiceEdgeSeconds)} {N(PeriodSeconds)}{pulses})";
    }

    internal override void Validate(Element owner)
    {
        ElementChecks.NonNegative(owner, DelaySeconds, "schedule delay");
        ElementChecks.Positive(owner, PeriodSeconds, "schedule period");
        ElementChecks.Positive(owner, ClosedSeconds, "closed duration");
        if (ClosedSeconds >= PeriodSeconds)
            throw new CircuitException($"{owner.Describe}: closed for {ClosedSeconds:G6} s of a {PeriodSeconds:G6} s period; it must open within each period.");
        if (Count is < 0)
            throw new CircuitException($"{owner.Describe}: count {Count} is negative; give a count ≥ 0 or none for ever.");
    }
}
