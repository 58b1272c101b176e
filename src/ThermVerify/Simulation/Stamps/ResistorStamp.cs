using ThermVerify.Circuits;
using ThermVerify.Simulation.Mna;

namespace ThermVerify.Simulation.Stamps;

internal sealed class ResistorStamp : Stamp
{
    private readonly Resistor resistor;
    private readonly int a, b;
    private readonly ConductanceSlots slots;
    private double nominalOhms;
    private double temperatureCelsius;
    private double conductance;

    public ResistorStamp(Resistor resistor, BindContext c) : base(resistor)
    {
        this.resistor = resistor;
        a = c.Node(resistor.NodeA);
        b = c.Node(resistor.NodeB);
        slots = new ConductanceSlots(c, a, b);
        nominalOhms = resistor.ResistanceOhms;
        SetTemperature(resistor.ReferenceCelsius);
    }

    public override bool DependsOnTemperature => resistor.DependsOnTemperature;

    public override void SetTemperature(double celsius)
    {
        temperatureCelsius = celsius;
        Update();
    }

    private void Update()
    {
        var dt = temperatureCelsius - resistor.ReferenceCelsius;
        var r = nominalOhms * (1 + resistor.Tc1PerKelvin * dt + resistor.Tc2PerKelvinSquared * dt * dt);
        if (!(r > 0) || !double.IsFinite(r))
            throw new CircuitException($"{resistor.Describe}: its temperature coefficients give R = {r:G6} Ω at {temperatureCelsius:G6} °C; a resistance must stay positive, so check tc1 and tc2.");
        conductance = 1 / r;
    }

    public double ConductanceSiemens => conductance;

    public override void LoadStatic(double[] matrix) => slots.Add(matrix, conductance);

    public override void CollectNoise(NoiseContext noise) =>
        noise.Add(Element.Name, "thermal", a, b, noise.ThermalCurrentPsd(Element.Name, conductance), 0);

    public override double CurrentAmperes(double[] solution) => (solution[a] - solution[b]) * conductance;

    public override string SweepQuantity => "resistance (Ω)";

    public override void SetSweepValue(double value)
    {
        if (!(value > 0) || !double.IsFinite(value))
            throw new CircuitException($"{resistor.Describe}: a DC sweep asked for R = {value:G6} Ω; sweep positive, finite resistances.");
        nominalOhms = value;
        Update();
    }
}
