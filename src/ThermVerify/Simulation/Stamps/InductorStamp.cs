using ThermVerify.Circuits;
using ThermVerify.Simulation.Mna;

namespace ThermVerify.Simulation.Stamps;

/// <summary>
/// Inductor with its current as an unknown: V(A) − V(B) = L·(Ag0·i + history). A short in DC; its
/// current is forced to the initial value while the start is solved with initial conditions.
/// </summary>
internal sealed class InductorStamp : Stamp
{
    private readonly Inductor inductor;
    private readonly int a, b, k, state;
    private readonly int ak, bk, ka, kb, kk;

    public InductorStamp(Inductor inductor, BindContext c) : base(inductor)
    {
        this.inductor = inductor;
        a = c.Node(inductor.NodeA);
        b = c.Node(inductor.NodeB);
        k = c.Extra(0);
        (ak, bk, ka, kb, kk) = (c.Slot(a, k), c.Slot(b, k), c.Slot(k, a), c.Slot(k, b), c.Slot(k, k));
        state = c.State(isCurrent: true);
    }

    public override bool HasLoad => true;

    public override bool IsReactive => true;

    public override void LoadStatic(double[] matrix)
    {
        matrix[ak] += 1;
        matrix[bk] -= 1;
    }

    public override void Load(LoadContext c)
    {
        if (c.Mode == AnalysisMode.Dc && c.HoldInitialConditions && inductor.InitialCurrent is { } i0)
        {
            c.Matrix[kk] += 1;
            c.Rhs[k] += i0;
            return;
        }
        c.Matrix[ka] += 1;
        c.Matrix[kb] -= 1;
        if (c.Mode == AnalysisMode.Dc)
            return;
        var l = inductor.InductanceHenries;
        c.Matrix[kk] -= l * c.Ag0;
        c.Rhs[k] += l * c.History(state);
    }

    public override void LoadReactive(double[] matrix) => matrix[kk] -= inductor.InductanceHenries;

    public override void Accept(LoadContext c) => c.Integrate(state, c.Solution[k]);

    public override double CurrentAmperes(double[] solution) => solution[k];
}
