using ThermVerify.Circuits;
using ThermVerify.Simulation.Stamps;

namespace ThermVerify.Simulation.Mna;

/// <summary>
/// A circuit bound to matrix slots for one analysis. The matrix is assembled as a copy of a base matrix
/// (the static parts, rebuilt only when the temperature or a swept value changes) plus the loads of the
/// stamps that vary; the LU factorisation is kept while the assembled matrix is unchanged, so a linear
/// circuit at a fixed step costs one forward/back substitution per point. Nothing here allocates per
/// iteration or per step.
/// </summary>
internal sealed class BoundSystem
{
    private readonly Stamp[] loaders;
    private readonly Stamp[] nonlinear;
    private readonly Stamp[] temperatureStamps;
    private readonly double[] fixedBase;
    private readonly double[] baseMatrix;
    private readonly double[] factoredMatrix;
    private readonly DenseLu<double> lu;
    private Stamp[] fixedStatic;
    private Stamp[] varyingStatic;
    private double[] next;
    private bool factorValid;
    private readonly double[] magnitudes;
    private readonly double[] weights;

    public BoundSystem(Circuit circuit)
    {
        Circuit = circuit;
        Layout = new MnaLayout(circuit);
        var bind = new BindContext(Layout);
        Stamps = new Stamp[circuit.Elements.Length];
        for (var e = 0; e < Stamps.Length; e++)
        {
            bind.ExtraStart = Layout.ExtraStart[e];
            bind.ElementName = circuit.Elements[e].Name;
            Stamps[e] = StampCatalog.Bind(circuit.Elements[e], bind);
        }
        StateIsCurrent = bind.StateIsCurrent;
        StateOwners = bind.StateOwners;
        Context = new LoadContext(Layout, bind.StateCount);
        loaders = [.. Stamps.Where(s => s.HasLoad)];
        nonlinear = [.. Stamps.Where(s => s.IsNonlinear)];
        Reactive = [.. Stamps.Where(s => s.IsReactive)];
        temperatureStamps = [.. Stamps.Where(s => s.DependsOnTemperature)];
        IsNonlinear = Stamps.Any(s => s.IsNonlinear);
        fixedStatic = [.. Stamps.Where(s => !s.DependsOnTemperature)];
        varyingStatic = temperatureStamps;
        fixedBase = new double[Layout.MatrixLength];
        baseMatrix = new double[Layout.MatrixLength];
        factoredMatrix = new double[Layout.Size * Layout.Size];
        lu = new DenseLu<double>(Layout.Size);
        next = new double[Layout.VectorLength];
        magnitudes = new double[Layout.Size];
        weights = new double[Layout.Size];
        SetTemperature(circuit.TemperatureCelsius);
        RebuildFixedBase();
    }

    public Circuit Circuit { get; }

    public MnaLayout Layout { get; }

    public LoadContext Context { get; }

    public Stamp[] Stamps { get; }

    public Stamp[] Reactive { get; }

    public bool[] StateIsCurrent { get; }

    /// <summary>The element owning each integrated state.</summary>
    public string[] StateOwners { get; }

    public bool IsNonlinear { get; }

    public int Size => Layout.Size;

    public Stamp StampOf(string elementName) => Stamps[ElementIndex(elementName)];

    public int ElementIndex(string elementName)
    {
        for (var i = 0; i < Stamps.Length; i++)
            if (Stamps[i].Element.Name == elementName)
                return i;
        throw new CircuitException($"The circuit has no element named '{elementName}'.");
    }

    /// <summary>Moves a stamp into the group whose static part is re-added whenever the base is rebuilt.</summary>
    public void MarkVarying(Stamp stamp)
    {
        if (varyingStatic.Contains(stamp))
            return;
        varyingStatic = [.. varyingStatic, stamp];
        fixedStatic = [.. fixedStatic.Where(s => s != stamp)];
        RebuildFixedBase();
    }

    public void SetTemperature(double celsius)
    {
        Context.TemperatureCelsius = celsius;
        foreach (var s in temperatureStamps)
            s.SetTemperature(celsius);
        RebuildBase();
    }

    public void SetSweepValue(Stamp stamp, double value)
    {
        stamp.SetSweepValue(value);
        RebuildBase();
    }

    private void RebuildFixedBase()
    {
        Array.Clear(fixedBase);
        foreach (var s in fixedStatic)
            s.LoadStatic(fixedBase);
        RebuildBase();
    }

    private void RebuildBase()
    {
        factorValid = false;
        Array.Copy(fixedBase, baseMatrix, fixedBase.Length);
        foreach (var s in varyingStatic)
            s.LoadStatic(baseMatrix);
    }

    /// <summary>Assembles the matrix and right-hand side about the present iterate.</summary>
    public void Assemble()
    {
        var c = Context;
        Array.Copy(baseMatrix, c.Matrix, baseMatrix.Length);
        Array.Clear(c.Rhs);
        c.Limited = false;
        foreach (var s in loaders)
            s.Load(c);
        if (c.DiagonalGmin > 0)
            for (var i = 0; i < Layout.NodeCount; i++)
                c.Matrix[i * Size + i] += c.DiagonalGmin;
    }

    /// <summary>Assembles, factorises if the matrix changed, and solves into the next iterate (not yet adopted).</summary>
    public double[] SolveNext()
    {
        Solves++;
        Assemble();
        var n2 = Size * Size;
        var m = Context.Matrix;
        if (!factorValid || !m.AsSpan(0, n2).SequenceEqual(factoredMatrix))
        {
            Array.Copy(m, factoredMatrix, n2);
            factorValid = false;
            var failed = lu.Factor(m);
            if (failed >= 0)
                throw Singular(failed);
            factorValid = true;
        }
        lu.Solve(Context.Rhs, next, refine: true);
        next[Size] = 0;
        return next;
    }

    /// <summary>Linear solves so far (Newton iterations, aids included): what a sweep's start and aids cost.</summary>
    public long Solves { get; private set; }

    /// <summary>Whether every nonlinear stamp's last linearisation holds exactly up to <paramref name="next"/> (<see cref="Stamp.LinearisationExact"/>).</summary>
    public bool LinearisationExact(double[] next)
    {
        foreach (var s in nonlinear)
            if (!s.LinearisationExact(Context, next))
                return false;
        return true;
    }

    /// <summary>Makes the last solved iterate the present one.</summary>
    public void AdoptNext() => (Context.Solution, next) = (next, Context.Solution);

    /// <summary>Estimated 1-norm condition number of the last factorised matrix (after equilibration).</summary>
    public double ConditionNumber => lu.ConditionNumber;

    /// <summary>
    /// Whether the present solution has lost more than half its digits to the last factorised matrix
    /// (<see cref="MatrixCondition"/>); false when the last factorisation failed.
    /// </summary>
    /// <remarks>A rigorous upper bound from one pass over the factors (<see cref="DenseLu{T}.ErrorAmplificationBound"/>)
    /// settles nearly every case: below the limit, no unknown can be above it. Only when it is not is Hager's estimate
    /// made, which is cheap and a lower bound in exact arithmetic; only when that exceeds the limit too is the exact
    /// amplification of every unknown computed (n more solves), and that decides: in floating point the estimate has
    /// been seen above the limit where no unknown was (a noise analysis at 250 MHz). The bound halved the cost of the
    /// check at a DC sweep point, where it had been about 40 % of the point (issue 17).</remarks>
    public bool IsIllConditioned => factorValid && lu.ErrorAmplificationBound(Context.Solution, Weights()) > MatrixCondition.Limit
        && lu.ErrorAmplification(Context.Solution, Weights()) > MatrixCondition.Limit
        && MatrixCondition.Exceeds(lu.ErrorAmplificationPerUnknown(Context.Solution, Weights()));

    /// <summary>
    /// The per-unknown amplification of the first Newton iterate since <see cref="ForgetLostDigits"/> whose matrix had
    /// a pivot vanish to rounding (<see cref="DenseLu{T}.ReplacedPivot"/>), or null. Newton cannot converge where rounding
    /// moves the iterate by more than its tolerance (a diode forced far forward by a voltage-defined branch conducts
    /// 1e117 A, and its conductance swallows every other on its nodes): if every aid fails, this is why.
    /// </summary>
    public double[]? LostDigits { get; private set; }

    public void ForgetLostDigits() => LostDigits = null;

    /// <summary>Records <see cref="LostDigits"/> for the present solution, if it is the first such.</summary>
    public void NoteLostDigits()
    {
        if (LostDigits is null && factorValid && lu.ReplacedPivot)
            LostDigits = lu.ErrorAmplificationPerUnknown(Context.Solution, Weights());
    }

    /// <summary>The bound <see cref="IsIllConditioned"/> tries first and the exact amplification it bounds (for tests).</summary>
    internal (double Bound, double Exact) AmplificationBoundAndExact() =>
        (lu.ErrorAmplificationBound(Context.Solution, Weights()), lu.ErrorAmplificationPerUnknown(Context.Solution, Weights()).Max());

    /// <summary>Throws <see cref="IllConditionedMatrixException"/> when <see cref="IsIllConditioned"/>.</summary>
    public void CheckConditioning(string analysis, string where)
    {
        if (IsIllConditioned)
            throw IllConditioned(analysis, where);
    }

    /// <summary>
    /// How far rounding alone can move each unknown of <paramref name="x"/>, solved with the last factorisation:
    /// 16·u·(|A⁻¹|·|A|·|x|)_i (a small multiple of the componentwise bound, which real errors rarely reach).
    /// </summary>
    public double[] RoundOffNoise(double[] x)
    {
        Array.Fill(weights, 1.0);
        var amplification = lu.ErrorAmplificationPerUnknown(x, weights);
        for (var i = 0; i < amplification.Length; i++)
            amplification[i] *= 16 * Math.ScaleB(1.0, -53);
        return amplification;
    }

    /// <summary>The exception for the present solution, naming the unknowns that lost their digits.</summary>
    public IllConditionedMatrixException IllConditioned(string analysis, string where) =>
        MatrixCondition.Exception(Layout, lu.ErrorAmplificationPerUnknown(Context.Solution, Weights()), analysis, where);

    private double[] Weights()
    {
        var x = Context.Solution;
        for (var i = 0; i < Size; i++)
            magnitudes[i] = Math.Abs(x[i]);
        var nodeCurrents = 0.0;
        for (var i = 0; i < Layout.NodeCount; i++)
        {
            var sum = 0.0;
            for (var j = 0; j < Size; j++)
                sum += Math.Abs(factoredMatrix[i * Size + j]) * magnitudes[j];
            nodeCurrents = Math.Max(nodeCurrents, sum);
        }
        MatrixCondition.Weights(Layout, magnitudes, nodeCurrents, weights);
        return weights;
    }

    public SingularMatrixException Singular(int unknown)
    {
        var name = Layout.UnknownNames[unknown];
        var elements = Layout.Touching[unknown];
        return new SingularMatrixException(
            $"The circuit matrix is singular at unknown '{name}' (elements: {string.Join(", ", elements)}). " +
            "Typical causes: a node held only by ideal sources or controlled sources, or an element value that cancels another; " +
            "check these elements' connections and values.", name, elements);
    }

    public double NodeVoltage(string node) => Context.Solution[Layout.IndexOfNode(node)];
}
