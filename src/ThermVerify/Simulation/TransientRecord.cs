namespace ThermVerify.Simulation;

/// <summary>
/// Growing storage of accepted time points: the full solution vector, its time derivative by the
/// integration formula, the formula of the step that ended at the point and whether that step was a probe. Grows by
/// doubling, so recording costs no allocation per step on average.
/// </summary>
internal sealed class TransientRecord(int width)
{
    public int Width { get; } = width;

    public int Count { get; private set; }

    public double[] Times { get; private set; } = new double[256];

    public double[] Values { get; private set; } = new double[256 * width];

    public double[] Slopes { get; private set; } = new double[256 * width];

    public StepFormula[] Formulas { get; private set; } = new StepFormula[256];

    /// <summary>Whether the step that ended at the point was the tiny probe right after a breakpoint.</summary>
    public bool[] Probes { get; private set; } = new bool[256];

    public void Add(double time, double[] solution, double[] slope, StepFormula formula, bool probe = false)
    {
        if (Count == Times.Length)
        {
            Times = Grow(Times);
            Values = Grow(Values);
            Slopes = Grow(Slopes);
            Formulas = Grow(Formulas);
            Probes = Grow(Probes);
        }
        Times[Count] = time;
        Array.Copy(solution, 0, Values, Count * Width, Width);
        Array.Copy(slope, 0, Slopes, Count * Width, Width);
        Formulas[Count] = formula;
        Probes[Count] = probe;
        Count++;
    }

    /// <summary>
    /// Keeps only the newest point. The arrays are reused unless a result was made from them since they were last
    /// cleared (a result keeps the arrays it was given): a run read conversion by conversion drops its points after
    /// every conversion, and new arrays each time cost about 29 MB over 64 conversions and 10–18 % of the run in
    /// collection (issue 17).
    /// </summary>
    public void KeepLast()
    {
        if (Count <= 1)
            return;
        var last = Count - 1;
        if (handedOut)
        {
            var (time, values, slopes) = (Times[last], Values.AsSpan(last * Width, Width).ToArray(), Slopes.AsSpan(last * Width, Width).ToArray());
            FreshArrays();
            Count = 0;
            Add(time, values, slopes, StepFormula.BackwardEuler);
            return;
        }
        Times[0] = Times[last];
        Array.Copy(Values, last * Width, Values, 0, Width);
        Array.Copy(Slopes, last * Width, Slopes, 0, Width);
        Formulas[0] = StepFormula.BackwardEuler;
        Probes[0] = false;
        Count = 1;
    }

    /// <summary>Drops every point and starts again from one (a run restarted from another engine's solution).</summary>
    public void StartAgain(double time, double[] solution, double[] slope)
    {
        if (handedOut)
            FreshArrays();
        Count = 0;
        Add(time, solution, slope, StepFormula.BackwardEuler);
    }

    private bool handedOut;

    /// <summary>New arrays for the points to come: a result holds the old ones.</summary>
    private void FreshArrays()
    {
        Times = new double[256];
        Values = new double[256 * Width];
        Slopes = new double[256 * Width];
        Formulas = new StepFormula[256];
        Probes = new bool[256];
        handedOut = false;
    }

    /// <summary>A result now holds the arrays: they must not be overwritten.</summary>
    public void HandOut() => handedOut = true;

    private static T[] Grow<T>(T[] a)
    {
        var b = new T[a.Length * 2];
        Array.Copy(a, b, a.Length);
        return b;
    }
}
