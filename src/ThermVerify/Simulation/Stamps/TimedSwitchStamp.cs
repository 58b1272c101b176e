using ThermVerify.Circuits;
using ThermVerify.Simulation.Mna;

namespace ThermVerify.Simulation.Stamps;

/// <summary>
/// The switch state is read in the middle of the step being solved, so a step that ends on an edge
/// uses the state before it and the next step the state after: edges are exact.
/// </summary>
internal sealed class TimedSwitchStamp : Stamp
{
    private readonly TimedSwitch sw;
    private readonly ConductanceSlots slots;
    private readonly double gOn, gOff;
    private readonly int a, b;

    public TimedSwitchStamp(TimedSwitch sw, BindContext c) : base(sw)
    {
        this.sw = sw;
        a = c.Node(sw.NodeA);
        b = c.Node(sw.NodeB);
        slots = new ConductanceSlots(c, a, b);
        gOn = 1 / sw.OnResistanceOhms;
        gOff = 1 / sw.OffResistanceOhms;
    }

    public override bool HasLoad => true;

    public override void Load(LoadContext c) =>
        slots.Add(c.Matrix, sw.Schedule.IsClosed(c.StepMidTimeSeconds) ? gOn : gOff);

    /// <summary>Thermal noise of the resistance the switch has at the operating point (t = 0).</summary>
    public override void CollectNoise(NoiseContext noise) =>
        noise.Add(Element.Name, "thermal", a, b, noise.ThermalCurrentPsd(Element.Name, sw.Schedule.IsClosed(0) ? gOn : gOff), 0);

    public override void CollectBreakpoints(double fromSeconds, double toSeconds, List<double> into) =>
        sw.Schedule.CollectEdges(fromSeconds, toSeconds, into);
}
