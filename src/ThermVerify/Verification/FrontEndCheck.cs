using ThermVerify.Design;
using ThermVerify.Sensors;

namespace ThermVerify.Verification;

/// <summary>
/// The main job: the closed-form model against simulation over the check range. A DC temperature sweep gives the
/// pin voltage with leakage, bias and average sampling currents; sampling transients on a grid give the first and
/// steady-state samples; each point's sample goes through the ideal ADC and the firmware's inverse, and the
/// reported error is split into its causes. Findings and remedies follow from the points.
/// </summary>
public static class FrontEndCheck
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
            var dc = DcSweepCase.Run(design, pre, temperatures);
            var sampling = SettlingGrid.Run(design, pre, temperatures, indices, settleVolts, options.Threads, options.Cancel);
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
        return new CheckResult(design, model.Sensor.Description, model.Adc, points, sampling, findings);
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
        var quantisation = model.ReportedErrorKelvin(cf.IdealVolts, cf.Celsius);
        var toKelvin = 1 / cf.VoltsPerKelvin;
        var loading = (volts.StaticLoadingVolts + (firstIsWorse ? 0 : volts.AverageSamplingVolts)) * toKelvin;
        var settling = (firstIsWorse ? volts.FirstSettlingVolts : volts.SteadySettlingVolts) * toKelvin;
        var buffer = volts.BufferVolts * toKelvin;
        var contributions = new ErrorContributions(quantisation, loading, settling, buffer, error - quantisation - loading - settling - buffer);

        return new CheckPoint(cf.Celsius, cf.SensorOhms, cf.IdealVolts, dc.DividerVolts[i], dc.PinVolts[i], first, steady,
            dc.PrechargeVolts, indices.Contains(i), code, reported, error, design.Check.BudgetAt(cf.Celsius),
            model.Adc.LsbVolts * Math.Abs(toKelvin), contributions, volts, EffectEstimator.At(design, cf, dc.PinVolts[i], dc.PrechargeVolts));
    }
}
