using ThermVerify.Circuits;
using ThermVerify.Simulation.Mna;

namespace ThermVerify.Simulation.Stamps;

internal sealed class CurrentSourceStamp : Stamp
{
    private readonly CurrentSource source;
    private readonly int a, b;
    private double? sweptAmperes;

    public CurrentSourceStamp(CurrentSource source, BindContext c) : base(source)
    {
        this.source = source;
        a = c.Node(source.Positive);
        b = c.Node(source.Negative);
    }

    public override bool HasLoad => true;

    public override void Load(LoadContext c)
    {
        var i = c.SourceFactor * (sweptAmperes ?? source.Waveform.ValueAt(c.TimeSeconds));
        c.Rhs[a] -= i;
        c.Rhs[b] += i;
    }

    public override void CollectBreakpoints(double fromSeconds, double toSeconds, List<double> into) =>
        source.Waveform.CollectBreakpoints(fromSeconds, toSeconds, into);

    public override void LoadAcExcitation(System.Numerics.Complex[] rhs)
    {
        var i = System.Numerics.Complex.FromPolarCoordinates(source.AcMagnitude, source.AcPhaseDegrees * Math.PI / 180);
        rhs[a] -= i;
        rhs[b] += i;
    }

    public override string SweepQuantity => "current (A)";

    public override void SetSweepValue(double value) => sweptAmperes = value;
}
