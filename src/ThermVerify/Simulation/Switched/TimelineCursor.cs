using ThermVerify.Limits;

namespace ThermVerify.Simulation.Switched;

/// <summary>
/// A position on the timeline — period, interval, time into the interval — and the state there. Moves forward
/// only; each step applies an exact interval map (checked first when there are monitors). Unknowns are read as the
/// limit from the left: at an edge, with the configuration of the interval that ends there.
/// </summary>
internal sealed class TimelineCursor
{
    private readonly SwitchedMaps maps;
    private readonly PeriodicTimeline timeline;
    private readonly bool regular;
    private double[] z;
    private double[] next;
    private readonly double[] deviation;
    private long period;
    private int interval;
    private double elapsed;
    private int[] pattern;
    private int[] previousPattern;
    private long patternUntil;

    /// <param name="regular">Follow the regular pattern in every period (the periodic steady state) instead of the schedules' own.</param>
    /// <param name="startPeriod">The period in which <paramref name="state"/> is (0: the start of the run).</param>
    /// <param name="startInterval">The interval of that period in which the state is.</param>
    /// <param name="startElapsed">How far into that interval the state is, in seconds.</param>
    /// <param name="deviation">The slew residuals' first-order deviation of the state carried in (zero when omitted: a state
    /// from the operating point or from time stepping).</param>
    public TimelineCursor(SwitchedMaps maps, PeriodicTimeline timeline, double[] state, bool regular, long startPeriod = 0,
        int startInterval = 0, double startElapsed = 0, double[]? deviation = null)
    {
        ArgumentOutOfRangeException.ThrowIfNegative(startPeriod);
        interval = startInterval;
        elapsed = startElapsed;
        this.maps = maps;
        this.timeline = timeline;
        this.regular = regular;
        z = (double[])state.Clone();
        this.deviation = deviation is null ? new double[z.Length] : (double[])deviation.Clone();
        next = new double[z.Length];
        period = startPeriod;
        pattern = PatternOf(startPeriod);
        previousPattern = startPeriod == 0 ? pattern : PatternOf(startPeriod - 1);
        patternUntil = regular ? long.MaxValue : timeline.NextChange(startPeriod);
    }

    /// <summary>
    /// Stop at an interval an op-amp leaves its linear region on and say so in <see cref="Violation"/>, instead of
    /// raising <see cref="NotLinearException"/>: a hybrid run meets such intervals over and over, and an exception (its
    /// message worded, the stack unwound) cost more than the step it reported.
    /// </summary>
    public bool StopOnViolation { get; init; }

    /// <summary>Where the cursor stopped (with <see cref="StopOnViolation"/>); it cannot move on from there.</summary>
    public LinearityViolation? Violation { get; private set; }

    /// <summary>The slew residuals' first-order deviation of the state where the cursor stands (see <see cref="IntervalMap"/>).</summary>
    public ReadOnlySpan<double> Deviation => deviation;

    /// <summary>
    /// Every unknown where the cursor stands (where it stopped on a violation: the start of the interval that failed),
    /// read as the limit from the left like every value: at an edge, in the configuration of the interval that ends
    /// there. That interval passed its check, so the values are within the linear region; the failing interval's
    /// algebraic values after the jump may not be, and would start a Newton iteration far from its solution.
    /// </summary>
    public double[] Solution()
    {
        if (elapsed > 0)
            return maps.ModelOf(pattern[interval]).Solution(z);
        var mask = interval > 0 ? pattern[interval - 1] : previousPattern[timeline.IntervalCount - 1];
        return maps.ModelOf(mask).Solution(z);
    }

    /// <summary>The present period's pattern, recomputed only where the timeline says it may change.</summary>
    private void NewPeriod(long k)
    {
        // A run of many checked periods never factorises a matrix (where the engine observes the run's cancellation).
        Work.ThrowIfCancelled();
        previousPattern = k == period + 1 ? pattern : PatternOf(k - 1);
        period = k;
        if (regular || k < patternUntil)
            return;
        pattern = timeline.Pattern(k);
        patternUntil = timeline.NextChange(k);
    }

    /// <summary>
    /// The slew residuals' first-order deviation of the unknown last read (through the state; the residual current's
    /// direct part at that instant is left out): the macro-model's value is the read value plus about this.
    /// </summary>
    public double LastDeviation { get; private set; }

    private static double Dot(ReadOnlySpan<double> a, ReadOnlySpan<double> b)
    {
        var sum = 0.0;
        for (var i = 0; i < a.Length; i++)
            sum += a[i] * b[i];
        return sum;
    }

    /// <summary>Moves to (period k, phase in (0, T]) and reads an unknown there (limit from the left).</summary>
    public double ReadAt(long k, double phase, int unknown)
    {
        var snap = timeline.SnapSeconds;
        var (targetPeriod, targetPhase) = phase >= timeline.PeriodSeconds - snap ? (k + 1, 0.0) : (k, phase);
        if (targetPeriod < period || targetPeriod == period && targetPhase < timeline.Starts[interval] + elapsed - snap)
            throw new InvalidOperationException("The exact transient was asked to go back in time.");
        while (period < k && Violation is null)
        {
            if (interval == 0 && elapsed == 0)
                JumpTowards(k);
            else
                StepWithin(timeline.PeriodSeconds);
        }
        if (period == k && Violation is null)
            StepWithin(phase);
        if (Violation is not null)
            return double.NaN;
        // The cursor may have rolled over to the next period's start; the value belongs to the interval ending at the phase.
        var endPattern = period == k ? pattern : previousPattern;
        var model = maps.ModelOf(endPattern[timeline.IntervalEndingAt(phase)]);
        LastDeviation = unknown == model.UnknownCount ? 0 : Dot(model.OutputRow(unknown), deviation);
        return model.Output(unknown, z);
    }

    /// <summary>Advances within the present period to a phase in (0, T]; reaching T moves to the next period's start.</summary>
    public void StepWithin(double phase)
    {
        var snap = timeline.SnapSeconds;
        while (true)
        {
            var start = timeline.Starts[interval];
            var duration = timeline.Durations[interval];
            var mask = pattern[interval];
            if (phase >= start + duration - snap)
            {
                Apply(elapsed == 0 ? maps.FullMap(mask, interval) : maps.PartialMap(mask, duration - elapsed), duration - elapsed);
                if (Violation is not null)
                    return;
                var last = interval == timeline.IntervalCount - 1;
                if (last)
                {
                    NewPeriod(period + 1);
                    interval = 0;
                }
                else
                    interval++;
                elapsed = 0;
                if (last || phase <= start + duration + snap)
                    return;
            }
            else
            {
                var h = phase - start - elapsed;
                if (h > snap)
                {
                    Apply(maps.PartialMap(mask, h), h);
                    elapsed += h;
                }
                return;
            }
        }
    }

    /// <summary>From a period start, towards period k: a run of equal periods in one matrix power, unless intervals must be checked.</summary>
    private void JumpTowards(long k)
    {
        var end = regular ? k : Math.Min(k, timeline.NextChange(period));
        var count = end - period;
        if (count < 2 || maps.HasChecks)
        {
            StepWithin(timeline.PeriodSeconds);
            return;
        }
        z = maps.PeriodMapOf(pattern).Advance(z, count);
        next = new double[z.Length];
        NewPeriod(end);
    }

    private void Apply(IntervalMap map, double seconds)
    {
        if (map.HasChecks)
        {
            var from = period * timeline.PeriodSeconds + timeline.Starts[interval] + elapsed;
            if (map.Check(z, deviation, from, seconds) is { } violation)
            {
                if (!StopOnViolation)
                    throw NotLinearException.Leaves(violation);
                Violation = violation;
                return;
            }
        }
        map.Apply(z, next);
        (z, next) = (next, z);
    }

    private int[] PatternOf(long k) => regular ? timeline.RegularPattern() : timeline.Pattern(k);
}
