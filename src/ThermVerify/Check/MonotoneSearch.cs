namespace ThermVerify.Check;

/// <summary>Bisection for a threshold of a monotone yes/no question, in log space (values spanning decades).</summary>
internal static class MonotoneSearch
{
    /// <summary>
    /// The smallest x in [low, high] with passes(x) true, assuming false below a threshold and true above it;
    /// the answer passes and x·(1 − precision) would not (to the given relative precision). Null when high fails.
    /// </summary>
    public static double? SmallestPassing(double low, double high, Func<double, bool> passes, double relativePrecision = 0.005)
    {
        if (!passes(high)) return null;
        if (passes(low)) return low;
        while (high / low > 1 + relativePrecision)
        {
            var middle = Math.Sqrt(low * high);
            if (passes(middle)) high = middle; else low = middle;
        }
        return high;
    }

    /// <summary>The largest x in [low, high] with passes(x) true, for a question true below a threshold.</summary>
    public static double? LargestPassing(double low, double high, Func<double, bool> passes, double relativePrecision = 0.005)
    {
        if (!passes(low)) return null;
        if (passes(high)) return high;
        while (high / low > 1 + relativePrecision)
        {
            var middle = Math.Sqrt(low * high);
            if (passes(middle)) low = middle; else high = middle;
        }
        return low;
    }
}
