using ThermVerify.Design;

namespace ThermVerify.Check.Remedies;

/// <summary>
/// The smallest change of one design value that brings a finding's simulated quantity within its target, by bisection
/// in log space (<see cref="MonotoneSearch"/>, 1 % precision) from the design's own value towards the knob's limit. A
/// part the design does not have (no reservoir, no buffer) is searched from the knob's floor, which is itself the
/// answer when it already suffices. Null when even the limit does not bring the quantity there, or when the design's
/// own value already does (the probe then disagrees with the check's interpolation and the search has nothing to move).
/// </summary>
internal static class KnobSearch
{
    private const double Precision = 0.01;

    public static double? Find(Knob knob, FrontEndDesign design, Func<FrontEndDesign, bool> passes)
    {
        bool Ok(double v)
        {
            try
            {
                return passes(knob.Apply(design, v));
            }
            catch (Exception e) when (e is Simulation.SimulationException or Circuits.CircuitException or ArgumentException)
            {
                return false; // a candidate the engine cannot simulate is no remedy
            }
        }

        var current = knob.Current(design);
        var limit = knob.Limit(design);
        if (knob.Integer)
            return Whole(knob.Better, current ?? 0, limit, Ok);
        if (knob.Better == Better.Higher)
        {
            if (current is not { } from)
            {
                from = knob.Floor(design);
                if (!(from > 0) || !(limit > from)) return null;
                if (Ok(from)) return from;
            }
            else if (!(limit > from) || !double.IsFinite(from) || Ok(from)) return null;
            return MonotoneSearch.SmallestPassing(from, limit, Ok, Precision);
        }
        if (current is not { } now || !(now > 0) || Ok(now)) return null;
        if (limit > 0) return MonotoneSearch.LargestPassing(limit, now, Ok, Precision);
        if (!Ok(0)) return null;
        return MonotoneSearch.LargestPassing(now * 1e-6, now, Ok, Precision) ?? 0;
    }

    /// <summary>
    /// The whole number nearest the design's own (exclusive) towards the limit (inclusive) that passes, by bisection on
    /// the monotone test; null when the limit does not pass either.
    /// </summary>
    private static double? Whole(Better better, double current, double limit, Func<double, bool> ok)
    {
        var up = better == Better.Higher;
        var first = up ? Math.Floor(current) + 1 : Math.Ceiling(current) - 1;
        if (up ? first > limit : first < limit) return null;
        if (!ok(limit)) return null;
        // Invariant: `passing` passes; everything strictly between `failing` and the start side fails or is untested.
        double failing = up ? first - 1 : first + 1, passing = limit;
        while (Math.Abs(passing - failing) > 1)
        {
            var middle = Math.Floor((passing + failing) / 2);
            if (ok(middle)) passing = middle; else failing = middle;
        }
        return passing;
    }
}
