using System.Globalization;
using ThermVerify.Circuits;

namespace ThermVerify.Tests.Differential;

/// <summary>
/// Gives a generated circuit its time dependence once its time scale is known: the transient runs for five slowest
/// time constants (at most a million fastest ones and 200 periods of the fastest oscillation, at least 1 ns), some sources become pulses or piecewise-linear
/// ramps, and every switch gets a schedule with edges inside the run, starting in its state at t = 0 (which the
/// operating point, AC and noise analyses use). Rise and fall times are never zero, so both engines see the same
/// waveform (SPICE replaces a zero rise by its own step).
/// </summary>
internal static class RandomTiming
{
    public static RandomCircuit Apply(RandomCircuit rc, Poles poles, int seed)
    {
        var random = new Random(seed * 31 + 7);
        var slow = poles.SlowestSeconds;
        var fast = poles.FastestSeconds;
        var stop = slow > 0 ? Math.Clamp(5 * slow, 1e-9, 1) : 1e-6;
        if (fast > 0)
            stop = Math.Min(stop, Math.Max(1e6 * fast, 1e-9));
        // A lightly damped resonance is followed at a tight tolerance with tens of steps a period: 200 periods at most.
        stop = Math.Min(stop, Math.Max(200 * poles.ShortestPeriodSeconds, 1e-9));
        stop = RoundSignificant(stop);
        double Uniform(double low, double high) => low + (high - low) * random.NextDouble();
        double At(double fraction) => RoundSignificant(fraction * stop);

        Element Timed(Element e)
        {
            switch (e)
            {
                case VoltageSource v when v.Name != rc.SweepSource && random.NextDouble() < 0.4:
                    return v with { Waveform = Waveform(((DcWaveform)v.Waveform).Value, 5) };
                case CurrentSource i when i.Name != rc.SweepSource && random.NextDouble() < 0.4:
                    return i with { Waveform = Waveform(((DcWaveform)i.Waveform).Value, Math.Abs(((DcWaveform)i.Waveform).Value) * 2) };
                case TimedSwitch s:
                    return s with { Schedule = Schedule(s.Schedule.IsClosed(0)) };
                default:
                    return e;
            }
        }

        Waveform Waveform(double value, double swing)
        {
            var other = RoundSignificant(value + Uniform(-swing, swing));
            if (random.NextDouble() < 0.6)
            {
                var delay = At(Uniform(0, 0.3));
                var rise = At(Uniform(1e-4, 0.05));
                var fall = At(Uniform(1e-4, 0.05));
                var width = At(Uniform(0.05, 0.3));
                var period = random.NextDouble() < 0.5 ? 0 : RoundSignificant(rise + fall + width + At(Uniform(0.05, 0.3)));
                return new PulseWaveform(value, other, delay, rise, fall, width, period);
            }
            var corners = random.Next(2, 5);
            var times = Enumerable.Range(0, corners).Select(_ => At(Uniform(0, 0.9))).Order().Distinct().ToList();
            var points = times.Select((t, k) => (t, k == 0 ? value : RoundSignificant(value + Uniform(-swing, swing)))).ToList();
            if (points[0].t > 0)
                points.Insert(0, (0, value));
            return new PiecewiseLinearWaveform(points.ToArray());
        }

        SwitchSchedule Schedule(bool closedAtZero)
        {
            if (random.NextDouble() < 0.5)
            {
                var period = At(Uniform(0.1, 0.5));
                var closed = RoundSignificant(period * Uniform(0.1, 0.6));
                return new PeriodicSchedule(closedAtZero ? 0 : At(Uniform(0.01, 0.2)), period, closed);
            }
            var edges = Enumerable.Range(0, random.Next(1, 4) * 2).Select(_ => At(Uniform(0.02, 0.95))).Order().Distinct().ToList();
            if (edges.Count % 2 == 1)
                edges.RemoveAt(edges.Count - 1);
            var intervals = new List<(double, double)>();
            if (closedAtZero)
                intervals.Add((0, edges.Count > 0 ? edges[0] : At(0.5)));
            for (var k = closedAtZero ? 1 : 0; k + 1 < edges.Count; k += 2)
                intervals.Add((edges[k], edges[k + 1]));
            if (intervals.Count == 0)
                intervals.Add((At(0.3), At(0.6)));
            return new IntervalSchedule(intervals.ToArray());
        }

        var circuit = new Circuit(rc.Circuit.Elements.Select(Timed), rc.Circuit.TemperatureCelsius);
        return rc with { Circuit = circuit, TransientStopSeconds = stop, FastestTimeConstantSeconds = fast };
    }

    /// <summary>Six significant digits, so decks and the engine see the very same numbers and times stay readable.</summary>
    private static double RoundSignificant(double v) =>
        double.Parse(v.ToString("G6", CultureInfo.InvariantCulture), CultureInfo.InvariantCulture);
}
