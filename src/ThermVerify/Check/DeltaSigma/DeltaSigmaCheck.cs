using ThermVerify.Design;
using ThermVerify.FrontEnd;
using ThermVerify.FrontEnd.DeltaSigma;
using ThermVerify.Sensors;

namespace ThermVerify.Check.DeltaSigma;

/// <summary>
/// The check of a design read by a delta-sigma converter. The points are the DC temperature sweep with the
/// converter's static errors and quantisation through the one error model (no acquisition window: a delta-sigma
/// converter's sampling is judged by its own analyses), each carrying the reading's noise through the digital filter
/// (<see cref="DeltaSigmaNoise"/>). Beside them: the input's load, the readings after a channel switch and the
/// rejection of interference (<see cref="DeltaSigmaFindings"/>), each a finding by the common rule with remedies
/// proven by analysing the changed design again. The remedy search of the common findings (DC loading, converter,
/// noise, the total) works through the acquisition window and is not made here; those findings say so.
/// </summary>
internal static class DeltaSigmaCheck
{
    public const string NoSearch = "the remedy search of this finding works through a successive-approximation converter's acquisition window and is not yet made for a delta-sigma converter";

    /// <summary>What a delta-sigma point converts: the settled output of the digital filter (no precharge, no first or steady sample).</summary>
    public static readonly PrechargeCase Reading = new("settled filter output", null);

    public static CheckResult Run(FrontEndDesign design, CheckOptions options)
    {
        var d = design.Adc.DeltaSigma!;
        var temperatures = SensorTabulation.Grid(design.Check.Range, design.Check.StepKelvin).ToArray();
        var evaluation = CheckEvaluation.Run(design, temperatures, options, kinds: null, noise: false);
        var model = evaluation.Model;
        var filter = SincFilter.Of(d);
        var grid = DeltaSigmaNoise.Grid(filter);
        var noise = NoiseGrid(design, model, temperatures, grid, filter, options.MaximumSamplingPoints);
        IReadOnlyList<CheckPoint> points = [.. evaluation.Points.Select((p, i) => p with { Noise = noise[i], Precharge = Reading, FirstConversion = false })];
        var findings = FindingRules.Evaluate(design, model, points).Select(f => f with { RemedyNote = options.ComputeRemedies ? NoSearch : null }).ToList();
        findings.AddRange(ComplianceRule.Evaluate(design, evaluation.Dc, evaluation.Temperatures, points, model.Adc.LsbVolts));
        findings.AddRange(GainRangeRule.Evaluate(design, evaluation.Dc, evaluation.Temperatures, points));
        var report = DeltaSigmaFindings.Analyse(design, options.Engine);
        findings.AddRange(DeltaSigmaFindings.Evaluate(design, report));
        IReadOnlyList<Finding> ordered = FindingRules.OverBudget(model, points, findings) is { } budget
            ? [budget with { RemedyNote = options.ComputeRemedies ? NoSearch : null }, .. findings] : findings;
        var reportNoise = Noise.ReadingNoiseAnalysis.ReportTemperatures(design.Check.Range)
            .Select(t => DeltaSigmaNoise.At(design, model, t, grid, filter)).ToList();
        var worst = points[ErrorModel.WorstIndex([.. points.Select(p => p.ErrorKelvin)])];
        var result = new CheckResult(design, model.Sensor.Description, model.Adc, points, evaluation.Offsets.Outcomes, ordered,
            new SamplingWaveform(worst.Celsius, null, 0, []))
        {
            PrechargeCases = [],
            // The converter's static transfer is the firmware's code (Firmware/DeltaSigmaFirmware): the thresholds as for any converter.
            Faults = FrontEndCheck.FaultThresholdsOrNull(design, out var omitted),
            FaultsOmitted = omitted,
            Noise = DeltaSigmaNoise.Summary(design, model, reportNoise, filter),
            DeltaSigma = report,
        };
        return options.ComputeRemedies
            ? DeltaSigmaFindings.AttachRemedies(result, options.Engine, changed => Run(changed, options with { ComputeRemedies = false, RecordWaveform = false, Progress = null, RemedyProgress = null }))
            : result;
    }

    /// <summary>The reading's noise at every temperature, as the check counts it (the tolerance analyses count the nominal design's the same way).</summary>
    public static Noise.ReadingNoise[] NoiseOver(FrontEndDesign design, ClosedFormModel model, double[] temperatures, int maximumPoints)
    {
        var filter = SincFilter.Of(design.Adc.DeltaSigma!);
        return NoiseGrid(design, model, temperatures, DeltaSigmaNoise.Grid(filter), filter, maximumPoints);
    }

    /// <summary>The reading's noise at every temperature: analysed on the sampling grid, the filtered front end's variance interpolated between.</summary>
    private static Noise.ReadingNoise[] NoiseGrid(FrontEndDesign design, ClosedFormModel model, double[] temperatures, (double[] Hertz, double[] FilterPower) grid,
        SincFilter filter, int maximumPoints)
    {
        var indices = SettlingGrid.Indices(temperatures.Length, maximumPoints);
        var analyzed = indices.Select(i => DeltaSigmaNoise.At(design, model, temperatures[i], grid, filter)).ToArray();
        var variance = SettlingGrid.Interpolate(temperatures, indices, g => analyzed[g].AnalogRmsVolts * analyzed[g].AnalogRmsVolts);
        return [.. temperatures.Select((t, i) =>
        {
            var nearest = Enumerable.Range(0, indices.Length).MinBy(g => Math.Abs(indices[g] - i));
            var a = analyzed[nearest];
            return indices[nearest] == i ? a : Rescaled(design, model, t, a, Math.Sqrt(variance[i]), filter);
        })];
    }

    /// <summary>A grid point's noise moved to another temperature: its own slope, the front end's interpolated variance.</summary>
    private static Noise.ReadingNoise Rescaled(FrontEndDesign design, ClosedFormModel model, double celsius, Noise.ReadingNoise near, double analog, SincFilter filter)
    {
        var cf = model.At(celsius);
        var n = design.Noise.ReadingsAveraged;
        var converter = near.ConverterRmsVolts;
        var tau = DeltaSigmaNoise.CorrelationSeconds(design, cf);
        var rho = tau > 0 ? Math.Exp(-1 / (filter.DataRateHertz * tau)) : 0;
        var averaged = Math.Sqrt(converter * converter / n + analog * analog * Noise.ReadingNoiseAnalysis.CorrelatedFactor(n, rho));
        var lag = design.Noise.RampKelvinPerSecond is { } rate ? rate * DeltaSigmaNoise.LagSeconds(design, filter, tau) : 0;
        return near with
        {
            Celsius = celsius, AnalogRmsVolts = analog, SlowRmsVolts = analog, SingleRmsVolts = Math.Sqrt(analog * analog + converter * converter),
            AveragedRmsVolts = averaged, Correlation = rho, VoltsPerKelvin = cf.VoltsPerKelvin, RampLagKelvin = lag,
        };
    }
}
