using ThermVerify.Circuits;
using ThermVerify.Simulation.Mna;

namespace ThermVerify.Simulation;

/// <summary>
/// A transient run that can be advanced in pieces. Integration is trapezoidal, with backward-Euler
/// steps after the start and after every breakpoint (source corner, switch edge) so that the
/// trapezoidal rule's undamped ringing is not excited (Nagel 1975, from memory). The local truncation
/// error of every integrated state is estimated from divided differences of its values since the last
/// breakpoint (<see cref="StateHistory"/>). So that those never straddle a discontinuity, the first step
/// after a breakpoint is a tiny backward-Euler probe (10⁻⁹ of the time to the next stop, its own error
/// far below any tolerance), the second a checked backward-Euler step, and trapezoidal steps follow.
/// A step whose error exceeds its tolerance is redone shorter; the next step is
/// h·min(2, 0.9·(tol/err)^(1/(k+1))). Breakpoints and requested output times are landed on exactly.
/// </summary>
internal sealed class TransientSimulation
{
    public const string AnalysisName = "Transient";

    /// <summary>Length of the probe step after a breakpoint, as a fraction of the time to the next stop.</summary>
    private const double ProbeFraction = 1e-9;

    private readonly BoundSystem system;
    private readonly LoadContext c;
    private readonly TransientOptions options;
    private readonly TransientRecord record;
    private readonly StateHistory history;
    private readonly StopQueue stops = new();
    private readonly Warnings warnings;
    private readonly double maxStep;
    private readonly NewtonSettings newton = NewtonSettings.Default with { MaxIterations = 50 };
    private readonly double[] accepted;
    private double[] slope;
    private double[] newSlope;
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
        warnings = new Warnings(system);
        history = new StateHistory(system.StateIsCurrent);
        accepted = new double[system.Layout.VectorLength];
        slope = new double[accepted.Length];
        newSlope = new double[accepted.Length];
        record = new TransientRecord(accepted.Length);
        if (initialState is null)
            Start();
        else
            Restore(initialState);
        collectedUntil = TimeSeconds;
        maxStep = options.MaxStepSeconds > 0 ? options.MaxStepSeconds : Math.Max(options.StopTimeSeconds - TimeSeconds, 0) / 50;
        if (!(maxStep > 0))
            throw new ArgumentException($"Transient stop time {options.StopTimeSeconds:G6} s is not after the start {TimeSeconds:G6} s.");
        stops.AddOutputs(options.OutputTimesSeconds, TimeSeconds);
    }

    /// <summary>Time of the last accepted point.</summary>
    public double TimeSeconds { get; private set; }

    /// <summary>Everything recorded so far (since the start or the last <see cref="ForgetRecordedPoints"/>).</summary>
    public TransientResult Result => new(record, system, [.. warnings.Found], acceptedSteps, rejectedSteps);

    /// <summary>Present voltage of a node.</summary>
    public double Voltage(string node) => accepted[system.Layout.IndexOfNode(node)];

    /// <summary>Drops the recorded waveform except the present point, for long runs advanced in chunks.</summary>
    public void ForgetRecordedPoints() => record.KeepLast();

    /// <summary>Runs until <paramref name="timeSeconds"/>, which becomes an exact solution point.</summary>
    public void AdvanceTo(double timeSeconds)
    {
        if (!double.IsFinite(timeSeconds))
            throw new ArgumentOutOfRangeException(nameof(timeSeconds), "The transient end time must be finite.");
        if (timeSeconds <= TimeSeconds + StopQueue.Epsilon(timeSeconds))
            return;
        CollectBreakpoints(timeSeconds);
        while (TimeSeconds < timeSeconds - StopQueue.Epsilon(timeSeconds))
        {
            var stop = stops.Next(timeSeconds);
            Step(FirstTry(stop - TimeSeconds, stop), stop);
        }
    }

    public TransientState CaptureState() => new()
    {
        TimeSeconds = TimeSeconds,
        Signature = Signature(system),
        Solution = (double[])accepted.Clone(),
        Slopes = (double[])slope.Clone(),
        States = (double[])c.PreviousState.Clone(),
        HistoryTimes = (double[])history.Times.Clone(),
        HistoryValues = [.. history.Values.Select(v => (double[])v.Clone())],
        SinceBreak = history.SinceBreak,
        ProposedStepSeconds = proposedStep,
    };

    private double FirstTry(double span, double stop)
    {
        if (options.FixedStepSeconds is { } fixedStep)
            return fixedStep >= span - StopQueue.Epsilon(stop) ? span : fixedStep;
        if (history.SinceBreak == 1)
            return Math.Min(span, Math.Max(ProbeFraction * Math.Min(span, maxStep),
                Math.Max(1e3 * StopQueue.Epsilon(TimeSeconds), options.MinStepSeconds)));
        var h = Math.Min(proposedStep > 0 ? proposedStep : span * 1e-3, maxStep);
        if (h >= span - StopQueue.Epsilon(stop))
            return span;
        return 2 * h > span ? span / 2 : h;
    }

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
        history.Push(0, c.PreviousState, isBreakpoint: true);
        proposedStep = options.InitialStepSeconds;
        record.Add(0, accepted, slope, true);
        warnings.Check(timeSeconds: 0);
    }

    private void Restore(TransientState s)
    {
        if (s.Signature != Signature(system))
            throw new CircuitException("The transient state was captured from a circuit with other nodes or elements; continue only the same circuit.");
        Array.Copy(s.Solution, accepted, accepted.Length);
        Array.Copy(s.Solution, c.Solution, accepted.Length);
        Array.Copy(s.Slopes, slope, slope.Length);
        Array.Copy(s.States, c.PreviousState, s.States.Length);
        history.CopyFrom(s.HistoryTimes, s.HistoryValues, s.SinceBreak);
        proposedStep = s.ProposedStepSeconds;
        TimeSeconds = s.TimeSeconds;
        record.Add(TimeSeconds, accepted, slope, true);
    }

    private static string Signature(BoundSystem system) =>
        string.Join("|", system.Layout.UnknownNames) + "#" + string.Join("|", system.Circuit.Elements.Select(e => e.GetHashCode()));

    private void Step(double h, double stop)
    {
        var probe = history.SinceBreak == 1 && options.FixedStepSeconds is null;
        var backwardEuler = history.SinceBreak <= 2 || options.Method == IntegrationMethod.BackwardEuler;
        var order = backwardEuler ? 1 : 2;
        var retried = false;
        while (true)
        {
            if (retried && h < options.MinStepSeconds)
                throw new ConvergenceException(
                    $"{AnalysisName} at t = {TimeSeconds:G9} s: the step fell below {options.MinStepSeconds:G3} s. " +
                    "Check for ideal steps into capacitors (give sources a rise time) or loosen the tolerances.",
                    AnalysisName, null, TimeSeconds, FastestUnknown());
            var tNew = Math.Abs(TimeSeconds + h - stop) <= StopQueue.Epsilon(stop) ? stop : TimeSeconds + h;
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
            var ratio = options.FixedStepSeconds is null && !probe ? history.ErrorRatio(tNew, h, order, c.State, options) : 0;
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
        TimeSeconds = tNew;
        history.Push(tNew, c.PreviousState, isBreakpoint: stops.Reach(tNew));
        record.Add(tNew, accepted, slope, backwardEuler);
        acceptedSteps++;
        warnings.Check(timeSeconds: tNew);
    }

    private void CollectBreakpoints(double until)
    {
        if (until <= collectedUntil)
            return;
        var found = new List<double>();
        foreach (var s in system.Stamps)
            s.CollectBreakpoints(collectedUntil, until, found);
        stops.AddBreakpoints(found, TimeSeconds);
        collectedUntil = until;
    }

    private string Name(int unknown) => unknown >= 0 ? system.Layout.UnknownNames[unknown] : "(unknown)";

    /// <summary>The unknown changing fastest at the last accepted point: where a failing step is stuck.</summary>
    private string FastestUnknown()
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
