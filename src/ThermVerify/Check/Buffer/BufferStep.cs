using ThermVerify.Design;
using ThermVerify.FrontEnd;
using ThermVerify.Simulation;

namespace ThermVerify.Check.Buffer;

/// <summary>
/// The second view of stability: a small step at the buffer's input, simulated with the real load, and the
/// overshoot at the op-amp's output (the node the loop is closed from). The step is small enough that the output
/// never slews (its fastest single-pole rate ΔV·2π·GBW stays under half the slew rate), so it shows the linear
/// loop's damping, which is what the phase margin predicts.
/// </summary>
internal static class BufferStep
{
    private const double MaximumStepVolts = 0.01;

    public static StepResponse Run(FrontEndDesign design, double? crossoverHertz, ICheckEngine? engine = null)
    {
        var b = BufferCircuits.Require(design);
        var fc = crossoverHertz ?? b.GainBandwidthHertz / b.Gain;
        var step = MaximumStepVolts;
        if (b.SlewRateVoltsPerSecond is { } sr) step = Math.Min(step, 0.5 * sr / (2 * Math.PI * b.GainBandwidthHertz));
        var range = design.Check.Range;
        var model = new ClosedFormModel(design);
        var from = model.At(0.5 * (range.MinCelsius + range.MaxCelsius)).IdealVolts / b.Gain;
        var high = b.Supply.MaxVolts - b.OutputSwingVolts;
        if ((from + step) * b.Gain > high - 0.05) step = -step;

        var period = 1 / (2 * Math.PI * fc);
        var start = 2 * period;
        var stop = start + 60 * period;
        var circuit = BufferCircuits.Step(design, from, from + step, start);
        var options = new TransientOptions { StopTimeSeconds = stop, MaxStepSeconds = (stop - start) / 3000, VoltageToleranceVolts = Math.Abs(step) * 1e-6 };
        var node = BufferCircuits.AmplifierNode(design);
        double[] t, v;
        double initial;
        if (b.Subcircuit is null)
        {
            var result = Transient.Run(circuit, options);
            (t, v, initial) = (result.TimesSeconds, result.Voltage(node), result.VoltageAt(node, start));
        }
        else
        {
            // The design's own subcircuit: the check's engine, read on an even grid; the step starts on a grid point.
            (t, v) = SubcircuitBuffer.Step(circuit, options, node, engine ?? BuiltInEngine.Instance);
            initial = v[Array.FindLastIndex(t, x => x <= start)];
        }
        // The end value from the gain, not the last sample: a lightly damped loop may still ring when the run stops.
        var size = step * b.Gain;
        var final = initial + size;
        var direction = Math.Sign(size);
        var peakIndex = Enumerable.Range(0, t.Length).Where(i => t[i] >= start).MaxBy(i => direction * v[i]);
        var overshoot = Math.Max(0, direction * (v[peakIndex] - final) / Math.Abs(size)) * 100;
        var lastOutside = Enumerable.Range(0, t.Length).LastOrDefault(i => t[i] >= start && Math.Abs(v[i] - final) > 0.01 * Math.Abs(size), -1);
        // Still outside 1 % at the end of the run: no settling time (∞), not the run's length.
        var settling = lastOutside < 0 ? 0 : lastOutside + 1 < t.Length ? t[lastOutside + 1] - start : double.PositiveInfinity;
        return new StepResponse(step * b.Gain, overshoot, t[peakIndex] - start, settling, node,
            [.. t.Select(x => x - start)], v);
    }
}
