using ThermVerify.Circuits;
using ThermVerify.Simulation.Mna;

namespace ThermVerify.Simulation.Stamps;

/// <summary>
/// Capacitor companion model: i = C·ẋ with ẋ = Ag0·v + history, i.e. a conductance C·Ag0 in parallel
/// with a current C·history. Open in DC; held at its initial voltage by a stiff Norton source while the
/// transient start is solved with initial conditions.
/// </summary>
internal sealed class CapacitorStamp : Stamp
{
    /// <summary>Holding conductance: dominates any practical node conductance by many decades.</summary>
    private const double HoldSiemens = 1e9;

    private readonly Capacitor capacitor;
    private readonly int a, b, state;
    private readonly ConductanceSlots slots;

    public CapacitorStamp(Capacitor capacitor, BindContext c) : base(capacitor)
    {
        this.capacitor = capacitor;
        a = c.Node(capacitor.NodeA);
        b = c.Node(capacitor.NodeB);
        slots = new ConductanceSlots(c, a, b);
        state = c.State(isCurrent: false);
    }

    public override bool HasLoad => true;

    public override bool IsReactive => true;

    public override void Load(LoadContext c)
    {
        if (c.Mode == AnalysisMode.Dc)
        {
            if (c.HoldInitialConditions && capacitor.InitialVoltage is { } v0)
            {
                slots.Add(c.Matrix, HoldSiemens);
                c.Rhs[a] += HoldSiemens * v0;
                c.Rhs[b] -= HoldSiemens * v0;
            }
            return;
        }
        var cap = capacitor.CapacitanceFarads;
        slots.Add(c.Matrix, cap * c.Ag0);
        var history = cap * c.History(state);
        c.Rhs[a] -= history;
        c.Rhs[b] += history;
    }

    public override void LoadReactive(double[] matrix) => slots.Add(matrix, capacitor.CapacitanceFarads);

    public override void Accept(LoadContext c) => c.Integrate(state, c.Solution[a] - c.Solution[b]);
}
