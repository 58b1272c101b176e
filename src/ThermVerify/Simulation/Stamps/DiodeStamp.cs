using ThermVerify.Circuits;
using ThermVerify.Quantities;
using ThermVerify.Simulation.Mna;

namespace ThermVerify.Simulation.Stamps;

/// <summary>
/// Shockley junction linearised about the limited junction voltage, with SPICE's junction limiting
/// (pnjlim: beyond V_crit a new voltage is taken logarithmically from the old one; Nagel 1975 and the
/// SPICE3 sources' documented algorithm, from memory) and a gmin of 1e-12 S across the junction as SPICE adds.
/// </summary>
internal sealed class DiodeStamp : Stamp
{
    private readonly Diode diode;
    private readonly int anode, junction, cathode;
    private readonly ConductanceSlots junctionSlots;
    private readonly ConductanceSlots seriesSlots;
    private readonly double seriesConductance;
    private double thermalVoltage;
    private double saturationCurrent;
    private double lastJunctionVolts;
    private double lastConductance;
    private double lastCurrent;

    public DiodeStamp(Diode diode, BindContext c) : base(diode)
    {
        this.diode = diode;
        anode = c.Node(diode.Anode);
        cathode = c.Node(diode.Cathode);
        junction = diode.SeriesResistanceOhms > 0 ? c.Extra(0) : anode;
        junctionSlots = new ConductanceSlots(c, junction, cathode);
        if (diode.SeriesResistanceOhms > 0)
        {
            seriesSlots = new ConductanceSlots(c, anode, junction);
            seriesConductance = 1 / diode.SeriesResistanceOhms;
        }
        SetTemperature(25);
    }

    public override bool DependsOnTemperature => true;

    public override bool HasLoad => true;

    public override bool IsNonlinear => true;

    public override void SetTemperature(double celsius)
    {
        thermalVoltage = diode.EmissionCoefficient * PhysicalConstants.BoltzmannJoulesPerKelvin * PhysicalConstants.ToKelvin(celsius)
            / PhysicalConstants.ElementaryChargeCoulombs;
        saturationCurrent = diode.SaturationCurrentAmperesAt(celsius);
    }

    public override void LoadStatic(double[] matrix)
    {
        if (seriesConductance > 0)
            seriesSlots.Add(matrix, seriesConductance);
    }

    public override void Load(LoadContext c)
    {
        var nvt = thermalVoltage;
        var isat = saturationCurrent;
        var v = c.Solution[junction] - c.Solution[cathode];
        var limited = Limit(v, lastJunctionVolts, nvt, isat);
        if (limited != v)
            c.Limited = true;
        v = limited;
        lastJunctionVolts = v;
        var e = Math.Exp(Math.Min(v / nvt, 700));
        var current = isat * (e - 1) + c.JunctionGmin * v;
        var conductance = isat * e / nvt + c.JunctionGmin;
        lastConductance = conductance;
        lastCurrent = current;
        junctionSlots.Add(c.Matrix, conductance);
        var equivalent = current - conductance * v;
        c.Rhs[junction] -= equivalent;
        c.Rhs[cathode] += equivalent;
    }

    /// <summary>SPICE's pnjlim.</summary>
    private static double Limit(double vNew, double vOld, double nvt, double isat)
    {
        var vCritical = nvt * Math.Log(nvt / (Math.Sqrt(2) * isat));
        if (vNew > vCritical && Math.Abs(vNew - vOld) > 2 * nvt)
        {
            if (vOld > 0)
            {
                var arg = 1 + (vNew - vOld) / nvt;
                return arg > 0 ? vOld + nvt * Math.Log(arg) : vCritical;
            }
            return nvt * Math.Log(vNew / nvt);
        }
        return vNew;
    }

    public override double CurrentAmperes(double[] solution)
    {
        var v = solution[junction] - solution[cathode];
        return saturationCurrent * (Math.Exp(v / thermalVoltage) - 1) + 1e-12 * v;
    }

    public override void CollectNoise(NoiseContext n)
    {
        // Shot noise 2q|I| of the junction current and thermal noise of the series resistance.
        n.Add(Element.Name, "shot", junction, cathode, 2 * PhysicalConstants.ElementaryChargeCoulombs * Math.Abs(lastCurrent), 0);
        if (seriesConductance > 0)
            n.Add(Element.Name, "series resistance", anode, junction, n.ThermalCurrentPsd(Element.Name, seriesConductance), 0);
    }

    public double SmallSignalConductance => lastConductance;
}
