using ThermVerify.Check;
using ThermVerify.Design;
using ThermVerify.FrontEnd;
using ThermVerify.Sensors;
using ThermVerify.Simulation;

namespace ThermVerify.Tolerances;

/// <summary>
/// Verifies one built unit the way `check` verifies the nominal design: a DC temperature sweep of the unit's own
/// circuit on the check grid (loading, leakage, bias, average sampling current, fixed-resistor drift), the settling
/// offset of the first and the steady sample for each precharge case, the sensor's self-heating, and the converter
/// with the unit's offset, gain error and INL; the firmware then reads the code with the nominal model.
/// The settling offsets at every temperature start from the nominal design's sampling transients (as in `check`,
/// linear between grid points); at the unit's worst temperature the sampling transient is rerun with the unit's
/// own parts and replaces them. Thread-safe: the nominal part is computed once in the constructor.
/// </summary>
internal sealed class UnitEvaluator
{
    private readonly CaseOffsets[] cases;
    private readonly ClosedFormPoint[] closedForm;
    private readonly string pinNode;

    public UnitEvaluator(FrontEndDesign design, int threads = 1, CancellationToken cancel = default)
    {
        Design = design;
        Model = new ClosedFormModel(design);
        Reading = new FirmwareReading(Model);
        Set = ToleranceSet.From(design);
        Temperatures = SensorTabulation.Grid(design.Check.Range, design.Check.StepKelvin).ToArray();
        closedForm = [.. Temperatures.Select(Model.At)];
        Budgets = [.. Temperatures.Select(design.Check.BudgetAt)];
        SettleVolts = design.Check.SettleLimitLsb * Model.Adc.LsbVolts;
        pinNode = FrontEndCircuit.PinNode(design);
        var indices = SettlingGrid.Indices(Temperatures.Length, new CheckOptions().MaximumSamplingPoints);
        cases = [.. PrechargeCases.For(design, Model.Adc.ReferenceVolts).Select(pre => NominalOffsets(pre, indices, threads, cancel))];
    }

    public FrontEndDesign Design { get; }
    public ClosedFormModel Model { get; }
    public FirmwareReading Reading { get; }
    public ToleranceSet Set { get; }
    public double[] Temperatures { get; }
    public double[] Budgets { get; }
    public double SettleVolts { get; }
    public bool SwitchedExcitation => Design.Divider.SwitchOnLeadSeconds is not null;

    /// <summary>The nominal unit's settling offsets (sample minus DC pin voltage) at every temperature, per precharge case.</summary>
    public IReadOnlyList<(double? PrechargeVolts, double[] FirstVolts, double[] SteadyVolts)> NominalSettling =>
        [.. cases.Select(c => (c.PrechargeVolts, c.First, c.Steady))];

    /// <param name="deviations">One deviation per parameter of <see cref="Set"/>, in its own unit.</param>
    /// <param name="simulateSettling">Rerun the sampling transient with this unit's parts at its worst temperature.</param>
    public UnitOutcome Evaluate(ReadOnlySpan<double> deviations, bool simulateSettling = true)
    {
        var unit = BuiltUnit.Build(Design, Model.Sensor, Set, deviations);
        var n = Temperatures.Length;
        var plain = DcSweep.Temperature(FrontEndCircuit.Dc(unit.Design, null), Temperatures);
        var divider = plain.Voltage(FrontEndNodes.Divider);
        var staticPin = plain.Voltage(pinNode);
        var pins = cases.Select(c => DcSweepCase.UsesAverageSamplingCurrent(unit.Design, c.PrechargeVolts)
            ? DcSweep.Temperature(FrontEndCircuit.Dc(unit.Design, c.PrechargeVolts), Temperatures).Voltage(pinNode)
            : staticPin).ToArray();

        var rise = SelfHeating.RiseKelvin(unit.Design, SelfHeating.PowerWatts(unit.Design, unit.Sensor, Temperatures, divider));
        var heatVolts = new double[n];
        for (var i = 0; i < n; i++)
            heatVolts[i] = rise[i] == 0 ? 0 : rise[i] * PinVoltsPerKelvin(unit, Temperatures[i]);

        var error = new double[n];
        var unquantised = new double[n];
        var firstOffsets = new double[cases.Length];
        var steadyOffsets = new double[cases.Length];
        for (var i = 0; i < n; i++)
        {
            for (var c = 0; c < cases.Length; c++)
                (firstOffsets[c], steadyOffsets[c]) = (cases[c].First[i], cases[c].Steady[i]);
            (error[i], unquantised[i]) = ErrorAt(unit, i, staticPin[i], pins, heatVolts[i], firstOffsets, steadyOffsets);
        }

        var worst = WorstIndex(error);
        double? simulatedAt = null;
        if (simulateSettling)
        {
            var t = Temperatures[worst];
            for (var c = 0; c < cases.Length; c++)
            {
                var pre = cases[c].PrechargeVolts;
                var run = SamplingRun.Run(unit.Design, t, pre, SettleVolts);
                firstOffsets[c] = (SwitchedExcitation ? SwitchOnSettling.FirstSampleVolts(unit.Design, t, pre, SettleVolts) : run.FirstVolts) - staticPin[worst];
                steadyOffsets[c] = run.SteadyVolts - pins[c][worst];
            }
            (error[worst], unquantised[worst]) = ErrorAt(unit, worst, staticPin[worst], pins, heatVolts[worst], firstOffsets, steadyOffsets);
            worst = WorstIndex(error);
            simulatedAt = t;
        }

        var within = true;
        for (var i = 0; i < n; i++)
            within &= double.IsFinite(error[i]) && Math.Abs(error[i]) <= Budgets[i];
        return new UnitOutcome(error, unquantised, rise, worst, within, simulatedAt);
    }

    /// <summary>
    /// The reading error at one temperature, worst over the precharge cases and over the first and the steady sample
    /// (the largest |error|; an unreadable code counts as the largest).
    /// </summary>
    private (double Error, double Unquantised) ErrorAt(BuiltUnit unit, int i, double staticPin, double[][] pins, double heatVolts,
        double[] firstOffsets, double[] steadyOffsets)
    {
        var t = Temperatures[i];
        var (worst, worstUnquantised) = (0.0, 0.0);
        var (key, keyUnquantised) = (-1.0, -1.0);
        for (var c = 0; c < cases.Length; c++)
        {
            foreach (var volts in (ReadOnlySpan<double>)[staticPin + firstOffsets[c] + heatVolts, pins[c][i] + steadyOffsets[c] + heatVolts])
            {
                var code = unit.Adc.Code(volts / (unit.ReferenceVolts / (1 << Model.Adc.Bits)), Model.Adc.Bits);
                var quantised = Reading.Celsius((int)Math.Clamp(Math.Round(code, MidpointRounding.AwayFromZero), 0, Model.Adc.MaxCode)) - t;
                var exact = Reading.CelsiusUnrounded(code) - t;
                var k = double.IsFinite(quantised) ? Math.Abs(quantised) : double.PositiveInfinity;
                if (k > key) (key, worst) = (k, quantised);
                var ku = double.IsFinite(exact) ? Math.Abs(exact) : double.PositiveInfinity;
                if (ku > keyUnquantised) (keyUnquantised, worstUnquantised) = (ku, exact);
            }
        }
        return (worst, worstUnquantised);
    }

    /// <summary>dV_pin/dT_sensor of the unit's divider (times the buffer gain): turns a sensor warming into volts.</summary>
    private static double PinVoltsPerKelvin(BuiltUnit unit, double celsius)
    {
        var d = unit.Design.Divider;
        var r = unit.Sensor.ResistanceOhms(celsius);
        return (unit.Design.Buffer?.Gain ?? 1) * DividerFormula.SlopeVoltsPerOhm(d.SensorSide, d.ExcitationVolts, r, d.FixedResistorOhms)
               * unit.Sensor.SlopeOhmsPerKelvin(celsius);
    }

    private static int WorstIndex(double[] error)
    {
        var worst = 0;
        var key = -1.0;
        for (var i = 0; i < error.Length; i++)
        {
            var k = double.IsFinite(error[i]) ? Math.Abs(error[i]) : double.PositiveInfinity;
            if (k > key) (key, worst) = (k, i);
        }
        return worst;
    }

    private CaseOffsets NominalOffsets(double? pre, int[] indices, int threads, CancellationToken cancel)
    {
        var dc = DcSweepCase.Run(Design, pre, Temperatures);
        var sampling = SettlingGrid.Run(Design, pre, Temperatures, indices, SettleVolts, threads, cancel);
        var first = SettlingGrid.Interpolate(Temperatures, indices, g => sampling[g].FirstVolts - dc.StaticPinVolts[indices[g]]);
        if (SwitchedExcitation)
        {
            var switchOn = new double[indices.Length];
            Parallel.For(0, indices.Length, new ParallelOptions { MaxDegreeOfParallelism = threads, CancellationToken = cancel },
                g => switchOn[g] = SwitchOnSettling.FirstSampleVolts(Design, Temperatures[indices[g]], pre, SettleVolts) - dc.StaticPinVolts[indices[g]]);
            first = SettlingGrid.Interpolate(Temperatures, indices, g => switchOn[g]);
        }
        var steady = SettlingGrid.Interpolate(Temperatures, indices, g => sampling[g].SteadyVolts - dc.PinVolts[indices[g]]);
        return new CaseOffsets(pre, first, steady);
    }

    private sealed record CaseOffsets(double? PrechargeVolts, double[] First, double[] Steady);
}
