using ThermVerify.Circuits;
using ThermVerify.Simulation.Mna;

namespace ThermVerify.Simulation;

/// <summary>
/// Accepted time points of a transient and every unknown at them. Between points, <see cref="VoltageAt"/>
/// interpolates with the integration's own order: the value after the step inside the tiny probe step that follows a
/// breakpoint (where a switch edge makes nodes jump), a straight line across a backward-Euler step, and across a
/// trapezoidal or Gear-2 step the quadratic through its two ends and the point before (Gear-2's own polynomial).
/// The trapezoidal rule's own derivatives are not used there: on a node whose slope jumps without a breakpoint
/// (an op-amp entering its clamp, a diode turning on) they ring from step to step, ±the jump, for ever, and a
/// quadratic built on them strays by h·|jump|/4 between points.
/// </summary>
internal sealed class TransientResult
{
    private readonly double[] times;
    private readonly double[] values;
    private readonly double[] slopes;
    private readonly StepFormula[] formulas;
    private readonly bool[] probes;
    private readonly int width;
    private readonly MnaLayout layout;
    private readonly BoundSystem system;

    internal TransientResult(TransientRecord record, BoundSystem system, IReadOnlyList<SimulationWarning> warnings,
        int acceptedSteps, int rejectedSteps)
    {
        (times, values, slopes, formulas, probes, width) = (record.Times, record.Values, record.Slopes, record.Formulas, record.Probes, record.Width);
        record.HandOut();
        layout = system.Layout;
        this.system = system;
        Count = record.Count;
        Warnings = warnings;
        AcceptedSteps = acceptedSteps;
        RejectedSteps = rejectedSteps;
    }

    /// <summary>Number of time points, the start included.</summary>
    public int Count { get; }

    public int AcceptedSteps { get; }

    public int RejectedSteps { get; }

    public IReadOnlyList<SimulationWarning> Warnings { get; }

    /// <summary>What the solver had to do beyond its plain course: the initial point's convergence aid, a switch to Gear-2.</summary>
    public IReadOnlyList<SolverNote> Notes { get; init; } = [];

    /// <summary>The time points (a copy made once per result).</summary>
    public double[] TimesSeconds => field ??= times.AsSpan(0, Count).ToArray();

    public double StartTimeSeconds => times[0];

    public double EndTimeSeconds => times[Count - 1];

    /// <summary>Voltage of <paramref name="node"/> at every time point.</summary>
    public double[] Voltage(string node) => Column(layout.IndexOfNode(node));

    /// <summary>Branch current of a source, inductor or VCVS (flowing Positive → Negative inside) at every point.</summary>
    public double[] Current(string elementName)
    {
        var e = system.ElementIndex(elementName);
        var element = system.Circuit.Elements[e];
        if (element.ExtraUnknowns.Count == 0 || !element.ExtraUnknowns[0].IsCurrent)
            throw new CircuitException($"{element.Describe} has no branch current in a transient; read the voltages across it instead.");
        return Column(layout.ExtraStart[e]);
    }

    public double FinalVoltage(string node) => values[(Count - 1) * width + layout.IndexOfNode(node)];

    /// <summary>Voltage of <paramref name="node"/> at any time inside the run (see the class summary).</summary>
    public double VoltageAt(string node, double timeSeconds)
    {
        var index = layout.IndexOfNode(node);
        if (timeSeconds < times[0] || timeSeconds > times[Count - 1])
            throw new ArgumentOutOfRangeException(nameof(timeSeconds),
                $"Time {timeSeconds:G6} s is outside the run ({times[0]:G6} s to {times[Count - 1]:G6} s).");
        var j = Array.BinarySearch(times, 0, Count, timeSeconds);
        if (j >= 0)
            return values[j * width + index];
        j = ~j;
        var w = width;
        var t0 = times[j - 1];
        var h = times[j] - t0;
        var s = timeSeconds - t0;
        var x0 = values[(j - 1) * w + index];
        var x1 = values[j * w + index];
        // Right after a switch edge the solution jumps (every node without a capacitor moves at once), and the point at
        // the breakpoint holds the value before it: inside the probe step (10⁻⁹ of the span) the value after it is the
        // right one. After a source's corner nothing jumps, and the probe interpolates like any backward-Euler step.
        if (probes[j] && SwitchFlipsAt(j - 1))
            return x1;
        if (formulas[j] == StepFormula.BackwardEuler)
            return x0 + (x1 - x0) * s / h;
        if (j >= 2)
        {
            // The quadratic through this step's ends and the point before, all after the last breakpoint (an order-2
            // step comes third after one at the earliest), in Newton's form.
            var hm = t0 - times[j - 2];
            var xm = values[(j - 2) * w + index];
            var second = ((x1 - x0) / h - (x0 - xm) / hm) / (h + hm);
            return x0 + s * (x1 - x0) / h + s * (s - h) * second;
        }
        // The first step kept after ForgetRecordedPoints: the quadratic with the method's end slopes.
        var d0 = slopes[(j - 1) * w + index];
        var d1 = slopes[j * w + index];
        return x0 + d0 * s + (d1 - d0) * s * s / (2 * h);
    }

    /// <summary>Whether a switch changes state at point <paramref name="point"/>: its state in the step before (the
    /// operating point's at the start) differs from its state in the step after, as the switch stamp reads it (mid-step).</summary>
    private bool SwitchFlipsAt(int point)
    {
        var before = point >= 1 ? 0.5 * (times[point - 1] + times[point]) : times[point];
        var after = 0.5 * (times[point] + times[point + 1]);
        foreach (var element in system.Circuit.Elements)
            if (element is TimedSwitch sw && sw.Schedule.IsClosed(before) != sw.Schedule.IsClosed(after))
                return true;
        return false;
    }

    /// <summary>The integration formula of the step that ended at point <paramref name="point"/> (for tests).</summary>
    internal StepFormula FormulaOfStepEndingAt(int point) => formulas[point];

    /// <summary>Whether the step that ended at point <paramref name="point"/> was the probe after a breakpoint (for tests).</summary>
    internal bool IsProbeStepEndingAt(int point) => probes[point];

    private double[] Column(int index)
    {
        var v = new double[Count];
        for (var p = 0; p < Count; p++)
            v[p] = values[p * width + index];
        return v;
    }
}
