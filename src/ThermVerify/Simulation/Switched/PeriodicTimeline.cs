using ThermVerify.Circuits;

namespace ThermVerify.Simulation.Switched;

/// <summary>
/// The switch edges of a circuit whose timed switches all follow <see cref="PeriodicSchedule"/>s of one period T,
/// as phases within a period: 0 = φ₀ &lt; φ₁ &lt; … &lt; φ_m = T. Interval i of period k is
/// [k·T + φᵢ, k·T + φᵢ₊₁); its durations are the same doubles in every period, so each (configuration, duration)
/// step is computed once and reused. Which switches are closed in an interval (a bit mask, bit j for switch j) is
/// read from the schedules themselves at the interval's middle, so the edges are exactly the engine's.
/// A period's masks are its pattern; patterns change only near a schedule's first and last window, so long runs of
/// equal periods can be jumped with a matrix power.
/// </summary>
internal sealed class PeriodicTimeline
{
    private readonly PeriodicSchedule[] schedules;
    private readonly PeriodicSchedule[] forEver;
    private readonly long regularPeriod;
    private readonly long[] changePeriods;

    public PeriodicTimeline(IReadOnlyList<TimedSwitch> switches)
    {
        if (switches.Count == 0)
            throw NotLinearException.Unsupported(null, "the circuit has no timed switch, so it has no period; it is linear and time-invariant, and its " +
                "operating point is its steady state");
        if (switches.Count > 30)
            throw NotLinearException.Unsupported(null, $"it has {switches.Count} timed switches; exact propagation handles up to 30");
        schedules = new PeriodicSchedule[switches.Count];
        for (var j = 0; j < switches.Count; j++)
            schedules[j] = switches[j].Schedule as PeriodicSchedule
                ?? throw NotLinearException.Unsupported(switches[j].Name, $"{switches[j].Describe} is not on a periodic schedule");
        PeriodSeconds = schedules[0].PeriodSeconds;
        for (var j = 1; j < schedules.Length; j++)
            if (Math.Abs(schedules[j].PeriodSeconds - PeriodSeconds) > 1e-12 * PeriodSeconds)
                throw NotLinearException.Unsupported(switches[j].Name,
                    $"{switches[j].Describe} has a period of {schedules[j].PeriodSeconds:G9} s and {switches[0].Describe} one of {PeriodSeconds:G9} s; " +
                    "exact propagation needs one common period");

        var snap = SnapSeconds;
        var phases = new List<double> { 0 };
        foreach (var s in schedules)
        {
            phases.Add(Wrap(s.DelaySeconds));
            phases.Add(Wrap(s.DelaySeconds + s.ClosedSeconds));
        }
        phases.Sort();
        var starts = new List<double>();
        foreach (var p in phases)
            if (starts.Count == 0 || p - starts[^1] > snap)
                starts.Add(p);
        Starts = [.. starts];
        Durations = [.. starts.Select((s, i) => (i + 1 < starts.Count ? starts[i + 1] : PeriodSeconds) - s)];

        forEver = [.. schedules.Select(s => s with { Count = null })];
        regularPeriod = schedules.Max(FirstWindowPeriod) + 2;
        var changes = new SortedSet<long> { 0 };
        foreach (var s in schedules)
        {
            var first = FirstWindowPeriod(s);
            for (var k = first; k <= first + 2; k++)
                changes.Add(k);
            if (s.Count is { } count)
                for (var k = first + count - 1; k <= first + count + 2; k++)
                    changes.Add(Math.Max(0, k));
        }
        changePeriods = [.. changes];
    }

    public double PeriodSeconds { get; }

    /// <summary>Two phases closer than this are one edge (rounding of delay + closed time against the period).</summary>
    public double SnapSeconds => 1e-9 * PeriodSeconds;

    /// <summary>φᵢ: where each interval of a period starts.</summary>
    public double[] Starts { get; }

    public double[] Durations { get; }

    public int IntervalCount => Starts.Length;

    /// <summary>Which switches are closed in each interval of period k.</summary>
    public int[] Pattern(long k) => PatternOf(schedules, k);

    /// <summary>Which switches are closed at an instant, as the schedules say (for the operating point at t = 0).</summary>
    public int MaskAt(double timeSeconds)
    {
        var mask = 0;
        for (var j = 0; j < schedules.Length; j++)
            if (schedules[j].IsClosed(timeSeconds))
                mask |= 1 << j;
        return mask;
    }

    /// <summary>The pattern of a period in which every schedule is running and none has run out (counts ignored).</summary>
    public int[] RegularPattern() => PatternOf(forEver, regularPeriod);

    /// <summary>The first period after <paramref name="k"/> whose pattern may differ from period k's (long.MaxValue if none).</summary>
    public long NextChange(long k)
    {
        foreach (var c in changePeriods)
            if (c > k)
                return c;
        return long.MaxValue;
    }

    /// <summary>The interval of a period that a phase in (0, T] ends in (left limit: an edge belongs to the interval before it).</summary>
    public int IntervalEndingAt(double phase)
    {
        for (var i = IntervalCount - 1; i > 0; i--)
            if (phase > Starts[i] + SnapSeconds)
                return i;
        return 0;
    }

    public static string Describe(IReadOnlyList<TimedSwitch> switches, int mask) =>
        switches.Count == 0 ? "no switches" :
            string.Join(", ", switches.Select((s, j) => $"'{s.Name}' {((mask >> j & 1) != 0 ? "closed" : "open")}"));

    private int[] PatternOf(PeriodicSchedule[] which, long k)
    {
        var masks = new int[IntervalCount];
        for (var i = 0; i < IntervalCount; i++)
        {
            var middle = k * PeriodSeconds + Starts[i] + Durations[i] / 2;
            for (var j = 0; j < which.Length; j++)
                if (which[j].IsClosed(middle))
                    masks[i] |= 1 << j;
        }
        return masks;
    }

    private long FirstWindowPeriod(PeriodicSchedule s) => (long)Math.Floor(s.DelaySeconds / PeriodSeconds);

    /// <summary>t mod T, with values within the snap of 0 or T taken as 0.</summary>
    private double Wrap(double t)
    {
        var phase = t - Math.Floor(t / PeriodSeconds) * PeriodSeconds;
        return phase < SnapSeconds || phase > PeriodSeconds - SnapSeconds ? 0 : phase;
    }
}
