using ThermVerify.Circuits;
using ThermVerify.Simulation.Mna;

namespace ThermVerify.Simulation.Stamps;

internal sealed class LeakageCurrentSourceStamp : Stamp
{
    private readonly LeakageCurrentSource source;
    private readonly int a, b;
    private double amperes;

    public LeakageCurrentSourceStamp(LeakageCurrentSource source, BindContext c) : base(source)
    {
        this.source = source;
        a = c.Node(source.Positive);
        b = c.Node(source.Negative);
        amperes = source.CurrentAt25CelsiusAmperes;
    }

    public override bool DependsOnTemperature => true;

    public override bool HasLoad => true;

    public override void SetTemperature(double celsius) => amperes = source.CurrentAmperesAt(celsius);

    public override void Load(LoadContext c)
    {
        var i = c.SourceFactor * amperes;
        c.Rhs[a] -= i;
        c.Rhs[b] += i;
    }

    public override double CurrentAmperes(double[] solution) => amperes;
}
