namespace ThermVerify.Simulation;

/// <summary>
/// The last few accepted values of every integrated state since the last breakpoint, and the local
/// truncation error estimate built from them: the formula's leading error term (<see cref="StepFormulas.ErrorFactor"/>)
/// with x'' ≈ 2·x[3 points] and x''' ≈ 6·x[4 points], x[…] the divided differences through the new point
/// (any numerical-analysis text, from memory).
/// </summary>
internal sealed class StateHistory
{
    public const int Length = 4;

    private readonly int stateCount;
    private readonly bool[] isCurrent;
    private readonly double[] ddTimes = new double[Length];
    private readonly double[] ddValues = new double[Length];

    public StateHistory(bool[] stateIsCurrent)
    {
        isCurrent = stateIsCurrent;
        stateCount = stateIsCurrent.Length;
        Values = [.. Enumerable.Range(0, Length).Select(_ => new double[stateCount])];
    }

    /// <summary>Times of the accepted points, newest first.</summary>
    public double[] Times { get; } = new double[Length];

    /// <summary>State values at those points, newest first.</summary>
    public double[][] Values { get; }

    /// <summary>Tolerance of state i for a truncation error, at its present size.</summary>
    public double Tolerance(int i, double value, TransientOptions options) =>
        options.TruncationErrorFactor * (options.RelativeTolerance * Math.Max(Math.Abs(value), Math.Abs(Values[0][i]))
            + (isCurrent[i] ? options.CurrentToleranceAmperes : options.VoltageToleranceVolts));

    public int StateCount => stateCount;


    /// <summary>Accepted points since the last breakpoint, the breakpoint itself counted (at most <see cref="Length"/>).</summary>
    public int SinceBreak { get; set; }

    /// <summary>Records an accepted point; <paramref name="states"/> holds [value, derivative] pairs.</summary>
    public void Push(double time, double[] states, bool isBreakpoint)
    {
        var oldest = Values[Length - 1];
        for (var j = Length - 1; j > 0; j--)
        {
            Values[j] = Values[j - 1];
            Times[j] = Times[j - 1];
        }
        Values[0] = oldest;
        Times[0] = time;
        for (var i = 0; i < stateCount; i++)
            oldest[i] = states[2 * i];
        SinceBreak = isBreakpoint ? 1 : Math.Min(SinceBreak + 1, Length);
    }

    /// <summary>
    /// Largest ratio of estimated local truncation error to tolerance over all states for a step of
    /// length h by <paramref name="formula"/> ending at <paramref name="time"/> with <paramref name="states"/>;
    /// 0 when there are not yet enough points since the breakpoint.
    /// </summary>
    public double ErrorRatio(double time, double h, StepFormula formula, double[] states, TransientOptions options)
    {
        var points = StepFormulas.Order(formula) + 2;
        var factor = StepFormulas.ErrorFactor(formula, h, Times[0] - Times[1]);
        if (SinceBreak < points - 1)
            return 0;
        var worst = 0.0;
        for (var i = 0; i < stateCount; i++)
        {
            ddTimes[0] = time;
            ddValues[0] = states[2 * i];
            for (var j = 1; j < points; j++)
            {
                ddTimes[j] = Times[j - 1];
                ddValues[j] = Values[j - 1][i];
            }
            for (var level = 1; level < points; level++)
                for (var j = 0; j < points - level; j++)
                    ddValues[j] = (ddValues[j] - ddValues[j + 1]) / (ddTimes[j] - ddTimes[j + level]);
            var error = factor * ddValues[0];
            worst = Math.Max(worst, Math.Abs(error) / Tolerance(i, states[2 * i], options));
        }
        return worst;
    }

    public void CopyFrom(double[] times, double[][] values, int sinceBreak)
    {
        Array.Copy(times, Times, Length);
        for (var j = 0; j < Length; j++)
            Array.Copy(values[j], Values[j], stateCount);
        SinceBreak = sinceBreak;
    }
}
