using ThermVerify.Circuits;
using ThermVerify.Simulation.Mna;

namespace ThermVerify.Simulation.Stamps;

internal sealed class VoltageSourceStamp : Stamp
{
    private readonly VoltageSource source;
    private readonly int k;
    private readonly int ak, bk, ka, kb;
    private double? sweptVolts;

    public VoltageSourceStamp(VoltageSource source, BindContext c) : base(source)
    {
        this.source = source;
        var a = c.Node(source.Positive);
        var b = c.Node(source.Negative);
        k = c.Extra(0);
        (ak, bk, ka, kb) = (c.Slot(a, k), c.Slot(b, k), c.Slot(k, a), c.Slot(k, b));
    }

    public override bool HasLoad => true;

    public override void LoadStatic(double[] matrix)
    {
        matrix[ak] += 1;
        matrix[bk] -= 1;
        matrix[ka] += 1;
        matrix[kb] -= 1;
    }

    public override void Load(LoadContext c) =>
        c.Rhs[k] += c.SourceFactor * (sweptVolts ?? source.Waveform.ValueAt(c.TimeSeconds));

    public override void CollectBreakpoints(double fromSeconds, double toSeconds, List<double> into) =>
        source.Waveform.CollectBreakpoints(fromSeconds, toSeconds, into);

    public override double CurrentAmperes(double[] solution) => solution[k];

    public override void LoadAcExcitation(System.Numerics.Complex[] rhs) =>
        rhs[k] += System.Numerics.Complex.FromPolarCoordinates(source.AcMagnitude, source.AcPhaseDegrees * Math.PI / 180);

    public override string SweepQuantity => "voltage (V)";

    public override void SetSweepValue(double value) => sweptVolts = value;
}
