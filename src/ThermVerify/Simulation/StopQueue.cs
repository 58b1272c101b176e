namespace ThermVerify.Simulation;

/// <summary>
/// Upcoming times a transient must land on: breakpoints (discontinuities: backward Euler restarts after
/// them) and requested output times (plain solution points). Both sorted, duplicates within the time
/// resolution merged.
/// </summary>
internal sealed class StopQueue
{
    private readonly List<double> breakpoints = [];
    private readonly List<double> outputs = [];

    /// <summary>Two times closer than this are the same instant.</summary>
    public static double Epsilon(double t) => 1e-15 + 1e-13 * Math.Abs(t);

    public void AddBreakpoints(IEnumerable<double> times, double after) => Add(breakpoints, times, after);

    public void AddOutputs(IEnumerable<double> times, double after) => Add(outputs, times, after);

    /// <summary>The first stop after <paramref name="now"/>, or <paramref name="target"/> if that comes first.</summary>
    public double Next(double target)
    {
        var stop = target;
        if (breakpoints.Count > 0 && breakpoints[0] < stop)
            stop = breakpoints[0];
        if (outputs.Count > 0 && outputs[0] < stop)
            stop = outputs[0];
        return stop;
    }

    /// <summary>Removes the stops reached at <paramref name="time"/>; true if a breakpoint was among them.</summary>
    public bool Reach(double time)
    {
        var hit = false;
        while (breakpoints.Count > 0 && breakpoints[0] <= time + Epsilon(time))
        {
            hit = true;
            breakpoints.RemoveAt(0);
        }
        while (outputs.Count > 0 && outputs[0] <= time + Epsilon(time))
            outputs.RemoveAt(0);
        return hit;
    }

    private static void Add(List<double> list, IEnumerable<double> times, double after)
    {
        foreach (var t in times)
            if (t > after + Epsilon(t) && !list.Exists(b => Math.Abs(b - t) <= Epsilon(t)))
                list.Add(t);
        list.Sort();
    }
}
