using ThermVerify.Circuits;
using ThermVerify.Simulation.Mna;

namespace ThermVerify.Simulation.Stamps;

/// <summary>
/// SPICE's H: a branch current of its own (as a voltage source has) and the row V(P) − V(N) − R·i = 0, i being the
/// controlling source's branch current.
/// </summary>
internal sealed class CcvsStamp : Stamp
{
    private readonly double transresistance;
    private readonly int k;
    private readonly int pk, nk, kp, kn, kc;

    public CcvsStamp(Ccvs ccvs, BindContext c) : base(ccvs)
    {
        transresistance = ccvs.TransresistanceOhms;
        var p = c.Node(ccvs.Positive);
        var n = c.Node(ccvs.Negative);
        k = c.Extra(0);
        var control = c.BranchCurrent(ccvs.ControlSource);
        (pk, nk, kp, kn, kc) = (c.Slot(p, k), c.Slot(n, k), c.Slot(k, p), c.Slot(k, n), c.Slot(k, control));
    }

    public override void LoadStatic(double[] matrix)
    {
        matrix[pk] += 1;
        matrix[nk] -= 1;
        matrix[kp] += 1;
        matrix[kn] -= 1;
        matrix[kc] -= transresistance;
    }

    public override double CurrentAmperes(double[] solution) => solution[k];
}
