using ThermVerify.Circuits;
using ThermVerify.Simulation.Mna;

namespace ThermVerify.Simulation.Stamps;

/// <summary>
/// SPICE's F: the current Gain·i leaves Positive and enters Negative, i being the controlling source's branch current
/// (an unknown of the system already), so it enters the KCL rows as a gain on that column.
/// </summary>
internal sealed class CccsStamp : Stamp
{
    private readonly double gain;
    private readonly int pk, nk;

    public CccsStamp(Cccs cccs, BindContext c) : base(cccs)
    {
        gain = cccs.Gain;
        var k = c.BranchCurrent(cccs.ControlSource);
        (pk, nk) = (c.Slot(c.Node(cccs.Positive), k), c.Slot(c.Node(cccs.Negative), k));
    }

    public override void LoadStatic(double[] matrix)
    {
        matrix[pk] += gain;
        matrix[nk] -= gain;
    }
}
