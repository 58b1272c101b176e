namespace ThermVerify.Simulation;

/// <summary>
/// Notices the trapezoidal rule's ringing. On a mode much faster than the step the rule's amplification is
/// (1 − hλ/2)/(1 + hλ/2) → −1: the mode is not damped, and the derivative it assigns, ẋ_n = 2·(x_n − x_n−1)/h − ẋ_n−1,
/// swings about the true slope with alternating sign from step to step (Nagel 1975; Hairer &amp; Wanner, Solving
/// ODEs II, §IV.3 on A- versus L-stability; from memory). The swing r_n = ẋ_n − (x_n − x_n−1)/h is watched per
/// state: three sign changes in a row that do not die away (each at least a quarter of the one two steps before)
/// and that move the state by more than its error tolerance within a step (|r_n|·h > tol) count as ringing.
/// </summary>
internal sealed class RingingDetector(int stateCount)
{
    private const int SignChanges = 3;

    private readonly double[] last = new double[stateCount];
    private readonly double[] beforeLast = new double[stateCount];
    private readonly int[] alternations = new int[stateCount];

    /// <summary>The state that rang at the last <see cref="Observe"/>, or −1.</summary>
    public int RingingState { get; private set; } = -1;

    /// <summary>Forgets the history (after a breakpoint, where a first-order step restarts the rule).</summary>
    public void Reset()
    {
        Array.Clear(last);
        Array.Clear(beforeLast);
        Array.Clear(alternations);
        RingingState = -1;
    }

    /// <summary>Observes an accepted trapezoidal step before it enters the history; true when some state rings.</summary>
    /// <param name="states">[value, derivative] pairs at the new point.</param>
    /// <param name="history">The states up to the previous point, and their tolerances.</param>
    public bool Observe(double[] states, StateHistory history, TransientOptions options, double h)
    {
        var previous = history.Values[0];
        RingingState = -1;
        for (var i = 0; i < last.Length; i++)
        {
            var value = states[2 * i];
            var swing = states[2 * i + 1] - (value - previous[i]) / h;
            var alternates = swing * last[i] < 0 && Math.Abs(swing) >= 0.25 * Math.Abs(beforeLast[i])
                && Math.Abs(swing) * h > history.Tolerance(i, value, options);
            alternations[i] = alternates ? alternations[i] + 1 : 0;
            beforeLast[i] = last[i];
            last[i] = swing;
            if (alternations[i] >= SignChanges && RingingState < 0)
                RingingState = i;
        }
        return RingingState >= 0;
    }
}
