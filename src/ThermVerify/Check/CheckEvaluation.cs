using ThermVerify.Check.Noise;
using ThermVerify.Design;
using ThermVerify.FrontEnd;
using ThermVerify.Limits;

namespace ThermVerify.Check;

/// <summary>
/// The points of a check over a set of temperatures: the DC levels, the sampling offsets on a grid of them, the one
/// error model (<see cref="ErrorModel"/>) that picks the worst reading at each temperature, and the split of its error
/// by cause. <see cref="Refined"/> adds a sampling transient at the worst temperature when the grid missed it, as every
/// unit of the tolerance analyses does. The whole check runs it over its range; a remedy search over one temperature.
/// </summary>
internal sealed class CheckEvaluation
{
    private CheckEvaluation(FrontEndDesign design, ClosedFormModel model, FirmwareReading reading, IReadOnlyList<double> temperatures,
        IReadOnlyList<PrechargeCase> cases, DcCorners dc, SamplingOffsets offsets, Converter converter, double settleVolts, SampleKinds kinds,
        IReadOnlyList<ReadingNoise?> noise)
    {
        Noise = noise;
        Design = design;
        Model = model;
        Reading = reading;
        Temperatures = temperatures;
        ClosedForm = [.. temperatures.Select(model.At)];
        Cases = cases;
        Dc = dc;
        Offsets = offsets;
        Converter = converter;
        SettleVolts = settleVolts;
        Kinds = kinds;
        Inputs = ErrorModel.Inputs(design, model.Sensor, temperatures, dc, offsets.FirstVolts, offsets.SteadyVolts, converter) with { Kinds = kinds };
        Points = [.. Enumerable.Range(0, temperatures.Count).Select(PointAt)];
    }

    public FrontEndDesign Design { get; }
    public ClosedFormModel Model { get; }
    public FirmwareReading Reading { get; }
    public IReadOnlyList<double> Temperatures { get; }
    public ClosedFormPoint[] ClosedForm { get; }
    public IReadOnlyList<PrechargeCase> Cases { get; }
    /// <summary>The DC levels at the corners of the design's bounds; sampling runs on <see cref="DcCorners.Base"/>.</summary>
    public DcCorners Dc { get; }
    public SamplingOffsets Offsets { get; }
    public Converter Converter { get; }
    public double SettleVolts { get; }
    public SampleKinds Kinds { get; }
    public ErrorInputs Inputs { get; }
    public IReadOnlyList<CheckPoint> Points { get; }
    /// <summary>The noise of the reading at each temperature (counted in the budget at its coverage); null where not asked for.</summary>
    public IReadOnlyList<ReadingNoise?> Noise { get; }

    /// <param name="cases">The precharge cases to cover; null: the design's own (<see cref="PrechargeCases.For"/>).</param>
    /// <param name="kinds">
    /// The readings to cover: both samples (the check), or one of them (a remedy search on the reading a finding was
    /// worst at; the first alone needs one conversion per run). Null: no sampling transients, every sampling offset zero
    /// (for questions about DC effects alone).
    /// </param>
    /// <param name="noise">
    /// Whether to analyse the reading's noise (the check, and a search on the total, which counts it); a search on one
    /// effect's own size does not need it.
    /// </param>
    public static CheckEvaluation Run(FrontEndDesign design, IReadOnlyList<double> temperatures, CheckOptions options,
        IReadOnlyList<PrechargeCase>? cases = null, SampleKinds? kinds = SampleKinds.Both, bool noise = true)
    {
        var model = new ClosedFormModel(design);
        var reading = new FirmwareReading(model);
        cases ??= PrechargeCases.For(design, model.Adc.ReferenceVolts);
        var settleVolts = design.Check.SettleLimitLsb * model.Adc.LsbVolts;
        var indices = SettlingGrid.Indices(temperatures.Count, options.MaximumSamplingPoints);
        // A delta-sigma input's average load moves the pin at every temperature (SAR converters' sampling is in the offsets).
        var dc = FrontEnd.DeltaSigma.AverageInputLoad.Added(DcCorners.Run(design, cases, temperatures, options.Engine), design, temperatures);
        // Sampling offsets (sample minus the level it starts from) of the design with its bounds at zero: the bounds
        // move the levels, which the corners carry, and a larger bound can only move them further.
        var sampled = StaticBounds.Zeroed(design);
        var offsets = kinds switch
        {
            null => SamplingOffsets.None(cases, temperatures.Count),
            SampleKinds.FirstOnly => SamplingOffsets.FirstOnly(sampled, cases, temperatures, dc.Base, settleVolts, options.Engine),
            _ => SamplingOffsets.Run(sampled, cases, temperatures, indices, dc.Base, settleVolts, options.Threads, options.Cancel, options.Engine,
                Counter(options.Progress, cases.Count * indices.Length)),
        };
        var readings = noise
            ? [.. ReadingNoiseAnalysis.Over(design, model, temperatures, options.MaximumSamplingPoints, options.Engine)]
            : new ReadingNoise?[temperatures.Count];
        return new CheckEvaluation(design, model, reading, temperatures, cases, dc, offsets, Converter.Of(design), settleVolts, kinds ?? SampleKinds.Both, readings);
    }

    /// <summary>Reports 0 of <paramref name="total"/> at once, then one more at every call (from worker threads); null without a listener.</summary>
    private static Action? Counter(IProgress<RunProgress>? progress, int total)
    {
        if (progress is null) return null;
        progress.Report(new RunProgress(0, total));
        var done = 0;
        return () => progress.Report(new RunProgress(Interlocked.Increment(ref done), total));
    }

    /// <summary>
    /// The same evaluation with a sampling transient at the worst temperature, for its worst reading's precharge case
    /// and sample, when the grid did not simulate it there (as every unit of the tolerance analyses does).
    /// </summary>
    public CheckEvaluation Refined(CheckOptions options)
    {
        var worst = ErrorModel.WorstIndex([.. Points.Select(p => p.ErrorKelvin)]);
        var (choice, _) = ErrorModel.WorstAt(Inputs, worst, Reading);
        var offsets = Offsets.WithPoint(StaticBounds.Zeroed(Design), Temperatures, worst, Dc.Base, SettleVolts, options.Cancel, options.Engine,
            choice.Case, choice.First);
        return ReferenceEquals(offsets, Offsets) ? this
            : new CheckEvaluation(Design, Model, Reading, Temperatures, Cases, Dc, offsets, Converter, SettleVolts, Kinds, Noise);
    }

    /// <summary>No offset, gain or INL at any corner and no reference drift: the code is the sample over the nominal LSB.</summary>
    private bool ConverterIsIdeal => Converter.Cases.All(c => c == ConverterErrors.None) && Converter.ReferenceTempcoPerKelvin == 0;

    private CheckPoint PointAt(int i)
    {
        var cf = ClosedForm[i];
        var (choice, _) = ErrorModel.WorstAt(Inputs, i, Reading);
        var c = choice.Case;
        var corner = Dc.Corners[choice.Corner];
        var first = Offsets.FirstVolts[c][i];
        var steady = Offsets.SteadyVolts[c][i];
        // What the converter converts: the pin against its negative input (ground, or a lead's near end).
        var staticPin = corner.StaticPinVolts[i] - corner.NegativeAt(i);
        var averagePin = corner.AveragePinVolts[c][i] - corner.NegativeAt(i);
        var heat = Inputs.SelfHeatingVolts[i];

        // The walk from the closed form to the code, one cause at a time. Where the circuit makes the reference (a
        // reference resistor) the walk is on the converter's own scale, every voltage over the simulated reference
        // times the nominal one, so that a current error, which moves pin and reference together, shows as nothing.
        var scale = corner.ReferenceVolts is { } reference ? Model.Adc.ReferenceVolts * Design.Adc.ProgrammableGain / reference[i] : 1;
        var ideal = cf.IdealVolts;
        var afterBuffer = corner.AfterBufferVolts?[i] ?? ideal;
        var level = scale * (choice.First ? staticPin : averagePin);
        var sample = level + scale * (choice.First ? first : steady);
        var warmed = scale * choice.SampleVolts;
        staticPin *= scale;
        averagePin *= scale;
        // A converter without errors converts the sample itself: taken as it is, the converter's part is exactly zero
        // (through code × LSB it would be the rounding of that product, 1e-13 K, shown as an effect the design lacks).
        var converted = ConverterIsIdeal ? warmed : choice.UnroundedCode * Model.Adc.LsbVolts;
        double T(double volts) => Model.CelsiusAtVolts(volts);
        double[] parts =
        [
            Reading.Celsius(choice.Code) - T(converted),   // quantisation
            T(converted) - T(warmed),                       // converter
            T(staticPin) - T(afterBuffer),                  // DC loading
            T(level) - T(staticPin),                        // recovery
            T(sample) - T(level),                           // settling
            T(afterBuffer) - T(ideal),                      // buffer
            T(warmed) - T(sample),                          // self-heating
        ];
        var unmappable = parts.Any(p => !double.IsFinite(p));
        for (var k = 0; k < parts.Length; k++) if (!double.IsFinite(parts[k])) parts[k] = 0;
        var error = choice.ErrorKelvin;
        // The parts telescope from T(ideal), the true temperature, to the reported one, so they add up to the error but
        // for the rounding of the differences (1e-13 K); the rest is what no part could carry (a voltage outside the
        // sensor's range, whose temperature does not exist), and exactly zero otherwise rather than that rounding.
        var rest = unmappable ? error - parts.Sum() : 0;
        var contributions = new ErrorContributions(parts[0], parts[1], parts[2], parts[3], parts[4], parts[5], parts[6], rest);
        var volts = new VoltageErrors(afterBuffer - ideal, staticPin - afterBuffer, level - staticPin, sample - level, warmed - sample,
            converted - warmed, first, steady, averagePin - staticPin);
        var cornerName = Dc.Corners.Count > 1 ? (choice.Corner == 0 ? "bounds up" : "bounds down") : "";
        return new CheckPoint(cf.Celsius, cf.SensorOhms, ideal, Dc.Base.DividerVolts[i], staticPin, averagePin, staticPin + first, averagePin + steady,
            warmed, Cases[c], choice.First, cornerName, Offsets.SimulatedIndices.Contains(i), choice.Code, Reading.Celsius(choice.Code), error,
            Design.Check.BudgetAt(cf.Celsius), Model.Adc.LsbVolts / Math.Abs(cf.VoltsPerKelvin), contributions, volts,
            EffectEstimator.At(Dc.DesignAt(Design, choice.Corner, i), cf, staticPin, averagePin, Cases[c].Volts, heat)) { Noise = Noise[i] };
    }
}
