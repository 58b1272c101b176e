using System.Diagnostics.CodeAnalysis;
using ThermVerify.Circuits;
using ThermVerify.Simulation.Mna;

namespace ThermVerify.Simulation.Switched;

/// <summary>
/// Exact transient of a linear switched circuit: between switch edges the circuit is linear and time-invariant, so
/// the state after an interval h is e^(Ah)·z + ∫₀ʰ e^(As) ds·u (<see cref="IntervalMap"/>), with no time step and no
/// truncation error; rounding is the only error. All timed switches must follow <see cref="PeriodicSchedule"/>s of one
/// period, sources must be DC, and the only nonlinear element allowed is the op-amp macro-model, linearised in its
/// linear region and checked on every interval (<see cref="NotLinearException"/> says where it leaves it, so that the
/// caller can use <see cref="TransientSimulation"/> there).
/// <para>
/// The run starts from the operating point at t = 0 (the engine's DC solver, switches as the schedules have them
/// at 0), as <see cref="TransientSimulation"/> does. One period's map z_{k+1} = Φ·z_k + c is composed once and reused;
/// runs of equal periods are jumped with a matrix power; the periodic steady state is one solve of (I − Φ)·z = c.
/// A value at a switch edge is the limit from before the edge, as the time-stepping engine reports it.
/// </para>
/// Objects keep caches and are not thread-safe; make one per thread. Circuit temperature: the circuit's own
/// (<c>circuit with { TemperatureCelsius = t }</c>).
/// </summary>
internal sealed class ExactSwitchedTransient
{
    public const string AnalysisName = "Exact switched transient";

    private readonly BoundSystem system;
    private readonly LinearAssembly assembly;
    private readonly StateCoordinates coordinates;
    private readonly PeriodicTimeline timeline;
    private readonly double[] initialSolution;
    private readonly double[] initialState;
    private readonly SwitchedMaps maps;
    private double[]? steadyState;
    private double[]? steadyDeviation;

    private ExactSwitchedTransient(Circuit circuit, ExactSwitchedOptions options)
    {
        options.Validate();
        TopologyCheck.Run(circuit);
        system = new BoundSystem(circuit);
        assembly = new LinearAssembly(system, options.LinearityToleranceVolts);
        timeline = new PeriodicTimeline(assembly.Switches);
        coordinates = new StateCoordinates(assembly.Reactive(), system.Size);
        maps = new SwitchedMaps(assembly, coordinates, timeline);

        // The engine's own operating point at t = 0, started from the linear model's DC solution so that an op-amp
        // circuit needs one or two Newton iterations instead of a search from zero.
        var seed = assembly.LinearDcSolution(timeline.MaskAt(0));
        var c = system.Context;
        c.Mode = AnalysisMode.Dc;
        c.TimeSeconds = 0;
        c.StepSeconds = 0;
        if (seed is not null)
            Array.Copy(seed, c.Solution, seed.Length);
        DcSolver.Solve(system, $"{AnalysisName} initial point", null);
        initialSolution = c.Solution[..system.Size];
        initialState = coordinates.StateOf(initialSolution);

        // Reduce the configurations of the first and of a regular period now, so that a circuit exact propagation
        // cannot handle is refused here rather than at the first read.
        foreach (var mask in timeline.Pattern(0).Concat(timeline.RegularPattern()).Distinct())
            maps.ModelOf(mask);
    }

    /// <exception cref="NotLinearException">The circuit is outside what exact propagation handles (the message says why).</exception>
    /// <exception cref="TopologyException">The connections make the circuit unsolvable.</exception>
    /// <exception cref="SimulationException">The operating point at t = 0 failed.</exception>
    public static ExactSwitchedTransient Start(Circuit circuit, ExactSwitchedOptions? options = null) =>
        new(circuit, options ?? new ExactSwitchedOptions());

    /// <summary>As <see cref="Start"/>, but a circuit exact propagation cannot handle gives false and the reason.</summary>
    public static bool TryStart(Circuit circuit, [NotNullWhen(true)] out ExactSwitchedTransient? run,
        [NotNullWhen(false)] out NotLinearException? reason, ExactSwitchedOptions? options = null)
    {
        try
        {
            run = Start(circuit, options);
            reason = null;
            return true;
        }
        catch (NotLinearException e)
        {
            run = null;
            reason = e;
            return false;
        }
    }

    public double PeriodSeconds => timeline.PeriodSeconds;

    /// <summary>The number of independent energy stores (the length of the state vector).</summary>
    public int StateCount => coordinates.StateCount;

    /// <summary>The node's voltage at each time (rising, from 0: the operating point), from the start of the run.</summary>
    /// <exception cref="NotLinearException">An op-amp leaves its linear region before the last time.</exception>
    public double[] VoltagesAt(IReadOnlyList<double> timesSeconds, string node) => ReadAll(timesSeconds, node).Volts;

    /// <summary>
    /// As <see cref="VoltagesAt"/>, with the slew residuals' first-order deviation at each time (see
    /// <see cref="TimelineCursor.LastDeviation"/>): what the linear model's values leave out of the macro-model's.
    /// </summary>
    public (double[] Volts, double[] Deviations) VoltagesAndDeviationsAt(IReadOnlyList<double> timesSeconds, string node) =>
        ReadAll(timesSeconds, node);

    private (double[] Volts, double[] Deviations) ReadAll(IReadOnlyList<double> timesSeconds, string node)
    {
        var unknown = UnknownOf(node);
        var cursor = Cursor();
        var result = new double[timesSeconds.Count];
        var deviations = new double[timesSeconds.Count];
        var previous = 0.0;
        for (var i = 0; i < result.Length; i++)
        {
            var t = timesSeconds[i];
            if (!double.IsFinite(t) || t < previous)
                throw new ArgumentException($"Read times must be finite, not negative and not falling; time #{i + 1} is {t:G9} s after {previous:G9} s.", nameof(timesSeconds));
            previous = t;
            if (t <= timeline.SnapSeconds)
            {
                result[i] = unknown == system.Layout.Ground ? 0 : initialSolution[unknown];
                continue;
            }
            var (period, phase) = PeriodAndPhase(t);
            result[i] = cursor.ReadAt(period, phase, unknown);
            deviations[i] = cursor.LastDeviation;
        }
        return (result, deviations);
    }

    /// <summary>
    /// The node's voltage when <paramref name="samplingSwitch"/> opens for the (<paramref name="conversion"/> + 1)-th
    /// time: conversion k of an ADC whose sampling capacitor is read as its switch opens. Runs of equal periods are
    /// jumped with a matrix power (stepped one by one, with every interval checked, when an op-amp is present).
    /// </summary>
    public double SampleVoltage(string samplingSwitch, long conversion, string node)
    {
        var unknown = UnknownOf(node);
        var (period, phase) = Opening(samplingSwitch, conversion);
        return Cursor().ReadAt(period, phase, unknown);
    }

    /// <summary>Conversions 0 … count − 1 (see <see cref="SampleVoltage"/>), one period map application each.</summary>
    public double[] SampleVoltages(string samplingSwitch, int count, string node)
    {
        ArgumentOutOfRangeException.ThrowIfNegative(count);
        var unknown = UnknownOf(node);
        var cursor = Cursor();
        var result = new double[count];
        if (count == 0)
            return result;
        var (first, phase) = Opening(samplingSwitch, count - 1);
        first -= count - 1;
        for (var k = 0; k < count; k++)
            result[k] = cursor.ReadAt(first + k, phase, unknown);
        return result;
    }

    /// <summary>
    /// The node's voltage when <paramref name="samplingSwitch"/> opens in the periodic steady state: every schedule
    /// running for ever (counts ignored), after all transients have died out. One solve of (I − Φ)·z = c.
    /// A <see cref="LinearityViolation"/> raised here gives times from the start of a steady-state period.
    /// </summary>
    public double SteadyStateSampleVoltage(string samplingSwitch, string node)
    {
        var unknown = UnknownOf(node);
        var (_, phase) = Opening(samplingSwitch, 0);
        return SteadyStateCursor().ReadAt(0, phase, unknown);
    }

    /// <summary>The node's voltage at a phase in (0, T] of a period of the periodic steady state (see <see cref="SteadyStateSampleVoltage"/>).</summary>
    public double SteadyStateVoltage(double phaseSeconds, string node)
    {
        if (!(phaseSeconds > 0 && phaseSeconds <= PeriodSeconds))
            throw new ArgumentOutOfRangeException(nameof(phaseSeconds), $"The phase {phaseSeconds:G9} s must lie in (0, {PeriodSeconds:G9}] s.");
        return SteadyStateCursor().ReadAt(0, phaseSeconds, UnknownOf(node));
    }

    /// <summary>
    /// The node read as <paramref name="samplingSwitch"/> opens, conversion after conversion, as a linear recurrence
    /// (<see cref="LinearSampleSequence"/>): the conversions in periods whose pattern may still change read one by one,
    /// then the state at the start of the first period from which every period is alike, that period's map and the
    /// read as an affine function of the period's starting state (the intervals up to the opening composed). False
    /// where intervals must be checked (an op-amp's linear region holds only period by period) and for a switch that
    /// stops (its reads end).
    /// </summary>
    public bool TryLinearSamples(string samplingSwitch, string node, [NotNullWhen(true)] out LinearSampleSequence? sequence)
    {
        sequence = null;
        var unknown = UnknownOf(node);
        var sw = assembly.Switches.FirstOrDefault(s => s.Name == samplingSwitch);
        if (maps.HasChecks || sw is null || ((PeriodicSchedule)sw.Schedule).Count is not null)
            return false;
        var (first, phase) = Opening(samplingSwitch, 0);
        var regular = first;
        for (var change = timeline.NextChange(regular); change != long.MaxValue; change = timeline.NextChange(regular))
            regular = change;
        var early = new double[regular - first];
        var cursor = Cursor();
        for (var n = 0; n < early.Length; n++)
            early[n] = cursor.ReadAt(first + n, phase, unknown);

        // The state at the start of the first regular period: every interval map of the periods before it, as the cursor applies them.
        var r = coordinates.StateCount;
        var z = (double[])initialState.Clone();
        var next = new double[r];
        for (long k = 0; k < regular; k++)
        {
            var pattern = timeline.Pattern(k);
            for (var i = 0; i < timeline.IntervalCount; i++)
            {
                maps.FullMap(pattern[i], i).Apply(z, next);
                (z, next) = (next, z);
            }
        }

        // The read: the intervals from the period's start to the opening (the last one partly, as the cursor steps it), then the output.
        var regularPattern = timeline.Pattern(regular);
        var psi = new double[r * r];
        var g = new double[r];
        for (var i = 0; i < r; i++) psi[i * r + i] = 1;
        var snap = timeline.SnapSeconds;
        var last = timeline.IntervalEndingAt(phase);
        for (var i = 0; i <= last; i++)
        {
            var (start, duration) = (timeline.Starts[i], timeline.Durations[i]);
            if (i == last && phase < start + duration - snap && phase - start <= snap)
                break;
            var map = i == last && phase < start + duration - snap
                ? maps.PartialMap(regularPattern[i], phase - start)
                : maps.FullMap(regularPattern[i], i);
            (psi, g) = Compose(map, psi, g, r);
        }
        var (output, constant) = maps.ModelOf(regularPattern[last]).OutputAffine(unknown);
        var row = new double[r];
        for (var k = 0; k < r; k++)
        {
            constant += output[k] * g[k];
            for (var i = 0; i < r; i++)
                row[k] += output[i] * psi[i * r + k];
        }

        var periodMap = maps.PeriodMapOf(regularPattern);
        sequence = new LinearSampleSequence(early, r, periodMap.Phi.ToRowMajorArray(), periodMap.Offset.ToArray(), z, row, constant);
        return true;
    }

    /// <summary>The affine map (Ψ, g) followed by an interval's: (Φ·Ψ, Φ·g + γ).</summary>
    private static (double[] Psi, double[] G) Compose(IntervalMap map, double[] psi, double[] g, int r)
    {
        var phi = map.Phi;
        var gamma = map.Gamma;
        var composed = new double[r * r];
        var offset = new double[r];
        for (var i = 0; i < r; i++)
        {
            var sum = gamma[i];
            for (var k = 0; k < r; k++)
            {
                sum += phi[i * r + k] * g[k];
                var v = 0.0;
                for (var j = 0; j < r; j++) v += phi[i * r + j] * psi[j * r + k];
                composed[i * r + k] = v;
            }
            offset[i] = sum;
        }
        return (composed, offset);
    }

    /// <summary>
    /// A reader of node voltages at rising times, one cursor for the whole run: what a caller that reads sample after
    /// sample needs (<see cref="VoltagesAt"/> starts from t = 0 on every call).
    /// </summary>
    public Func<double, string, double> Reader() => Throwing(TryReader());

    /// <summary>
    /// As <see cref="Reader"/>, but where an op-amp leaves its linear region the read gives the violation instead of
    /// raising <see cref="NotLinearException"/> (and the reader can go no further).
    /// </summary>
    public Func<double, string, (double Volts, LinearityViolation? Violation)> TryReader() => Follow().Read;

    /// <summary>As <see cref="TryReader"/>, with the solution where the run stopped (see <see cref="ExactReader"/>).</summary>
    public ExactReader Follow()
    {
        var cursor = Cursor(stopOnViolation: true);
        return new ExactReader(cursor, (t, node) =>
        {
            var unknown = UnknownOf(node);
            if (!double.IsFinite(t) || t < 0)
                throw new ArgumentOutOfRangeException(nameof(t), t, "Read times must be finite and not negative.");
            if (t <= timeline.SnapSeconds)
                return unknown == system.Layout.Ground ? 0 : initialSolution[unknown];
            var (period, phase) = PeriodAndPhase(t);
            return cursor.ReadAt(period, phase, unknown);
        });
    }

    private static Func<double, string, double> Throwing(Func<double, string, (double Volts, LinearityViolation? Violation)> read) =>
        (t, node) =>
        {
            var (volts, violation) = read(t, node);
            return violation is null ? volts : throw NotLinearException.Leaves(violation);
        };

    /// <summary>
    /// A reader as <see cref="Reader"/>, continuing from another engine's solution at <paramref name="startSeconds"/>:
    /// where the time-stepping engine has carried the run across a stretch in which an op-amp left its linear region,
    /// exact propagation takes over again (and raises <see cref="NotLinearException"/> again where the op-amp leaves it
    /// anew). Only the integrated states of <paramref name="solution"/> are taken (capacitor voltages, inductor
    /// currents): the rest follows from them in each configuration.
    /// </summary>
    /// <param name="solution">The full solution vector of the same circuit at that time, as the time-stepping engine holds it.</param>
    public Func<double, string, double> ReaderFrom(double startSeconds, double[] solution) => Throwing(TryReaderFrom(startSeconds, solution));

    /// <summary>As <see cref="ReaderFrom"/>, giving a violation instead of raising it (see <see cref="TryReader"/>).</summary>
    public Func<double, string, (double Volts, LinearityViolation? Violation)> TryReaderFrom(double startSeconds, double[] solution) =>
        FollowFrom(startSeconds, solution).Read;

    /// <summary>As <see cref="TryReaderFrom"/>, with the solution where the run stopped (see <see cref="ExactReader"/>).</summary>
    public ExactReader FollowFrom(double startSeconds, double[] solution)
    {
        if (!(startSeconds > 0 && double.IsFinite(startSeconds)))
            throw new ArgumentOutOfRangeException(nameof(startSeconds), startSeconds, "A continued run starts at a positive, finite time.");
        if (solution.Length < system.Size)
            throw new ArgumentException($"The solution has {solution.Length} values; the circuit has {system.Size} unknowns.", nameof(solution));
        // The position: the interval the start lies in (one starting within the snap of it counts as started), and
        // how far into it; an instant within the snap of the period's end is the next period's start.
        var period = (long)Math.Floor(startSeconds / PeriodSeconds);
        var phase = startSeconds - period * PeriodSeconds;
        if (phase >= PeriodSeconds - timeline.SnapSeconds)
            (period, phase) = (period + 1, 0);
        var interval = timeline.IntervalEndingAt(phase + 2 * timeline.SnapSeconds);
        var elapsed = Math.Max(0, phase - timeline.Starts[interval]);
        if (elapsed <= timeline.SnapSeconds)
            elapsed = 0;
        var cursor = new TimelineCursor(maps, timeline, coordinates.StateOf(solution), regular: false, period, interval, elapsed) { StopOnViolation = true };
        return new ExactReader(cursor, (t, node) =>
        {
            if (!double.IsFinite(t) || t <= startSeconds)
                throw new ArgumentOutOfRangeException(nameof(t), t, $"Read times must be finite and after the start of the continued run ({startSeconds:G9} s).");
            var (k, p) = PeriodAndPhase(t);
            return cursor.ReadAt(k, p, UnknownOf(node));
        });
    }

    private TimelineCursor SteadyStateCursor()
    {
        if (steadyState is null)
        {
            var periodMap = maps.PeriodMapOf(timeline.RegularPattern());
            var fixedPoint = periodMap.FixedPoint();
            if (maps.HasChecks)
            {
                // A period from the fixed point with nothing carried in gives the deviation a period adds; in the steady
                // state the deviation is periodic too, (I − Φ)·d = that, and the period is checked again from there.
                var once = new TimelineCursor(maps, timeline, fixedPoint, regular: true);
                once.StepWithin(timeline.PeriodSeconds);
                steadyDeviation = periodMap.Periodic(once.Deviation);
                new TimelineCursor(maps, timeline, fixedPoint, regular: true, deviation: steadyDeviation).StepWithin(timeline.PeriodSeconds);
            }
            steadyState = fixedPoint;
        }
        return new TimelineCursor(maps, timeline, steadyState, regular: true, deviation: steadyDeviation);
    }

    private TimelineCursor Cursor(bool stopOnViolation = false) =>
        new(maps, timeline, initialState, regular: false) { StopOnViolation = stopOnViolation };

    private int UnknownOf(string node) => system.Layout.IndexOfNode(node);

    /// <summary>t as (period, phase in (0, T]); an instant on a period boundary is the end of the period before it.</summary>
    private (long Period, double Phase) PeriodAndPhase(double t)
    {
        var period = (long)Math.Floor(t / PeriodSeconds);
        var phase = t - period * PeriodSeconds;
        if (phase <= timeline.SnapSeconds)
            return (period - 1, PeriodSeconds);
        return (period, Math.Min(phase, PeriodSeconds));
    }

    private (long Period, double Phase) Opening(string switchName, long conversion)
    {
        ArgumentOutOfRangeException.ThrowIfNegative(conversion);
        var sw = assembly.Switches.FirstOrDefault(s => s.Name == switchName)
            ?? throw new CircuitException($"The circuit has no timed switch named '{switchName}'. Timed switches: {string.Join(", ", assembly.Switches.Select(s => s.Name))}.");
        var schedule = (PeriodicSchedule)sw.Schedule;
        if (schedule.Count is { } n && conversion >= n)
            throw new ArgumentOutOfRangeException(nameof(conversion), $"Switch '{switchName}' opens {n} times; conversion {conversion} (from 0) does not happen.");
        var (period, phase) = PeriodAndPhase(schedule.DelaySeconds + schedule.ClosedSeconds);
        return (period + conversion, phase);
    }
}
