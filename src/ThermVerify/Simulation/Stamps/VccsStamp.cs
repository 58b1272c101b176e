using ThermVerify.Circuits;
using ThermVerify.Simulation.Mna;

namespace ThermVerify.Simulation.Stamps;

internal sealed class VccsStamp : Stamp
{
    private readonly double gm;
    private readonly int pcp, pcn, ncp, ncn;

    public VccsStamp(Vccs vccs, BindContext c) : base(vccs)
    {
        gm = vccs.TransconductanceSiemens;
        var p = c.Node(vccs.Positive);
        var n = c.Node(vccs.Negative);
        var cp = c.Node(vccs.ControlPositive);
        var cn = c.Node(vccs.ControlNegative);
        (pcp, pcn, ncp, ncn) = (c.Slot(p, cp), c.Slot(p, cn), c.Slot(n, cp), c.Slot(n, cn));
    }

    public override void LoadStatic(double[] matrix)
    {
        matrix[pcp] += gm;
        matrix[pcn] -= gm;
        matrix[ncp] -= gm;
        matrix[ncn] += gm;
    }
}
