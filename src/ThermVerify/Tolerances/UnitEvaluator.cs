using ThermVerify.Check;
using ThermVerify.Design;
using ThermVerify.FrontEnd;
using ThermVerify.FrontEnd.DeltaSigma;
using ThermVerify.Sensors;

namespace ThermVerify.Tolerances;

/// <summary>
/// Verifies one built unit with the model `check` uses (<see cref="ErrorModel"/>): the DC levels of the unit's own
/// circuit over the check grid (loading, leakage, the buffer's offset, drift and bias, the average sampling current,
/// fixed-resistor drift), the sampling offsets of the first and steady sample for each precharge case, the sensor's
/// self-heating, and the unit's converter (its reference, offset, gain error and INL bow); the firmware reads the code
/// with the nominal model. The sampling offsets start from the nominal unit's transients (on the same grid as `check`,
/// linear between grid points); at the unit's worst temperature the sampling transient of its worst reading (that
/// precharge case; the first conversion alone when the reading is a first conversion) is rerun with the unit's own
/// parts and replaces them, as `check` adds one at its worst temperature. The nominal unit is the design with every
/// bound spread about zero (<see cref="NominalUnitDesign"/>); `check` of that design gives the nominal unit's errors
/// exactly. Thread-safe: the nominal part is computed once in the constructor.
/// </summary>
internal sealed class UnitEvaluator
{
    private readonly SamplingOffsets nominalOffsets;

    public UnitEvaluator(FrontEndDesign design, int threads = 1, CancellationToken cancel = default, int? maximumSamplingPoints = null)
    {
        Design = design;
        Model = new ClosedFormModel(design);
        Reading = new FirmwareReading(Model);
        Set = ToleranceSet.From(design);
        Temperatures = SensorTabulation.Grid(design.Check.Range, design.Check.StepKelvin).ToArray();
        Budgets = [.. Temperatures.Select(design.Check.BudgetAt)];
        SettleVolts = design.Check.SettleLimitLsb * Model.Adc.LsbVolts;
        Cancel = cancel;
        Cases = PrechargeCases.For(design, Model.Adc.ReferenceVolts);
        NominalUnitDesign = BuiltUnit.Build(design, Model.Sensor, Set, new double[Set.Count]).Design;
        var indices = SettlingGrid.Indices(Temperatures.Length, maximumSamplingPoints ?? new CheckOptions().MaximumSamplingPoints);
        IsDeltaSigma = DeltaSigmaUnit.Applies(design);
        var points = maximumSamplingPoints ?? new CheckOptions().MaximumSamplingPoints;
        // A delta-sigma converter has no acquisition window: its units are read as the settled filter output (DeltaSigmaUnit).
        nominalOffsets = IsDeltaSigma
            ? SamplingOffsets.None(Cases, Temperatures.Length)
            : SamplingOffsets.Run(NominalUnitDesign, Cases, Temperatures, indices, DcCorners.Run(NominalUnitDesign, Cases, Temperatures).Base, SettleVolts,
                threads, cancel, BuiltInEngine.Instance);
        // The noise of a reading and the lag on the declared ramp count in every unit's budget as they do in the check;
        // they are the nominal design's (a unit's parts move its noise by their tolerances' fraction of it).
        var noise = IsDeltaSigma
            ? Check.DeltaSigma.DeltaSigmaCheck.NoiseOver(design, Model, Temperatures, points)
            : Check.Noise.ReadingNoiseAnalysis.Over(design, Model, Temperatures, points, BuiltInEngine.Instance);
        NoiseMarginsKelvin = [.. noise.Select(r => r.CoveredKelvin + r.RampLagKelvin)];
        switchCelsius = new Lazy<double>(() => DeltaSigmaUnit.SwitchCelsius(NominalUnitDesign, Model));
    }

    private readonly Lazy<double> switchCelsius;

    /// <summary>A delta-sigma design: the temperature each unit's channel switch is simulated at (<see cref="DeltaSigmaUnit.SwitchCelsius"/>).</summary>
    public double SwitchCelsius => switchCelsius.Value;

    /// <summary>A delta-sigma design: every unit is its static reading, never a sampling transient, with its channel switch beside it (<see cref="DeltaSigmaUnit"/>).</summary>
    public bool IsDeltaSigma { get; }

    /// <summary>At each temperature, the nominal design's noise at its coverage plus its lag on the declared ramp.</summary>
    public double[] NoiseMarginsKelvin { get; }

    public FrontEndDesign Design { get; }
    public ClosedFormModel Model { get; }
    public FirmwareReading Reading { get; }
    public ToleranceSet Set { get; }
    public double[] Temperatures { get; }
    public double[] Budgets { get; }
    public double SettleVolts { get; }
    public IReadOnlyList<PrechargeCase> Cases { get; }
    private CancellationToken Cancel { get; }

    /// <summary>The unit with every deviation zero: the design with each bound spread about zero (offsets, drifts, tempcos, INL) at zero.</summary>
    public FrontEndDesign NominalUnitDesign { get; }

    /// <summary>The nominal unit's settling offsets (sample minus its DC level) at every temperature, per precharge case.</summary>
    public IReadOnlyList<(double? PrechargeVolts, double[] FirstVolts, double[] SteadyVolts)> NominalSettling =>
        [.. Cases.Select((c, i) => (c.Volts, nominalOffsets.FirstVolts[i], nominalOffsets.SteadyVolts[i]))];

    /// <param name="deviations">One deviation per parameter of <see cref="Set"/>, in its own unit.</param>
    /// <param name="simulateSettling">Rerun the sampling transient with this unit's parts at its worst temperature; for a delta-sigma design its channel switch at <see cref="SwitchCelsius"/> (DeltaSigmaUnit).</param>
    public UnitOutcome Evaluate(ReadOnlySpan<double> deviations, bool simulateSettling = true)
    {
        var unit = BuiltUnit.Build(Design, Model.Sensor, Set, deviations);
        var n = Temperatures.Length;
        var dc = DcCorners.Run(unit.Design, Cases, Temperatures);
        double? channelSwitch = null;
        if (IsDeltaSigma)
        {
            dc = AverageInputLoad.Added(dc, unit.Design, Temperatures, builtInLevels: true);
            // No acquisition window: the unit's own settling is its channel switch through the digital filter.
            if (simulateSettling) channelSwitch = DeltaSigmaUnit.SwitchKelvin(unit.Design, SwitchCelsius, Model);
            simulateSettling = false;
        }
        var inputs = ErrorModel.Inputs(unit.Design, unit.Sensor, Temperatures, dc, nominalOffsets.FirstVolts, nominalOffsets.SteadyVolts, unit.Converter);
        var error = new double[n];
        var unquantised = new double[n];
        for (var i = 0; i < n; i++)
        {
            var (reading, exact) = ErrorModel.WorstAt(inputs, i, Reading);
            (error[i], unquantised[i]) = (reading.ErrorKelvin, exact);
        }

        var worst = ErrorModel.WorstIndex(error);
        double? simulatedAt = null;
        if (simulateSettling)
        {
            var (choice, _) = ErrorModel.WorstAt(inputs, worst, Reading);
            var offsets = nominalOffsets.WithPoint(unit.Design, Temperatures, worst, dc.Base, SettleVolts, Cancel, BuiltInEngine.Instance,
                choice.Case, choice.First, rerun: true);
            var rerun = inputs with { FirstOffsetVolts = offsets.FirstVolts, SteadyOffsetVolts = offsets.SteadyVolts };
            var (reading, exact) = ErrorModel.WorstAt(rerun, worst, Reading);
            (error[worst], unquantised[worst]) = (reading.ErrorKelvin, exact);
            simulatedAt = Temperatures[worst];
            worst = ErrorModel.WorstIndex(error);
        }

        var rise = SelfHeating.RiseKelvin(unit.Design, SelfHeating.PowerWatts(unit.Design, unit.Sensor, Temperatures, dc.Base.DividerVolts));
        var within = true;
        for (var i = 0; i < n; i++)
            within &= double.IsFinite(error[i]) && Math.Abs(error[i]) + NoiseMarginsKelvin[i] <= Budgets[i];
        if (channelSwitch is { } k)
        {
            within &= k <= Design.Check.BudgetAt(SwitchCelsius);
            simulatedAt = SwitchCelsius;
        }
        return new UnitOutcome(error, unquantised, rise, worst, within, simulatedAt) { ChannelSwitchKelvin = channelSwitch };
    }
}
