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
        {
            for (var v = Math.Floor(current ?? 0) + 1; v <= limit; v++)
                if (Ok(v)) return v;
            return null;
        }
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
}
