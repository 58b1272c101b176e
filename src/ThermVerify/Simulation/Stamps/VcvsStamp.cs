using ThermVerify.Circuits;
using ThermVerify.Simulation.Mna;

namespace ThermVerify.Simulation.Stamps;

internal sealed class VcvsStamp : Stamp
{
    private readonly double gain;
    private readonly int k;
    private readonly int pk, nk, kp, kn, kcp, kcn;

    public VcvsStamp(Vcvs vcvs, BindContext c) : base(vcvs)
    {
        gain = vcvs.Gain;
        var p = c.Node(vcvs.Positive);
        var n = c.Node(vcvs.Negative);
        var cp = c.Node(vcvs.ControlPositive);
        var cn = c.Node(vcvs.ControlNegative);
        k = c.Extra(0);
        (pk, nk, kp, kn, kcp, kcn) = (c.Slot(p, k), c.Slot(n, k), c.Slot(k, p), c.Slot(k, n), c.Slot(k, cp), c.Slot(k, cn));
    }

    public override void LoadStatic(double[] matrix)
    {
        matrix[pk] += 1;
        matrix[nk] -= 1;
        matrix[kp] += 1;
        matrix[kn] -= 1;
        matrix[kcp] -= gain;
        matrix[kcn] += gain;
    }

    public override double CurrentAmperes(double[] solution) => solution[k];
}
