using System.Globalization;

namespace ThermVerify.Firmware;

/// <summary>
/// Makes tables from a model. Breakpoint values are the true temperatures rounded to the unit; placement is greedy:
/// from each breakpoint, the farthest next one whose segment keeps the interpolated value (computed exactly as the
/// C routine does) within the bound at every code in between. Greedy reach gives the fewest breakpoints when a
/// shorter segment is never worse than a longer one, which holds for a smooth curve up to integer rounding; every
/// chosen segment is checked in full regardless, so the bound always holds.
/// </summary>
internal static class TableBuilder
{
    /// <summary>A value for every code of the span.</summary>
    public static FirmwareTable EveryCode(FirmwareModel model, FixedPointScale scale)
    {
        var (span, _, values) = Prepare(model, scale);
        if (span.Count > 65536)
            throw new FirmwareInputException($"A table of every code would hold {span.Count} values; use breakpoints (a bound in K) for converters above 16 bits.");
        return new FirmwareTable(span, scale, [.. Enumerable.Range(span.FirstCode, span.Count)], values);
    }

    /// <summary>The fewest breakpoints (greedy) that keep |table − true| ≤ <paramref name="maxErrorKelvin"/> at every code.</summary>
    public static FirmwareTable WithinBound(FirmwareModel model, FixedPointScale scale, double maxErrorKelvin)
    {
        var (span, truth, values) = Prepare(model, scale);
        var floor = RoundingFloorKelvin(truth, values, scale);
        if (!(maxErrorKelvin >= floor))
            throw new FirmwareInputException(string.Create(CultureInfo.InvariantCulture,
                $"A bound of {maxErrorKelvin:G4} K is below the rounding error of the unit itself ({floor:G4} K at some code); raise the bound or use a finer unit."));
        var codes = Place(span, truth, values, scale, maxErrorKelvin);
        return new FirmwareTable(span, scale, codes, Pick(values, span, codes));
    }

    /// <summary>
    /// At most <paramref name="breakpoints"/> breakpoints with the smallest bound the greedy placement can meet,
    /// found by bisection on the bound (the count falls as the bound grows).
    /// </summary>
    public static FirmwareTable WithBreakpoints(FirmwareModel model, FixedPointScale scale, int breakpoints)
    {
        if (breakpoints < 2)
            throw new FirmwareInputException($"A table needs at least 2 breakpoints (the two ends of the span); got {breakpoints}.");
        var (span, truth, values) = Prepare(model, scale);
        if (breakpoints >= span.Count) return EveryCode(model, scale);
        var lo = RoundingFloorKelvin(truth, values, scale);
        var hi = Math.Max(lo, MaxError(span, truth, values, scale, 0, span.Count - 1)) * 2 + 1;
        while (Place(span, truth, values, scale, hi).Count > breakpoints) hi *= 2;
        for (var i = 0; i < 60 && hi - lo > 1e-6 * scale.UnitKelvin; i++)
        {
            var mid = (lo + hi) / 2;
            if (Place(span, truth, values, scale, mid).Count <= breakpoints) hi = mid; else lo = mid;
        }
        var codes = Place(span, truth, values, scale, hi);
        return new FirmwareTable(span, scale, codes, Pick(values, span, codes));
    }

    private static (CodeSpan Span, double[] Truth, int[] Values) Prepare(FirmwareModel model, FixedPointScale scale)
    {
        var span = CodeTemperatures.Span(model);
        var truth = CodeTemperatures.ForSpan(model, span);
        return (span, truth, [.. truth.Select(scale.ToFixed)]);
    }

    private static List<int> Place(CodeSpan span, double[] truth, int[] values, FixedPointScale scale, double bound)
    {
        var last = span.Count - 1;
        var chosen = new List<int> { span.FirstCode };
        var i = 0;
        while (i < last)
        {
            // Gallop then bisect for the farthest acceptable end; a segment of one code step is always acceptable
            // because the bound is at least the rounding floor.
            int good = i + 1, step = 1;
            while (good + step <= last && Acceptable(span, truth, values, scale, i, good + step, bound)) { good += step; step *= 2; }
            int bad = Math.Min(good + step, last + 1);
            while (bad - good > 1)
            {
                var mid = good + (bad - good) / 2;
                if (Acceptable(span, truth, values, scale, i, mid, bound)) good = mid; else bad = mid;
            }
            chosen.Add(span.FirstCode + good);
            i = good;
        }
        return chosen;
    }

    private static bool Acceptable(CodeSpan span, double[] truth, int[] values, FixedPointScale scale, int i, int j, double bound) =>
        FixedPointInterpolation.FitsInt32(span.FirstCode + i, values[i], span.FirstCode + j, values[j]) && MaxError(span, truth, values, scale, i, j) <= bound;

    /// <summary>Largest |interpolated − true| in K over the codes from index i to j, both included.</summary>
    private static double MaxError(CodeSpan span, double[] truth, int[] values, FixedPointScale scale, int i, int j)
    {
        var worst = 0.0;
        for (var k = i; k <= j; k++)
        {
            var v = FixedPointInterpolation.Interpolate(span.FirstCode + i, values[i], span.FirstCode + j, values[j], span.FirstCode + k);
            worst = Math.Max(worst, Math.Abs(scale.ToCelsius(v) - truth[k]));
        }
        return worst;
    }

    private static double RoundingFloorKelvin(double[] truth, int[] values, FixedPointScale scale) =>
        truth.Select((t, k) => Math.Abs(scale.ToCelsius(values[k]) - t)).Max();

    private static int[] Pick(int[] values, CodeSpan span, IReadOnlyList<int> codes) => [.. codes.Select(c => values[c - span.FirstCode])];
}
