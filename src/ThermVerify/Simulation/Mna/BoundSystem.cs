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
    private readonly Stamp[] temperatureStamps;
    private readonly double[] fixedBase;
    private readonly double[] baseMatrix;
    private readonly double[] factoredMatrix;
    private readonly DenseLu lu;
    private Stamp[] fixedStatic;
    private Stamp[] varyingStatic;
    private double[] next;
    private bool factorValid;

    public BoundSystem(Circuit circuit)
    {
        Circuit = circuit;
        Layout = new MnaLayout(circuit);
        var bind = new BindContext(Layout);
        Stamps = new Stamp[circuit.Elements.Length];
        for (var e = 0; e < Stamps.Length; e++)
        {
            bind.ExtraStart = Layout.ExtraStart[e];
            Stamps[e] = StampCatalog.Bind(circuit.Elements[e], bind);
        }
        StateIsCurrent = bind.StateIsCurrent;
        Context = new LoadContext(Layout, bind.StateCount);
        loaders = [.. Stamps.Where(s => s.HasLoad)];
        Reactive = [.. Stamps.Where(s => s.IsReactive)];
        temperatureStamps = [.. Stamps.Where(s => s.DependsOnTemperature)];
        IsNonlinear = Stamps.Any(s => s.IsNonlinear);
        fixedStatic = [.. Stamps.Where(s => !s.DependsOnTemperature)];
        varyingStatic = temperatureStamps;
        fixedBase = new double[Layout.MatrixLength];
        baseMatrix = new double[Layout.MatrixLength];
        factoredMatrix = new double[Layout.Size * Layout.Size];
        lu = new DenseLu(Layout.Size);
        next = new double[Layout.VectorLength];
        SetTemperature(circuit.TemperatureCelsius);
        RebuildFixedBase();
    }

    public Circuit Circuit { get; }

    public MnaLayout Layout { get; }

    public LoadContext Context { get; }

    public Stamp[] Stamps { get; }

    public Stamp[] Reactive { get; }

    public bool[] StateIsCurrent { get; }

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
        lu.Solve(Context.Rhs, next);
        next[Size] = 0;
        return next;
    }

    /// <summary>Makes the last solved iterate the present one.</summary>
    public void AdoptNext() => (Context.Solution, next) = (next, Context.Solution);

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
