using ThermVerify.Circuits;
using ThermVerify.Simulation.Mna;

namespace ThermVerify.Simulation.Stamps;

/// <summary>
/// Which element records the built-in engine can run, and the stamp each becomes. Element records describe a
/// circuit for any engine (ngspice reads their SPICE form); how one enters this engine's matrix is this engine's
/// business, so the choice lives here and Circuits knows nothing of Simulation. Adding an element kind to the
/// engine is one line below and one stamp class.
/// </summary>
internal static class StampCatalog
{
    private static readonly Dictionary<Type, Func<Element, BindContext, Stamp>> Stamps = new()
    {
        [typeof(Resistor)] = (e, c) => new ResistorStamp((Resistor)e, c),
        [typeof(SensorResistor)] = (e, c) => new SensorResistorStamp((SensorResistor)e, c),
        [typeof(Capacitor)] = (e, c) => new CapacitorStamp((Capacitor)e, c),
        [typeof(Inductor)] = (e, c) => new InductorStamp((Inductor)e, c),
        [typeof(VoltageSource)] = (e, c) => new VoltageSourceStamp((VoltageSource)e, c),
        [typeof(CurrentSource)] = (e, c) => new CurrentSourceStamp((CurrentSource)e, c),
        [typeof(LeakageCurrentSource)] = (e, c) => new LeakageCurrentSourceStamp((LeakageCurrentSource)e, c),
        [typeof(Vcvs)] = (e, c) => new VcvsStamp((Vcvs)e, c),
        [typeof(Vccs)] = (e, c) => new VccsStamp((Vccs)e, c),
        [typeof(Cccs)] = (e, c) => new CccsStamp((Cccs)e, c),
        [typeof(Ccvs)] = (e, c) => new CcvsStamp((Ccvs)e, c),
        [typeof(Diode)] = (e, c) => new DiodeStamp((Diode)e, c),
        [typeof(OpAmp)] = (e, c) => new OpAmpStamp((OpAmp)e, c),
        [typeof(TimedSwitch)] = (e, c) => new TimedSwitchStamp((TimedSwitch)e, c),
    };

    /// <summary>The element's stamp bound to this analysis' slots; a clear refusal for elements only SPICE runs.</summary>
    public static Stamp Bind(Element element, BindContext context)
    {
        if (Stamps.TryGetValue(element.GetType(), out var make))
            return make(element, context);
        throw new EngineUnsupportedException(element is ExternalOpAmp sub
            ? $"The buffer is the SPICE subcircuit '{sub.SubcircuitName}' from {sub.SubcircuitPath}; the built-in engine cannot run a SPICE subcircuit. " +
              "Run the check with '--engine ngspice', or remove subckt_file and subckt_name to use the built-in op-amp model."
            : $"{element.Describe} has no model in the built-in engine; run it with '--engine ngspice'.");
    }
}
