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

    public TimedSwitchStamp(TimedSwitch sw, BindContext c) : base(sw)
    {
        this.sw = sw;
        slots = new ConductanceSlots(c, c.Node(sw.NodeA), c.Node(sw.NodeB));
        gOn = 1 / sw.OnResistanceOhms;
        gOff = 1 / sw.OffResistanceOhms;
    }

    public override bool HasLoad => true;

    public override void Load(LoadContext c) =>
        slots.Add(c.Matrix, sw.Schedule.IsClosed(c.StepMidTimeSeconds) ? gOn : gOff);

    public override void CollectBreakpoints(double fromSeconds, double toSeconds, List<double> into) =>
        sw.Schedule.CollectEdges(fromSeconds, toSeconds, into);
}
