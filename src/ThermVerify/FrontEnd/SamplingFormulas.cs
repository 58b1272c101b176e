namespace ThermVerify.FrontEnd;

/// <summary>
/// Closed-form estimates of what the ideal divider model leaves out at a sampling ADC input. Each is the
/// textbook first-order result; the verification puts it beside the simulated value.
/// </summary>
internal static class SamplingFormulas
{
    /// <summary>Residual of a single-pole acquisition: ΔV·e^(−t/τ), τ = (R_source + R_switch)·C_sample.</summary>
    public static double SinglePoleResidualVolts(double stepVolts, double acquisitionSeconds, double tauSeconds) =>
        stepVolts * Math.Exp(-acquisitionSeconds / tauSeconds);

    /// <summary>Shortest acquisition for a single pole to settle a step to within the allowed error: τ·ln(|ΔV|/ε).</summary>
    public static double AcquisitionSecondsFor(double stepVolts, double allowedVolts, double tauSeconds) =>
        Math.Abs(stepVolts) <= allowedVolts ? 0 : tauSeconds * Math.Log(Math.Abs(stepVolts) / allowedVolts);

    /// <summary>Charge sharing: a sampling capacitor ΔV away from a reservoir moves the pin by ΔV·C_sh/(C_sh + C_ext).</summary>
    public static double KickbackStepVolts(double differenceVolts, double samplingFarads, double reservoirFarads) =>
        differenceVolts * samplingFarads / (samplingFarads + reservoirFarads);

    /// <summary>
    /// The steady sample of a reservoir that shares its charge with a capacitor precharged to V_pre at every conversion
    /// and recovers towards the source V_s through R_s between them (charge conservation, then first-order recovery,
    /// elementary): with α = C_sh/(C_sh + C_ext) and a = e^(−T/τ), τ = R_s·C_ext, the pin just before a sample settles
    /// to V_b = (V_s·(1 − a) + α·a·V_pre)/(1 − (1 − α)·a), and the sample is (1 − α)·V_b + α·V_pre. It holds when the
    /// switch settles within the acquisition and the source barely refills the reservoir during it (t_acq ≪ τ).
    /// </summary>
    public static double SteadySampleVolts(double sourceVolts, double prechargeVolts, double samplingFarads, double reservoirFarads,
        double tauSeconds, double periodSeconds)
    {
        var alpha = samplingFarads / (samplingFarads + reservoirFarads);
        var a = tauSeconds > 0 ? Math.Exp(-periodSeconds / tauSeconds) : 0;
        var before = (sourceVolts * (1 - a) + alpha * a * prechargeVolts) / (1 - (1 - alpha) * a);
        return (1 - alpha) * before + alpha * prechargeVolts;
    }

    /// <summary>Smallest reservoir that keeps the charge-sharing step within ε: C_sh·(|ΔV|/ε − 1).</summary>
    public static double MinimumReservoirFarads(double differenceVolts, double allowedVolts, double samplingFarads) =>
        Math.Max(0, samplingFarads * (Math.Abs(differenceVolts) / allowedVolts - 1));

    /// <summary>Equivalent resistance of a capacitor switched at f_s: R_eq = 1/(f_s·C) (Johns &amp; Martin).</summary>
    public static double SwitchedCapacitorOhms(double sampleRateHertz, double samplingFarads) => 1 / (sampleRateHertz * samplingFarads);

    /// <summary>
    /// Steady deficit at a reservoir fed through R_s when every sample drags the pin towards a precharge level
    /// ΔV away: charge balance gives ΔV·R_s/(R_s + R_eq).
    /// </summary>
    public static double SwitchedCapacitorErrorVolts(double differenceVolts, double sourceOhms, double sampleRateHertz, double samplingFarads) =>
        differenceVolts * sourceOhms / (sourceOhms + SwitchedCapacitorOhms(sampleRateHertz, samplingFarads));

    /// <summary>Highest sample rate that keeps that deficit within ε: 1/(C_sh·R_s·(|ΔV|/ε − 1)).</summary>
    public static double MaximumSampleRateHertz(double differenceVolts, double allowedVolts, double sourceOhms, double samplingFarads) =>
        Math.Abs(differenceVolts) <= allowedVolts ? double.PositiveInfinity
            : 1 / (samplingFarads * sourceOhms * (Math.Abs(differenceVolts) / allowedVolts - 1));

    /// <summary>Gain-bandwidth a follower needs for its own single pole, τ = 1/(2π·GBW), to settle within t_acq.</summary>
    public static double FollowerGainBandwidthFor(double stepVolts, double allowedVolts, double acquisitionSeconds) =>
        Math.Abs(stepVolts) <= allowedVolts ? 0 : Math.Log(Math.Abs(stepVolts) / allowedVolts) / (2 * Math.PI * acquisitionSeconds);
}
