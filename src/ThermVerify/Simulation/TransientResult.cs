using ThermVerify.Circuits;
using ThermVerify.Simulation.Mna;

namespace ThermVerify.Simulation;

/// <summary>
/// Accepted time points of a transient and every unknown at them. Between points,
/// <see cref="VoltageAt"/> evaluates the integration method's own polynomial: a straight line across a
/// backward-Euler step; across a trapezoidal step the quadratic whose end slopes are the trapezoidal
/// derivatives, which passes through both end values.
/// </summary>
internal sealed class TransientResult
{
    private readonly double[] times;
    private readonly double[] values;
    private readonly double[] slopes;
    private readonly bool[] backwardEuler;
    private readonly int width;
    private readonly MnaLayout layout;
    private readonly BoundSystem system;

    internal TransientResult(TransientRecord record, BoundSystem system, IReadOnlyList<SimulationWarning> warnings,
        int acceptedSteps, int rejectedSteps)
    {
        (times, values, slopes, backwardEuler, width) = (record.Times, record.Values, record.Slopes, record.BackwardEuler, record.Width);
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
        if (backwardEuler[j])
            return x0 + (x1 - x0) * s / h;
        var d0 = slopes[(j - 1) * w + index];
        var d1 = slopes[j * w + index];
        return x0 + d0 * s + (d1 - d0) * s * s / (2 * h);
    }

    private double[] Column(int index)
    {
        var v = new double[Count];
        for (var p = 0; p < Count; p++)
            v[p] = values[p * width + index];
        return v;
    }
}
