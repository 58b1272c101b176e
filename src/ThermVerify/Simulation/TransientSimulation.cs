using ThermVerify.Circuits;
using ThermVerify.Limits;
using ThermVerify.Simulation.Mna;

namespace ThermVerify.Simulation;

/// <summary>
/// A transient run that can be advanced in pieces. Integration is trapezoidal (or Gear-2, see
/// <see cref="IntegrationMethod"/>), with backward-Euler steps after the start and after every breakpoint
/// (source corner, switch edge) so that the trapezoidal rule's undamped ringing is not excited (Nagel 1975,
/// from memory); if it rings anyway (a stiff circuit), <see cref="IntegrationMethod.Automatic"/> continues with
/// Gear-2, which damps stiff modes, and says so in the result's notes. The local truncation
/// error of every integrated state is estimated from divided differences of its values since the last
/// breakpoint (<see cref="StateHistory"/>). So that those never straddle a discontinuity, the first step
/// after a breakpoint is a tiny backward-Euler probe (10⁻⁹ of the time to the next stop, but at least four
/// times the time resolution at t; its own error far below any tolerance), the second a checked backward-Euler step, and trapezoidal steps follow.
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
    private readonly RingingDetector ringing;
    private readonly List<SolverNote> notes = [];
    private double[] accepted;
    private double[] older;
    private double[] slope;
    private double[] newSlope;
    private double proposedStep;
    private double collectedUntil;
    private int acceptedSteps;
    private int rejectedSteps;
    private bool gear;

    public TransientSimulation(Circuit circuit, TransientOptions options, TransientState? initialState = null)
    {
        options.Validate();
        this.options = options;
        TopologyCheck.Run(circuit, holdInitialConditions: options.UseInitialConditions, checkDcPaths: initialState is null);
        system = new BoundSystem(circuit);
        c = system.Context;
        warnings = new Warnings(system);
        history = new StateHistory(system.StateIsCurrent);
        ringing = new RingingDetector(history.StateCount);
        gear = options.Method == IntegrationMethod.Gear2;
        accepted = new double[system.Layout.VectorLength];
        older = new double[accepted.Length];
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
    public TransientResult Result => new(record, system, [.. warnings.Found], acceptedSteps, rejectedSteps) { Notes = [.. notes] };

    /// <summary>The method the run uses now: Gear-2 once <see cref="IntegrationMethod.Automatic"/> has switched.</summary>
    public IntegrationMethod MethodInUse => options.Method == IntegrationMethod.Automatic
        ? gear ? IntegrationMethod.Gear2 : IntegrationMethod.Trapezoidal
        : options.Method;

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
            // A linear circuit at a steady step never refactorises (where the LU checks): Ctrl+C and the time limit
            // must still stop it.
            Work.ThrowIfCancelled();
            var stop = stops.Next(timeSeconds);
            Step(FirstTry(stop - TimeSeconds, stop), stop);
        }
    }

    public TransientState CaptureState() => new()
    {
        TimeSeconds = TimeSeconds,
        Signature = Signature(system),
        Solution = (double[])accepted.Clone(),
        OlderSolution = (double[])older.Clone(),
        Slopes = (double[])slope.Clone(),
        UsesGear2 = gear,
        States = (double[])c.PreviousState.Clone(),
        HistoryTimes = (double[])history.Times.Clone(),
        HistoryValues = [.. history.Values.Select(v => (double[])v.Clone())],
        SinceBreak = history.SinceBreak,
        ProposedStepSeconds = proposedStep,
    };

    /// <summary>
    /// Continues the run from a solution of the same circuit at a later time, obtained elsewhere (exact propagation up
    /// to an interval its op-amp leaves its linear region on), as from a breakpoint: the integrated states are taken
    /// from <paramref name="solution"/>, their history starts anew and the next steps are the probe and backward Euler
    /// steps that follow any breakpoint, so nothing of the skipped stretch is needed. The hybrid transient then steps only
    /// the nonlinear stretch instead of everything since its last stepped one.
    /// </summary>
    /// <param name="solution">Every unknown at <paramref name="timeSeconds"/> (ground excluded or zero).</param>
    public void RestartAt(double timeSeconds, ReadOnlySpan<double> solution)
    {
        if (!(timeSeconds > TimeSeconds) || !double.IsFinite(timeSeconds))
            throw new ArgumentOutOfRangeException(nameof(timeSeconds), timeSeconds, $"A run restarts after its present time ({TimeSeconds:G9} s).");
        if (solution.Length < system.Size)
            throw new ArgumentException($"The solution has {solution.Length} values; the circuit has {system.Size} unknowns.", nameof(solution));
        solution[..system.Size].CopyTo(c.Solution);
        c.Solution[system.Size] = 0;
        // Derivatives stored as zero, as at the start of a run: the probe and backward-Euler steps after a breakpoint
        // use only the state values.
        c.Mode = AnalysisMode.Dc;
        c.TimeSeconds = timeSeconds;
        c.StepSeconds = 0;
        foreach (var s in system.Reactive)
            s.Accept(c);
        (c.State, c.PreviousState) = (c.PreviousState, c.State);
        Array.Copy(c.Solution, accepted, accepted.Length);
        Array.Copy(c.Solution, older, older.Length);
        Array.Clear(slope);
        TimeSeconds = timeSeconds;
        collectedUntil = Math.Max(collectedUntil, timeSeconds);
        stops.Reach(timeSeconds);
        ringing.Reset();
        history.Push(timeSeconds, c.PreviousState, isBreakpoint: true);
        record.StartAgain(timeSeconds, accepted, slope);
    }

    private double FirstTry(double span, double stop)
    {
        if (options.FixedStepSeconds is { } fixedStep)
            return fixedStep >= span - StopQueue.Epsilon(stop) ? span : fixedStep;
        if (history.SinceBreak == 1)
            // The floor only keeps the probe's end distinct from the breakpoint (the stop queue merges times closer than
            // Epsilon). A thousand times Epsilon, as before, made the probe 1 ps long at small t, a fortieth of a 43 ps
            // source ramp (differential seed 128).
            return Math.Min(span, Math.Max(ProbeFraction * Math.Min(span, maxStep),
                Math.Max(4 * StopQueue.Epsilon(TimeSeconds), options.MinStepSeconds)));
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
            var aid = DcSolver.Solve(system, $"{AnalysisName} initial point", null);
            if (aid != ConvergenceAid.None)
                notes.Add(new SolverNote($"{AnalysisName} initial point",
                    $"{AnalysisName} initial point: converged with {DcSweep.Describe(aid)}", aid, TimeSeconds: 0));
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
        record.Add(0, accepted, slope, StepFormula.BackwardEuler);
        warnings.Check(timeSeconds: 0);
    }

    private void Restore(TransientState s)
    {
        if (s.Signature != Signature(system))
            throw new CircuitException("The transient state was captured from a circuit with other nodes or elements; continue only the same circuit.");
        Array.Copy(s.Solution, accepted, accepted.Length);
        Array.Copy(s.OlderSolution, older, older.Length);
        Array.Copy(s.Solution, c.Solution, accepted.Length);
        Array.Copy(s.Slopes, slope, slope.Length);
        gear |= s.UsesGear2;
        Array.Copy(s.States, c.PreviousState, s.States.Length);
        history.CopyFrom(s.HistoryTimes, s.HistoryValues, s.SinceBreak);
        proposedStep = s.ProposedStepSeconds;
        TimeSeconds = s.TimeSeconds;
        record.Add(TimeSeconds, accepted, slope, StepFormula.BackwardEuler);
    }

    private static string Signature(BoundSystem system) =>
        string.Join("|", system.Layout.UnknownNames) + "#" + string.Join("|", system.Circuit.Elements.Select(e => e.GetHashCode()));

    /// <summary>Backward Euler for the first two steps after a breakpoint, then the run's order-2 formula.</summary>
    private StepFormula Formula() =>
        history.SinceBreak <= 2 || options.Method == IntegrationMethod.BackwardEuler ? StepFormula.BackwardEuler
        : gear ? StepFormula.Gear2 : StepFormula.Trapezoidal;

    private void Step(double h, double stop)
    {
        var probe = history.SinceBreak == 1 && options.FixedStepSeconds is null;
        var formula = Formula();
        var order = StepFormulas.Order(formula);
        var previousStep = TimeSeconds - history.Times[1];
        var retried = false;
        var lastTried = double.PositiveInfinity;
        while (true)
        {
            if (retried && h < options.MinStepSeconds)
                throw StepCollapsed();
            // Retries never end by themselves when each one fails: Ctrl+C and a time limit must reach them too.
            Work.ThrowIfCancelled();
            var tNew = Math.Abs(TimeSeconds + h - stop) <= StopQueue.Epsilon(stop) ? stop : TimeSeconds + h;
            h = tNew - TimeSeconds;
            // Far from t = 0 the time itself has a resolution (an ulp of 1 ms is 2e-19 s): a smaller step rounds back to
            // the one just rejected, and the retry would repeat forever above the minimum step. That is a collapse too.
            if (retried && h >= lastTried)
                throw StepCollapsed(h);
            lastTried = h;
            c.Mode = AnalysisMode.Transient;
            c.TimeSeconds = tNew;
            c.StepSeconds = h;
            StepFormulas.Apply(c, formula, h, previousStep);
            c.OlderStateValues = history.Values[1];
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
            var ratio = options.FixedStepSeconds is null && !probe ? history.ErrorRatio(tNew, h, formula, c.State, options) : 0;
            if (ratio > 1)
            {
                rejectedSteps++;
                retried = true;
                h *= Math.Max(1e-3, 0.9 * Math.Pow(ratio, -1.0 / (order + 1)));
                continue;
            }
            Commit(tNew, h, previousStep, formula, probe);
            if (!probe)
                proposedStep = options.FixedStepSeconds ?? h * (ratio > 0 ? Math.Min(2, 0.9 * Math.Pow(ratio, -1.0 / (order + 1))) : 2);
            return;
        }
    }

    /// <summary>
    /// The error for a step that fell below the minimum: an ill-conditioned matrix is named as the cause (with the
    /// nodes it loses digits on), otherwise the unknown changing fastest.
    /// </summary>
    private SimulationException StepCollapsed(double? resolutionSeconds = null)
    {
        var where = resolutionSeconds is { } r
            ? $" at t = {TimeSeconds:G9} s, where the step fell to the time's own resolution ({r:G3} s cannot be made smaller there)"
            : $" at t = {TimeSeconds:G9} s, where the step fell below {options.MinStepSeconds:G3} s";
        if (system.IsIllConditioned)
            return system.IllConditioned(AnalysisName, where);
        return new ConvergenceException(
            $"{AnalysisName}{where}. " +
            "Check for ideal steps into capacitors (give sources a rise time) or loosen the tolerances.",
            AnalysisName, null, TimeSeconds, FastestUnknown());
    }

    private bool Solve(out int worst)
    {
        try
        {
            return Newton.Solve(system, newton, out worst);
        }
        catch (SingularMatrixException) when (system.IsNonlinear)
        {
            worst = -1;
            return false;
        }
    }

    private void Commit(double tNew, double h, double previousStep, StepFormula formula, bool probe)
    {
        var x = c.Solution;
        for (var i = 0; i < system.Size; i++)
            newSlope[i] = StepFormulas.Slope(formula, x[i], accepted[i], older[i], slope[i], h, previousStep);
        (slope, newSlope) = (newSlope, slope);
        (older, accepted) = (accepted, older);
        Array.Copy(x, accepted, accepted.Length);
        if (formula == StepFormula.Trapezoidal && options.Method == IntegrationMethod.Automatic && ringing.Observe(c.State, history, options, h))
        {
            gear = true;
            notes.Add(new SolverNote(AnalysisName,
                $"{AnalysisName}: the trapezoidal rule rang on {system.StateOwners[ringing.RingingState]} at t = {tNew:G6} s " +
                "(a stiff circuit); continued with Gear-2 (BDF2)", TimeSeconds: tNew));
        }
        (c.State, c.PreviousState) = (c.PreviousState, c.State);
        TimeSeconds = tNew;
        var isBreakpoint = stops.Reach(tNew);
        if (isBreakpoint)
            ringing.Reset();
        history.Push(tNew, c.PreviousState, isBreakpoint);
        record.Add(tNew, accepted, slope, formula, probe);
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
