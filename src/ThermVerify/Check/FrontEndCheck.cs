using ThermVerify.Check.Remedies;
using ThermVerify.Design;
using ThermVerify.Firmware;
using ThermVerify.FrontEnd;
using ThermVerify.Sensors;

namespace ThermVerify.Check;

/// <summary>
/// The main job: the closed-form model against simulation over the check range. DC temperature sweeps give the pin
/// voltage with the buffer's errors, leakage and drift, and the average sampling current; sampling transients on a
/// grid give the first and steady samples for every precharge case; the one error model (<see cref="ErrorModel"/>)
/// adds the sensor's self-heating and the converter's errors and picks the worst reading at each temperature, whose
/// error is split into its causes. Findings follow from the points, each judged on its own size against the budget;
/// every remedy is proven by checking a copy of the design with it applied (<see cref="RemedyFinder"/>).
/// </summary>
internal static class FrontEndCheck
{
    public static CheckResult Run(FrontEndDesign design, CheckOptions? options = null)
    {
        options ??= new CheckOptions();
        // The remedy search checks copies of the design, and many changes leave the analog front end as it was: each
        // netlist is simulated once for the whole run (MemoizingEngine gives back exactly what a new run would).
        if (options.ComputeRemedies)
            options = options with { Engine = MemoizingEngine.Wrap(options.Engine) };
        if (design.Adc.Kind == ConverterKind.DeltaSigma) return DeltaSigma.DeltaSigmaCheck.Run(design, options);
        var temperatures = SensorTabulation.Grid(design.Check.Range, design.Check.StepKelvin).ToArray();
        var evaluation = CheckEvaluation.Run(design, temperatures, options).Refined(options);
        var points = evaluation.Points;
        var findings = FindingRules.Evaluate(design, evaluation.Model, points).ToList();
        findings.AddRange(ComplianceRule.Evaluate(design, evaluation.Dc, evaluation.Temperatures, points, evaluation.Model.Adc.LsbVolts));
        findings.AddRange(CommonModeRule.Evaluate(design, evaluation.Dc, evaluation.Temperatures, points, evaluation.Model.Adc.LsbVolts));
        findings.AddRange(AmplifierRangeRule.Evaluate(design, evaluation.Dc, evaluation.Temperatures, points, evaluation.Model.Adc.LsbVolts));
        findings.AddRange(GainRangeRule.Evaluate(design, evaluation.Dc, evaluation.Temperatures, points));
        findings.AddRange(ChargeInjectionRule.Evaluate(design, points, evaluation.Model.Adc.LsbVolts, options));
        var buffer = design.Buffer is null ? null : Buffer.BufferCheck.Run(design, points, options);
        findings.AddRange(buffer?.Findings ?? []);
        IReadOnlyList<Finding> ordered = FindingRules.OverBudget(evaluation.Model, points, findings) is { } budget ? [budget, .. findings] : findings;

        var worst = points[ErrorModel.WorstIndex([.. points.Select(p => p.ErrorKelvin)])];
        var waveform = options.RecordWaveform
            ? SamplingWaveform.Record(design, worst.Celsius, worst.PrechargeVolts, evaluation.SettleVolts, options.Engine)
            : new SamplingWaveform(worst.Celsius, worst.PrechargeVolts, design.Adc.AcquisitionTimeSeconds, []);
        var result = new CheckResult(design, evaluation.Model.Sensor.Description, evaluation.Model.Adc, points, evaluation.Offsets.Outcomes,
            ordered, waveform)
        {
            Buffer = buffer,
            Faults = FaultThresholdsOrNull(design, out var omitted),
            FaultsOmitted = omitted,
            PrechargeCases = evaluation.Cases,
            Noise = Noise.ReadingNoiseAnalysis.Summary(design, Noise.ReadingNoiseAnalysis.ReportTemperatures(design.Check.Range), options.Engine),
        };
        // A remedy is only ever shown proven: without the search, the buffer analyses' own figures are not shown as remedies either.
        return options.ComputeRemedies ? RemedyFinder.Attach(result, options)
            : result with { Findings = [.. result.Findings.Select(f => f with { Remedies = [] })] };
    }

    /// <summary>
    /// The codes an open or shorted sensor or fixed resistor produce, and thresholds with margin; none, with the reason,
    /// where the firmware model is not made for the design's shape yet or the tolerances leave no room between a fault
    /// and a healthy reading (the table command explains that case in full).
    /// </summary>
    internal static FaultThresholds? FaultThresholdsOrNull(FrontEndDesign design, out string? omitted)
    {
        omitted = null;
        try
        {
            return FaultAnalysis.Thresholds(FirmwareFromDesign.Model(design, correctForLoading: false), FirmwareFromDesign.Tolerances(design));
        }
        catch (FirmwareInputException e)
        {
            omitted = e.Message;
            return null;
        }
    }
}
