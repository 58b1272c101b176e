using ThermVerify.Circuits;
using ThermVerify.Simulation.Mna;

namespace ThermVerify.Simulation.Stamps;

internal sealed class SensorResistorStamp : Stamp
{
    private readonly SensorResistor sensor;
    private readonly int a, b;
    private readonly ConductanceSlots slots;
    private double conductance;

    public SensorResistorStamp(SensorResistor sensor, BindContext c) : base(sensor)
    {
        this.sensor = sensor;
        a = c.Node(sensor.NodeA);
        b = c.Node(sensor.NodeB);
        slots = new ConductanceSlots(c, a, b);
    }

    public override bool DependsOnTemperature => true;

    public override void SetTemperature(double celsius) => conductance = 1 / sensor.ResistanceOhmsAt(celsius);

    public double ConductanceSiemens => conductance;

    public override void LoadStatic(double[] matrix) => slots.Add(matrix, conductance);

    public override void CollectNoise(NoiseContext noise) =>
        noise.Add(Element.Name, "thermal", a, b, noise.ThermalCurrentPsd(Element.Name, conductance), 0);

    public override double CurrentAmperes(double[] solution) => (solution[a] - solution[b]) * conductance;
}
