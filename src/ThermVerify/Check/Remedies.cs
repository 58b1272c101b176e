using ThermVerify.Components;
using ThermVerify.Design;
using ThermVerify.FrontEnd;

namespace ThermVerify.Check;

/// <summary>
/// Remedies computed by simulation: each changes one value of the design and searches (bisection on the simulated
/// sample at the worst temperature and precharge) for the value that just meets ½ LSB. A closed-form estimate is
/// given beside each as a cross-check.
/// </summary>
internal static class Remedies
{
    /// <summary>The settling error of a design at one temperature and precharge: the worse of first and steady sample, minus the DC pin voltage.</summary>
    public static double SettlingErrorVolts(FrontEndDesign design, double celsius, double? prechargeVolts, double settleVolts,
        ICheckEngine? engine = null)
    {
        var outcome = SamplingRun.Run(design, celsius, prechargeVolts, settleVolts, engine: engine);
        var dc = DcSweepCase.Run(design, prechargeVolts, [celsius], engine).PinVolts[0];
        return Math.Max(Math.Abs(outcome.FirstVolts - dc), Math.Abs(outcome.SteadyVolts - dc));
    }

    /// <summary>The charge-sharing step of the first conversion from a settled pin: first sample minus the static DC pin voltage.</summary>
    public static double FirstConversionStepVolts(FrontEndDesign design, double celsius, double? prechargeVolts, double settleVolts,
        ICheckEngine? engine = null)
    {
        var first = SamplingRun.FirstSampleVolts(design, celsius, prechargeVolts, settleVolts, engine);
        var dc = DcSweepCase.Run(design, null, [celsius], engine).PinVolts[0];
        return Math.Abs(first - dc);
    }

    public static Remedy? ShortestAcquisition(FrontEndDesign design, CheckPoint worst, double allowedVolts, double settleVolts, double estimateSeconds,
        ICheckEngine? engine = null)
    {
        var period = 1 / design.Adc.SampleRateHertz;
        var found = MonotoneSearch.SmallestPassing(Math.Min(1e-9, design.Adc.AcquisitionTimeSeconds), 0.95 * period,
            t => SettlingErrorVolts(WithAcquisition(design, t), worst.Celsius, worst.PrechargeVolts, settleVolts, engine) <= allowedVolts);
        var method = $"bisection on the simulated sample at {worst.Celsius:0.##} °C, {PrechargeCases.Describe(worst.PrechargeVolts)}; " +
                     $"single-pole estimate {Format(estimateSeconds)} s";
        return found is { } t
            ? new Remedy("adc.acquisition_time", "lengthen the acquisition time to at least", t, "s", method)
            : new Remedy("adc.acquisition_time", "no acquisition time within 95 % of the sample period settles to ½ LSB; add a reservoir capacitor or a buffer", null, "s", method);
    }

    public static Remedy? SmallestReservoir(FrontEndDesign design, CheckPoint worst, double allowedVolts, double settleVolts,
        ICheckEngine? engine = null)
    {
        var cSample = design.Adc.SamplingCapacitanceFarads;
        var found = MonotoneSearch.SmallestPassing(cSample * 1e-2, cSample * 1e7,
            c => FirstConversionStepVolts(WithReservoir(design, c), worst.Celsius, worst.PrechargeVolts, settleVolts, engine) <= allowedVolts);
        var step = worst.PrechargeVolts is { } pre ? pre - worst.StaticPinVolts : 0;
        var estimate = SamplingFormulas.MinimumReservoirFarads(step, allowedVolts, cSample) - design.Adc.PinCapacitanceFarads;
        var method = $"bisection on the simulated first conversion at {worst.Celsius:0.##} °C, {PrechargeCases.Describe(worst.PrechargeVolts)}; " +
                     $"charge-sharing estimate C_sh·(|ΔV|/ε − 1) − C_pin = {Farads(estimate)}";
        if (found is not { } c) return null;
        var standard = ESeries.E12.Contains(c) ? c : ESeries.E12.NextHigher(c);
        return new Remedy("filter.reservoir_capacitor", $"fit a reservoir capacitor (next E12 value {Farads(standard)}) of at least", c, "F", method);
    }

    public static Remedy HighestSampleRate(FrontEndDesign design, CheckPoint worst, double allowedVolts)
    {
        var step = (worst.PrechargeVolts ?? worst.IdealVolts) - worst.IdealVolts;
        var rate = SamplingFormulas.MaximumSampleRateHertz(step, allowedVolts, worst.Estimates.SourceOhms, design.Adc.SamplingCapacitanceFarads);
        return new Remedy("adc.sample_rate", "lower this channel's sample rate to at most", rate, "Hz",
            $"switched-capacitor model R_eq = 1/(f_s·C_sh) (Johns & Martin) at {worst.Celsius:0.##} °C, {PrechargeCases.Describe(worst.PrechargeVolts)}");
    }

    public static Remedy BufferBandwidth(FrontEndDesign design, double stepVolts, double allowedVolts)
    {
        var gbw = SamplingFormulas.FollowerGainBandwidthFor(stepVolts, allowedVolts, design.Adc.AcquisitionTimeSeconds);
        return new Remedy("buffer.gain_bandwidth", "or buffer the divider with an op-amp follower of gain-bandwidth at least", gbw, "Hz",
            "single-pole follower, τ = 1/(2π·GBW), settling the step within the acquisition time (op-amp textbook result, from memory)");
    }

    public static Remedy LargestSourceResistance(double allowedVolts, double leakageAmps) =>
        new("source resistance", "keep the resistance seen by the pin (divider Thevenin + filter) at most", allowedVolts / Math.Abs(leakageAmps), "Ω",
            "Ohm's law: leakage × source resistance within ½ LSB at the worst temperature");

    public static FrontEndDesign WithAcquisition(FrontEndDesign design, double seconds) =>
        design with { Adc = design.Adc with { AcquisitionTimeSeconds = seconds } };

    public static FrontEndDesign WithReservoir(FrontEndDesign design, double farads) =>
        design with { Filter = design.Filter with { ReservoirCapacitorFarads = farads } };

    private static string Format(double value) => value.ToString("G3", System.Globalization.CultureInfo.InvariantCulture);

    private static string Farads(double value) => Quantities.EngineeringFormat.Format(value, Quantities.UnitKind.Farad, 3);
}
