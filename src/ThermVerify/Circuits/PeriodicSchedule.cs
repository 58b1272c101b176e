namespace ThermVerify.Circuits;

/// <summary>
/// Closed for <see cref="ClosedSeconds"/> at the start of each period, first at <see cref="DelaySeconds"/>,
/// <see cref="Count"/> times (null: for ever). An ADC's acquisition windows are the typical use.
/// </summary>
internal sealed record PeriodicSchedule(double DelaySeconds, double PeriodSeconds, double ClosedSeconds, int? Count = null) : SwitchSchedule
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
