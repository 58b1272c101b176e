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
