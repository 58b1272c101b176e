using ThermVerify.Circuits;
using ThermVerify.Simulation.Mna;

namespace ThermVerify.Simulation;

/// <summary>
/// Accepted time points of a transient and every unknown at them. Between points,
/// <see cref="VoltageAt"/> evaluates the integration method's own polynomial: a straight line across a
/// backward-Euler step; across a trapezoidal step the quadratic whose end slopes are the trapezoidal
/// derivatives, which passes through both end values.
/// </summary>
public sealed class TransientResult
{
    private readonly TransientRecord record;
    private readonly MnaLayout layout;
    private readonly BoundSystem system;

    internal TransientResult(TransientRecord record, BoundSystem system, IReadOnlyList<SimulationWarning> warnings,
        int acceptedSteps, int rejectedSteps)
    {
        this.record = record;
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

    public double[] TimesSeconds => record.Times.AsSpan(0, Count).ToArray();

    public double StartTimeSeconds => record.Times[0];

    public double EndTimeSeconds => record.Times[Count - 1];

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

    public double FinalVoltage(string node) => record.Values[(Count - 1) * record.Width + layout.IndexOfNode(node)];

    /// <summary>Voltage of <paramref name="node"/> at any time inside the run (see the class summary).</summary>
    public double VoltageAt(string node, double timeSeconds)
    {
        var index = layout.IndexOfNode(node);
        var times = record.Times;
        if (timeSeconds < times[0] || timeSeconds > times[Count - 1])
            throw new ArgumentOutOfRangeException(nameof(timeSeconds),
                $"Time {timeSeconds:G6} s is outside the run ({times[0]:G6} s to {times[Count - 1]:G6} s).");
        var j = Array.BinarySearch(times, 0, Count, timeSeconds);
        if (j >= 0)
            return record.Values[j * record.Width + index];
        j = ~j;
        var w = record.Width;
        var t0 = times[j - 1];
        var h = times[j] - t0;
        var s = timeSeconds - t0;
        var x0 = record.Values[(j - 1) * w + index];
        var x1 = record.Values[j * w + index];
        if (record.BackwardEuler[j])
            return x0 + (x1 - x0) * s / h;
        var d0 = record.Slopes[(j - 1) * w + index];
        var d1 = record.Slopes[j * w + index];
        return x0 + d0 * s + (d1 - d0) * s * s / (2 * h);
    }

    private double[] Column(int index)
    {
        var v = new double[Count];
        for (var p = 0; p < Count; p++)
            v[p] = record.Values[p * record.Width + index];
        return v;
    }
}
