using ThermVerify.Circuits;
using ThermVerify.Simulation.Mna;

namespace ThermVerify.Simulation;

/// <summary>
/// A transient run that can be advanced in pieces. Integration is trapezoidal, with backward-Euler
/// steps after the start and after every breakpoint (source corner, switch edge) so that the
/// trapezoidal rule's undamped ringing is not excited (Nagel 1975, from memory). Each step's local
/// truncation error is estimated for every integrated state (capacitor voltage, inductor current) from
/// divided differences of its values since the last breakpoint: BE h²·x[t_n,t_n−1,t_n−2], trapezoidal
/// h³/2·x[t_n,…,t_n−3]. So that those differences never straddle a breakpoint, the first step after one
/// is a tiny backward-Euler probe (10⁻⁹ of the time to the next stop, its own error far below any
/// tolerance), the second a checked backward-Euler step, and trapezoidal steps follow. A step whose
/// error exceeds its tolerance is redone shorter; the next step is h·min(2, 0.9·(tol/err)^(1/(k+1))).
/// Breakpoints and requested output times are landed on exactly.
/// </summary>
public sealed class TransientSimulation
{
    public const string AnalysisName = "Transient";

    private const int HistoryLength = 4;

    /// <summary>Length of the probe step after a breakpoint, as a fraction of the time to the next stop.</summary>
    private const double ProbeFraction = 1e-9;

    private readonly BoundSystem system;
    private readonly LoadContext c;
    private readonly TransientOptions options;
    private readonly TransientRecord record;
    private readonly int stateCount;
    private readonly bool[] stateIsCurrent;
    private readonly double maxStep;
    private readonly bool checks;
    private readonly NewtonSettings newton = NewtonSettings.Default with { MaxIterations = 50 };
    private readonly double[] accepted;
    private double[] slope;
    private double[] newSlope;
    private readonly double[] historyTimes = new double[HistoryLength];
    private readonly double[][] historyValues;
    private readonly double[] ddTimes = new double[HistoryLength];
    private readonly double[] ddValues = new double[HistoryLength];
    private readonly List<double> breakpoints = [];
    private readonly List<double> outputs = [];
    private readonly List<SimulationWarning> warnings = [];
    private int sinceBreak;
    private double proposedStep;
    private double collectedUntil;
    private int acceptedSteps;
    private int rejectedSteps;

    public TransientSimulation(Circuit circuit, TransientOptions options, TransientState? initialState = null)
    {
        options.Validate();
        this.options = options;
        TopologyCheck.Run(circuit, holdInitialConditions: options.UseInitialConditions, checkDcPaths: initialState is null);
        system = new BoundSystem(circuit);
        c = system.Context;
        stateCount = system.StateIsCurrent.Length;
        stateIsCurrent = system.StateIsCurrent;
        checks = system.Stamps.Any(s => s.HasChecks);
        accepted = new double[system.Layout.VectorLength];
        slope = new double[accepted.Length];
        newSlope = new double[accepted.Length];
        historyValues = [.. Enumerable.Range(0, HistoryLength).Select(_ => new double[stateCount])];
        record = new TransientRecord(accepted.Length);
        if (initialState is null)
            Start();
        else
            Restore(initialState);
        collectedUntil = TimeSeconds;
        maxStep = options.MaxStepSeconds > 0 ? options.MaxStepSeconds : Math.Max(options.StopTimeSeconds - TimeSeconds, 0) / 50;
        if (!(maxStep > 0))
            throw new ArgumentException($"Transient stop time {options.StopTimeSeconds:G6} s is not after the start {TimeSeconds:G6} s.");
        foreach (var t in options.OutputTimesSeconds.Where(t => t > TimeSeconds).Order())
            outputs.Add(t);
    }

    /// <summary>Time of the last accepted point.</summary>
    public double TimeSeconds { get; private set; }

    /// <summary>Everything recorded so far, from the start of this simulation.</summary>
    public TransientResult Result => new(record, system, [.. warnings], acceptedSteps, rejectedSteps);

    /// <summary>Present voltage of a node.</summary>
    public double Voltage(string node) => accepted[system.Layout.IndexOfNode(node)];

    /// <summary>Runs until <paramref name="timeSeconds"/>, which becomes an exact solution point.</summary>
    public void AdvanceTo(double timeSeconds)
    {
        if (!double.IsFinite(timeSeconds))
            throw new ArgumentOutOfRangeException(nameof(timeSeconds), "The transient end time must be finite.");
        if (timeSeconds <= TimeSeconds + Epsilon(timeSeconds))
            return;
        CollectBreakpoints(timeSeconds);
        while (TimeSeconds < timeSeconds - Epsilon(timeSeconds))
        {
            var stop = NextStop(timeSeconds);
            var span = stop - TimeSeconds;
            double h;
            if (options.FixedStepSeconds is { } fixedStep)
                h = fixedStep >= span - Epsilon(stop) ? span : fixedStep;
            else if (sinceBreak == 1)
                h = Math.Min(span, Math.Max(ProbeFraction * Math.Min(span, maxStep), Math.Max(1e3 * Epsilon(TimeSeconds), options.MinStepSeconds)));
            else
            {
                h = Math.Min(proposedStep > 0 ? proposedStep : span * 1e-3, maxStep);
                if (h >= span - Epsilon(stop))
                    h = span;
                else if (2 * h > span)
                    h = span / 2;
            }
            Step(h, stop);
        }
    }

    public TransientState CaptureState() => new()
    {
        TimeSeconds = TimeSeconds,
        Signature = Signature(system),
        Solution = (double[])accepted.Clone(),
        Slopes = (double[])slope.Clone(),
        States = (double[])c.PreviousState.Clone(),
        HistoryTimes = (double[])historyTimes.Clone(),
        HistoryValues = [.. historyValues.Select(v => (double[])v.Clone())],
        SinceBreak = sinceBreak,
        ProposedStepSeconds = proposedStep,
    };

    private void Start()
    {
        c.Mode = AnalysisMode.Dc;
        c.HoldInitialConditions = options.UseInitialConditions;
        c.TimeSeconds = 0;
        c.StepSeconds = 0;
        try
        {
            DcSolver.Solve(system, $"{AnalysisName} initial point", null);
        }
        finally
        {
            c.HoldInitialConditions = false;
        }
        foreach (var s in system.Reactive)
            s.Accept(c);
        (c.State, c.PreviousState) = (c.PreviousState, c.State);
        Array.Copy(c.Solution, accepted, accepted.Length);
        TimeSeconds = 0;
        historyTimes[0] = 0;
        for (var i = 0; i < stateCount; i++)
            historyValues[0][i] = c.PreviousState[2 * i];
        sinceBreak = 1;
        proposedStep = options.InitialStepSeconds;
        record.Add(0, accepted, slope, true);
        if (checks)
            Warnings.Merge(warnings, Warnings.Collect(system).Select(w => w with { TimeSeconds = 0 }));
    }

    private void Restore(TransientState s)
    {
        if (s.Signature != Signature(system))
            throw new CircuitException("The transient state was captured from a circuit with other nodes or elements; continue only the same circuit.");
        Array.Copy(s.Solution, accepted, accepted.Length);
        Array.Copy(s.Solution, c.Solution, accepted.Length);
        Array.Copy(s.Slopes, slope, slope.Length);
        Array.Copy(s.States, c.PreviousState, s.States.Length);
        Array.Copy(s.HistoryTimes, historyTimes, HistoryLength);
        for (var j = 0; j < HistoryLength; j++)
            Array.Copy(s.HistoryValues[j], historyValues[j], stateCount);
        sinceBreak = s.SinceBreak;
        proposedStep = s.ProposedStepSeconds;
        TimeSeconds = s.TimeSeconds;
        record.Add(TimeSeconds, accepted, slope, true);
    }

    private static string Signature(BoundSystem system) =>
        string.Join("|", system.Layout.UnknownNames) + "#" + string.Join("|", system.Circuit.Elements.Select(e => e.GetHashCode()));

    private void Step(double h, double stop)
    {
        var probe = sinceBreak == 1 && options.FixedStepSeconds is null;
        var backwardEuler = sinceBreak <= 2 || options.Method == IntegrationMethod.BackwardEuler;
        var order = backwardEuler ? 1 : 2;
        var retried = false;
        while (true)
        {
            if (retried && h < options.MinStepSeconds)
                throw new ConvergenceException(
                    $"{AnalysisName} at t = {TimeSeconds:G9} s: the step fell below {options.MinStepSeconds:G3} s. " +
                    "Check for ideal steps into capacitors (give sources a rise time) or loosen the tolerances.",
                    AnalysisName, null, TimeSeconds, WorstUnknownName());
            var tNew = Math.Abs(TimeSeconds + h - stop) <= Epsilon(stop) ? stop : TimeSeconds + h;
            h = tNew - TimeSeconds;
            c.Mode = AnalysisMode.Transient;
            c.TimeSeconds = tNew;
            c.StepSeconds = h;
            c.Ag0 = order / h;
            c.Trapezoidal = !backwardEuler;
            Array.Copy(accepted, c.Solution, accepted.Length);
            if (!Solve(out var worst))
            {
                if (!system.IsNonlinear)
                    throw new ConvergenceException($"{AnalysisName} at t = {tNew:G9} s: the solution is not finite at '{Name(worst)}'.",
                        AnalysisName, null, tNew, Name(worst));
                rejectedSteps++;
                retried = true;
                h /= 8;
                continue;
            }
            foreach (var s in system.Reactive)
                s.Accept(c);
            var ratio = options.FixedStepSeconds is null && !probe ? TruncationRatio(tNew, h, order) : 0;
            if (ratio > 1)
            {
                rejectedSteps++;
                retried = true;
                h *= Math.Max(1e-3, 0.9 * Math.Pow(ratio, -1.0 / (order + 1)));
                continue;
            }
            Commit(tNew, h, backwardEuler);
            if (!probe)
                proposedStep = options.FixedStepSeconds ?? h * (ratio > 0 ? Math.Min(2, 0.9 * Math.Pow(ratio, -1.0 / (order + 1))) : 2);
            return;
        }
    }

    private bool Solve(out int worst)
    {
        try
        {
            return Newton.Iterate(system, newton, out worst);
        }
        catch (SingularMatrixException) when (system.IsNonlinear)
        {
            worst = -1;
            return false;
        }
    }

    private void Commit(double tNew, double h, bool backwardEuler)
    {
        var x = c.Solution;
        for (var i = 0; i < system.Size; i++)
            newSlope[i] = backwardEuler ? (x[i] - accepted[i]) / h : 2 * (x[i] - accepted[i]) / h - slope[i];
        (slope, newSlope) = (newSlope, slope);
        Array.Copy(x, accepted, accepted.Length);
        (c.State, c.PreviousState) = (c.PreviousState, c.State);

        var oldest = historyValues[HistoryLength - 1];
        for (var j = HistoryLength - 1; j > 0; j--)
        {
            historyValues[j] = historyValues[j - 1];
            historyTimes[j] = historyTimes[j - 1];
        }
        historyValues[0] = oldest;
        historyTimes[0] = tNew;
        for (var i = 0; i < stateCount; i++)
            oldest[i] = c.PreviousState[2 * i];

        TimeSeconds = tNew;
        record.Add(tNew, accepted, slope, backwardEuler);
        acceptedSteps++;

        var hitBreak = false;
        while (breakpoints.Count > 0 && breakpoints[0] <= tNew + Epsilon(tNew))
        {
            hitBreak = true;
            breakpoints.RemoveAt(0);
        }
        while (outputs.Count > 0 && outputs[0] <= tNew + Epsilon(tNew))
            outputs.RemoveAt(0);
        sinceBreak = hitBreak ? 1 : Math.Min(sinceBreak + 1, HistoryLength);
        if (checks)
            Warnings.Merge(warnings, Warnings.Collect(system).Select(w => w with { TimeSeconds = tNew }));
    }

    /// <summary>Largest ratio of estimated local truncation error to tolerance over all states.</summary>
    private double TruncationRatio(double tNew, double h, int order)
    {
        var worst = 0.0;
        var points = order + 2;
        if (sinceBreak < points - 1)
            return 0;
        for (var i = 0; i < stateCount; i++)
        {
            ddTimes[0] = tNew;
            ddValues[0] = c.State[2 * i];
            for (var j = 1; j < points; j++)
            {
                ddTimes[j] = historyTimes[j - 1];
                ddValues[j] = historyValues[j - 1][i];
            }
            for (var level = 1; level < points; level++)
                for (var j = 0; j < points - level; j++)
                    ddValues[j] = (ddValues[j] - ddValues[j + 1]) / (ddTimes[j] - ddTimes[j + level]);
            var lte = order == 1 ? h * h * ddValues[0] : h * h * h * ddValues[0] / 2;
            var x0 = c.State[2 * i];
            var x1 = historyValues[0][i];
            var tol = options.TruncationErrorFactor * (options.RelativeTolerance * Math.Max(Math.Abs(x0), Math.Abs(x1))
                + (stateIsCurrent[i] ? options.CurrentToleranceAmperes : options.VoltageToleranceVolts));
            worst = Math.Max(worst, Math.Abs(lte) / tol);
        }
        return worst;
    }

    private void CollectBreakpoints(double until)
    {
        if (until <= collectedUntil)
            return;
        var found = new List<double>();
        foreach (var s in system.Stamps)
            s.CollectBreakpoints(collectedUntil, until, found);
        foreach (var t in found)
            if (t > TimeSeconds + Epsilon(t) && !breakpoints.Any(b => Math.Abs(b - t) <= Epsilon(t)))
                breakpoints.Add(t);
        breakpoints.Sort();
        collectedUntil = until;
    }

    private double NextStop(double target)
    {
        var stop = target;
        if (breakpoints.Count > 0 && breakpoints[0] < stop)
            stop = breakpoints[0];
        if (outputs.Count > 0 && outputs[0] < stop)
            stop = outputs[0];
        return stop;
    }

    private static double Epsilon(double t) => 1e-15 + 1e-13 * Math.Abs(t);

    private string Name(int unknown) => unknown >= 0 ? system.Layout.UnknownNames[unknown] : "(unknown)";

    private string WorstUnknownName()
    {
        var worst = -1;
        var largest = -1.0;
        for (var i = 0; i < system.Size; i++)
            if (Math.Abs(slope[i]) > largest)
            {
                largest = Math.Abs(slope[i]);
                worst = i;
            }
        return Name(worst);
    }
}
