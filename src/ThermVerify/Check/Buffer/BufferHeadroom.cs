using ThermVerify.Design;
using ThermVerify.FrontEnd;

namespace ThermVerify.Check.Buffer;

/// <summary>One stretch of the check range where the buffer leaves its linear range.</summary>
public sealed record HeadroomViolation(
    string Limit,
    string Side,
    double LimitVolts,
    double FromCelsius,
    double ToCelsius,
    double WorstCelsius,
    double WorstVolts,
    int ClippedCode)
{
    /// <summary>How far beyond the limit the closed form goes at its worst (positive).</summary>
    public double ExcessVolts => Math.Abs(WorstVolts - LimitVolts);
}

/// <summary>The buffer's input and output over the check range against its limits, and every crossing.</summary>
public sealed record HeadroomResult(
    double InputLowVolts,
    double InputHighVolts,
    double OutputLowVolts,
    double OutputHighVolts,
    IReadOnlyList<double> Celsius,
    IReadOnlyList<double> InputVolts,
    IReadOnlyList<double> OutputVolts,
    IReadOnlyList<HeadroomViolation> Violations)
{
    /// <summary>The smallest distance to any limit over the range (negative: a limit is crossed).</summary>
    public double MinimumMarginVolts =>
        Enumerable.Range(0, Celsius.Count).Min(i => Math.Min(
            Math.Min(InputVolts[i] - InputLowVolts, InputHighVolts - InputVolts[i]),
            Math.Min(OutputVolts[i] - OutputLowVolts, OutputHighVolts - OutputVolts[i])));
}

/// <summary>
/// Headroom from the closed form: the buffer's input is the unloaded divider, v_in(T); its output is
/// G·(v_in(T) + V_os) with the offset drifted to the board temperature, or to the swept temperature when the design
/// gives none (as the simulation holds it). The input must stay
/// inside the common-mode range and the output inside the supply less the output swing. Every crossing of a limit is
/// located by bisection on T between the grid points that bracket it, so the reported range starts and ends where
/// the closed form meets the limit, not at the nearest grid point. While the output is clipped the ADC reads the
/// limit's code whatever the temperature.
/// </summary>
internal static class BufferHeadroom
{
    public static HeadroomResult Run(FrontEndDesign design, IReadOnlyList<double> temperaturesCelsius)
    {
        var b = BufferCircuits.Require(design);
        var model = new ClosedFormModel(design);
        double Offset(double t) => b.OffsetVolts + b.OffsetDriftVoltsPerKelvin * ((design.Check.BoardCelsius ?? t) - 25);
        double Input(double t) => model.At(t).IdealVolts / model.BufferGain;
        double Output(double t) => b.Gain * (Input(t) + Offset(t));

        var inLow = b.InputCommonMode?.MinVolts ?? double.NegativeInfinity;
        var inHigh = b.InputCommonMode?.MaxVolts ?? double.PositiveInfinity;
        var outLow = b.Supply.MinVolts + b.OutputSwingVolts;
        var outHigh = b.Supply.MaxVolts - b.OutputSwingVolts;
        var violations = new List<HeadroomViolation>();
        violations.AddRange(Crossings("input common-mode range", Input, inLow, inHigh, temperaturesCelsius, model, b.Gain, Offset));
        violations.AddRange(Crossings("output swing", Output, outLow, outHigh, temperaturesCelsius, model, 1, _ => 0));
        return new HeadroomResult(inLow, inHigh, outLow, outHigh, temperaturesCelsius,
            [.. temperaturesCelsius.Select(Input)], [.. temperaturesCelsius.Select(Output)], violations);
    }

    private static IEnumerable<HeadroomViolation> Crossings(string limit, Func<double, double> volts, double low, double high,
        IReadOnlyList<double> t, ClosedFormModel model, double gain, Func<double, double> offset)
    {
        foreach (var (side, bound, outside) in new (string, double, Func<double, bool>)[]
                 { ("low", low, v => v < low), ("high", high, v => v > high) })
        {
            if (!double.IsFinite(bound)) continue;
            var start = -1;
            for (var i = 0; i <= t.Count; i++)
            {
                var isOut = i < t.Count && outside(volts(t[i]));
                if (isOut && start < 0) start = i;
                if (isOut || start < 0) continue;
                var from = start == 0 ? t[0] : Crossing(volts, bound, t[start - 1], t[start]);
                var to = i == t.Count ? t[^1] : Crossing(volts, bound, t[i - 1], t[i]);
                var worst = Enumerable.Range(start, i - start).MaxBy(k => Math.Abs(volts(t[k]) - bound));
                // The ADC sees the clamped output (times the stage gain for an input limit).
                var code = model.Adc.Code(gain * (bound + offset(t[worst])));
                yield return new HeadroomViolation(limit, side, bound, from, to, t[worst], volts(t[worst]), code);
                start = -1;
            }
        }
    }

    /// <summary>Bisection for v(T) = bound between two temperatures that bracket it (v is monotone in T there).</summary>
    private static double Crossing(Func<double, double> volts, double bound, double a, double b)
    {
        var sa = Math.Sign(volts(a) - bound);
        for (var i = 0; i < 200 && Math.Abs(b - a) > 1e-12 * Math.Max(1, Math.Abs(a)); i++)
        {
            var m = 0.5 * (a + b);
            if (Math.Sign(volts(m) - bound) == sa) a = m; else b = m;
        }
        return 0.5 * (a + b);
    }
}
