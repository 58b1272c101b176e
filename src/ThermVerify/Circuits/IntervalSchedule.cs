using System.Collections.Immutable;

namespace ThermVerify.Circuits;

/// <summary>Closed during each listed [close, open) interval.</summary>
internal sealed record IntervalSchedule(ImmutableArray<(double CloseSeconds, double OpenSeconds)> Intervals) : SwitchSchedule
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
