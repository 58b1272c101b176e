using ThermVerify.Check.Buffer;
using ThermVerify.Design;
using ThermVerify.Firmware;
using ThermVerify.FrontEnd;
using ThermVerify.Sensors;

namespace ThermVerify.Check;

/// <summary>
/// The main job: the closed-form model against simulation over the check range. A DC temperature sweep gives the
/// pin voltage with leakage, bias and average sampling currents; sampling transients on a grid give the first and
/// steady-state samples; each point's sample goes through the ideal ADC and the firmware's inverse, and the
/// reported error is split into its causes. Findings and remedies follow from the points.
/// </summary>
internal static class FrontEndCheck
{
    public static CheckResult Run(FrontEndDesign design, CheckOptions? options = null)
    {
        options ??= new CheckOptions();
        var model = new ClosedFormModel(design);
        var temperatures = SensorTabulation.Grid(design.Check.Range, design.Check.StepKelvin).ToArray();
        var closedForm = temperatures.Select(model.At).ToArray();
        var settleVolts = design.Check.SettleLimitLsb * model.Adc.LsbVolts;
        var indices = SettlingGrid.Indices(temperatures.Length, options.MaximumSamplingPoints);

        var cases = PrechargeCases.For(design, model.Adc.ReferenceVolts).Select(pre =>
        {
            var dc = DcSweepCase.Run(design, pre, temperatures, options.Engine);
            var sampling = SettlingGrid.Run(design, pre, temperatures, indices, settleVolts, options.Threads, options.Cancel, options.Engine);
            // Settling offsets at every point, linear between grid points: the first sample from the settled pin,
            // the steady sample from the pin with the average sampling current.
            var first = SettlingGrid.Interpolate(temperatures, indices, g => sampling[g].FirstVolts - dc.StaticPinVolts[indices[g]]);
            var steady = SettlingGrid.Interpolate(temperatures, indices, g => sampling[g].SteadyVolts - dc.PinVolts[indices[g]]);
            return new CaseResult(dc, sampling, first, steady);
        }).ToList();

        var points = new CheckPoint[temperatures.Length];
        for (var i = 0; i < temperatures.Length; i++)
            points[i] = cases
                .Select(c => PointFor(design, model, closedForm[i], i, c, indices))
                .MaxBy(p => double.IsFinite(p.ErrorKelvin) ? Math.Abs(p.ErrorKelvin) : double.PositiveInfinity)!;

        var sampling = cases.SelectMany(c => c.Sampling).ToList();
        var findings = FindingRules.Evaluate(design, model, points, options);
        var buffer = design.Buffer is null ? null : Buffer.BufferCheck.Run(design, points, options);
        var worst = points.MaxBy(p => double.IsFinite(p.ErrorKelvin) ? Math.Abs(p.ErrorKelvin) : double.PositiveInfinity)!;
        var waveform = SamplingWaveform.Record(design, worst.Celsius, worst.PrechargeVolts, settleVolts, options.Engine);
        return new CheckResult(design, model.Sensor.Description, model.Adc, points, sampling, [.. findings, .. buffer?.Findings ?? []], waveform)
        {
            Buffer = buffer,
            Faults = FaultThresholdsOrNull(design),
        };
    }

    /// <summary>
    /// Splits the reported error by walking from the ideal voltage to the sample one cause at a time (buffer, DC
    /// loading, settling) and mapping each step through the exact inverse, then quantisation of the sample; the
    /// parts add up to the total, and "rest" holds what cannot be mapped (a voltage outside the sensor's range).
    /// </summary>
    private static ErrorContributions Split(ClosedFormModel model, ClosedFormPoint cf, double bufferVolts, double settlingVolts, double sampleVolts, double error)
    {
        var afterBuffer = cf.IdealVolts + bufferVolts;
        var afterLoading = sampleVolts - settlingVolts;
        double Step(double from, double to) => model.CelsiusAtVolts(to) - model.CelsiusAtVolts(from);
        var buffer = Step(cf.IdealVolts, afterBuffer);
        var loading = Step(afterBuffer, afterLoading);
        var settling = Step(afterLoading, sampleVolts);
        var quantisation = model.ReportedCelsius(model.Adc.Code(sampleVolts)) - model.CelsiusAtVolts(sampleVolts);
        var parts = new[] { quantisation, loading, settling, buffer }.Select(k => double.IsFinite(k) ? k : 0).ToArray();
        return new ErrorContributions(parts[0], parts[1], parts[2], parts[3], error - parts.Sum());
    }

    /// <summary>
    /// The codes an open or shorted sensor or fixed resistor produce, and thresholds with margin; none when the
    /// tolerances leave no room between a fault and a healthy reading (the table command explains why).
    /// </summary>
    private static FaultThresholds? FaultThresholdsOrNull(FrontEndDesign design)
    {
        try
        {
            return FaultAnalysis.Thresholds(FirmwareFromDesign.Model(design, correctForLoading: false), FirmwareFromDesign.Tolerances(design));
        }
        catch (FirmwareInputException)
        {
            return null;
        }
    }

    private sealed record CaseResult(DcSweepCase Dc, SamplingOutcome[] Sampling, double[] FirstOffsetVolts, double[] SteadyOffsetVolts);

    private static CheckPoint PointFor(FrontEndDesign design, ClosedFormModel model, ClosedFormPoint cf, int i, CaseResult c, int[] indices)
    {
        var dc = c.Dc;
        // The first conversion starts from the settled pin (no sampling yet); the steady state carries the average
        // sampling current. Each sample's settling error is measured from its own starting level.
        var first = dc.StaticPinVolts[i] + c.FirstOffsetVolts[i];
        var steady = dc.PinVolts[i] + c.SteadyOffsetVolts[i];
        var firstIsWorse = Math.Abs(first - cf.IdealVolts) >= Math.Abs(steady - cf.IdealVolts);
        var worstSample = firstIsWorse ? first : steady;

        var code = model.Adc.Code(worstSample);
        var reported = model.ReportedCelsius(code);
        var error = reported - cf.Celsius;
        var gain = model.BufferGain;
        var volts = new VoltageErrors(
            StaticLoadingVolts: gain * dc.DividerVolts[i] - cf.IdealVolts + (dc.StaticPinVolts[i] - dc.BufferVolts[i]),
            AverageSamplingVolts: dc.PinVolts[i] - dc.StaticPinVolts[i],
            BufferVolts: dc.BufferVolts[i] - gain * dc.DividerVolts[i],
            FirstSettlingVolts: c.FirstOffsetVolts[i],
            SteadySettlingVolts: c.SteadyOffsetVolts[i]);
        var contributions = Split(model, cf, volts.BufferVolts, worstSample - dc.PinVolts[i] + (firstIsWorse ? volts.AverageSamplingVolts : 0),
            worstSample, error);
        var toKelvin = 1 / cf.VoltsPerKelvin;

        return new CheckPoint(cf.Celsius, cf.SensorOhms, cf.IdealVolts, dc.DividerVolts[i], dc.PinVolts[i], first, steady,
            dc.PrechargeVolts, indices.Contains(i), code, reported, error, design.Check.BudgetAt(cf.Celsius),
            model.Adc.LsbVolts * Math.Abs(toKelvin), contributions, volts, EffectEstimator.At(design, cf, dc.PinVolts[i], dc.PrechargeVolts));
    }
}
