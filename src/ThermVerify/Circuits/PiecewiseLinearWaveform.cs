using System.Collections.Immutable;

namespace ThermVerify.Circuits;

/// <summary>Straight lines between (time, value) corners; constant before the first and after the last.</summary>
internal sealed record PiecewiseLinearWaveform(ImmutableArray<(double TimeSeconds, double Value)> Points) : Waveform
{
    public PiecewiseLinearWaveform(params (double TimeSeconds, double Value)[] points) : this(points.ToImmutableArray()) { }

    public override double ValueAt(double timeSeconds)
    {
        var p = Points;
        if (timeSeconds <= p[0].TimeSeconds)
            return p[0].Value;
        for (var i = 1; i < p.Length; i++)
        {
            if (timeSeconds <= p[i].TimeSeconds)
            {
                var (t0, v0) = p[i - 1];
                var (t1, v1) = p[i];
                return v0 + (v1 - v0) * (timeSeconds - t0) / (t1 - t0);
            }
        }
        return p[^1].Value;
    }

    internal override void CollectBreakpoints(double fromSeconds, double toSeconds, List<double> into)
    {
        foreach (var (t, _) in Points)
            if (t >= fromSeconds && t <= toSeconds)
                into.Add(t);
    }

    internal override string ToSpice() =>
        $"PWL({string.Join(" ", Points.Select(p => $"{Spice.SpiceNumber.Format(p.TimeSeconds)} {Spice.SpiceNumber.Format(p.Value)}"))})";

    internal override void Validate(Element owner)
    {
        if (Points.IsDefaultOrEmpty)
            throw new CircuitException($"{owner.Describe}: the piecewise-linear waveform has no points; give at least one (time, value).");
        for (var i = 0; i < Points.Length; i++)
        {
            ElementChecks.Finite(owner, Points[i].TimeSeconds, $"PWL time #{i + 1}");
            ElementChecks.Finite(owner, Points[i].Value, $"PWL value #{i + 1}");
            if (i > 0 && Points[i].TimeSeconds <= Points[i - 1].TimeSeconds)
                throw new CircuitException($"{owner.Describe}: PWL time #{i + 1} ({Points[i].TimeSeconds:G6} s) does not increase; list the corners in strictly increasing time.");
        }
    }
}
