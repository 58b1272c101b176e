using ThermVerify.FrontEnd;

namespace ThermVerify.Check;

/// <summary>
/// The temperature error at one point split by cause, in K (reported minus true). The voltage is walked from the
/// closed form to the converted code one cause at a time, each step mapped through the exact inverse: the buffer's
/// own errors, DC loading, the reservoir's recovery from the average sampling current, the settling of the sample,
/// the sensor's self-heating, the converter's static errors (offset, gain, INL, reference), then the rounding to a
/// code. <see cref="RestKelvin"/> is what cannot be mapped (a voltage no sensor inside its range produces). Each
/// column is the effect of the finding of the same name, so a finding's size is its column at its worst point.
/// </summary>
public sealed record ErrorContributions(
    double QuantisationKelvin,
    double ConverterKelvin,
    double DcLoadingKelvin,
    double RecoveryKelvin,
    double SettlingKelvin,
    double BufferKelvin,
    double SelfHeatingKelvin,
    double RestKelvin)
{
    /// <summary>The columns in the order the table prints them, with the id of the finding each belongs to.</summary>
    public IReadOnlyList<(string Column, string FindingId, double Kelvin)> Columns =>
    [
        ("quantisation", "resolution", QuantisationKelvin),
        ("converter", "converter", ConverterKelvin),
        ("DC loading", "dc-loading", DcLoadingKelvin),
        ("recovery", "reservoir-recovery", RecoveryKelvin),
        ("settling", "settling", SettlingKelvin),
        ("buffer", "buffer-static", BufferKelvin),
        ("self-heating", "self-heating", SelfHeatingKelvin),
        ("rest", "", RestKelvin),
    ];

    public double Sum => QuantisationKelvin + ConverterKelvin + DcLoadingKelvin + RecoveryKelvin + SettlingKelvin + BufferKelvin + SelfHeatingKelvin + RestKelvin;
}

/// <summary>
/// The same walk in volts at the pin, for the reading the check converts: the buffer's own error, DC loading (pin
/// leakage, fixed-resistor drift), recovery (the average sampling current of a reservoir; zero for a first
/// conversion), settling (the sample against the level it starts from), self-heating, and the converter's errors as
/// the voltage their code shift stands for. The first and steady settling offsets of that precharge case are kept
/// beside it.
/// </summary>
public sealed record VoltageErrors(
    double BufferVolts,
    double DcLoadingVolts,
    double RecoveryVolts,
    double SettlingVolts,
    double SelfHeatingVolts,
    double ConverterVolts,
    double FirstSettlingVolts,
    double SteadySettlingVolts,
    double AverageSamplingVolts)
{
    public double WorstSettlingVolts => Math.Abs(FirstSettlingVolts) >= Math.Abs(SteadySettlingVolts) ? FirstSettlingVolts : SteadySettlingVolts;
}

/// <summary>Closed-form estimates of the effects the ideal model leaves out, in volts at the ADC pin.</summary>
public sealed record EffectEstimates(
    double SourceOhms,
    double FixedDriftVolts,
    double LeakageVolts,
    double BufferOffsetVolts,
    double BiasCurrentVolts,
    double AverageSamplingVolts,
    double FirstConversionVolts,
    double SteadySettlingVolts,
    double SelfHeatingVolts)
{
    /// <summary>
    /// A current excitation's own error at the pin on the converter's scale: the source's drift and output resistance,
    /// and with a reference resistor that resistor's drift and the reference input's loading (the current cancels).
    /// </summary>
    public double ExcitationVolts { get; init; }

    /// <summary>
    /// The sensor's leads (with a current source): 2 wires add 2·I·R_L, 3 wires leave the mismatch term −m·I·R_L, 4 wires
    /// the input current times the sense lead, −I_in·R_L (each lead at the leads' temperature).
    /// </summary>
    public double LeadVolts { get; init; }

    /// <summary>The leaking clamp diode's reverse current through the resistance the pin sees (protection.clamp_leakage).</summary>
    public double ClampVolts { get; init; }

    /// <summary>The insulation resistance pulling the sensor's node towards its potential (protection.insulation_resistance).</summary>
    public double InsulationVolts { get; init; }

    /// <summary>
    /// A delta-sigma converter's input, its average load through the resistance the pin sees: −V·R_s/(R_s + R_eq) with
    /// R_eq = 1/(f_mod·C) unbuffered (Johns &amp; Martin), −I_in·R_s buffered (Ohm's law); zero for other converters.
    /// </summary>
    public double InputLoadVolts { get; init; }

    /// <summary>DC loading: leakage, the fixed resistor's drift, a current excitation's own error and its leads, the protection parts, a delta-sigma input's load.</summary>
    public double LoadingVolts => FixedDriftVolts + LeakageVolts + ExcitationVolts + LeadVolts + ClampVolts + InsulationVolts + InputLoadVolts;

    /// <summary>The buffer: offset with its drift, and the bias current through the divider.</summary>
    public double BufferVolts => BufferOffsetVolts + BiasCurrentVolts;
}

/// <summary>
/// Everything known at one temperature of the check, for the reading the check converts there: the worst over the
/// precharge cases, the first or the steady sample, and the converter's INL sign.
/// </summary>
public sealed record CheckPoint(
    double Celsius,
    double SensorOhms,
    double IdealVolts,
    double DividerVolts,
    double StaticPinVolts,
    double DcPinVolts,
    double FirstSampleVolts,
    double SteadySampleVolts,
    double SampleVolts,
    PrechargeCase Precharge,
    bool FirstConversion,
    string Corner,
    bool SamplingSimulated,
    int Code,
    double ReportedCelsius,
    double ErrorKelvin,
    double BudgetKelvin,
    double KelvinPerLsb,
    ErrorContributions Contributions,
    VoltageErrors Simulated,
    EffectEstimates Estimates)
{
    public double? PrechargeVolts => Precharge.Volts;

    /// <summary>The noise of the reading here (null only for a point made without a noise analysis).</summary>
    public Noise.ReadingNoise? Noise { get; init; }

    /// <summary>What noise takes of the budget here: ±k·σ of the reading in K (k: noise.coverage).</summary>
    public double NoiseKelvin => Noise?.CoveredKelvin ?? 0;

    /// <summary>What the averaging and the filter's lag take of the budget on the declared ramp (zero without noise.ramp_rate).</summary>
    public double RampLagKelvin => Noise?.RampLagKelvin ?? 0;

    /// <summary>
    /// Within the budget when the static error, the noise at its coverage and the lag on the declared ramp add up to no
    /// more than the budget (linear addition: each can reach its size in the same reading).
    /// </summary>
    public bool WithinBudget => double.IsFinite(ErrorKelvin) && Math.Abs(ErrorKelvin) + NoiseKelvin + RampLagKelvin <= BudgetKelvin;

    /// <summary>Which sample the firmware converts here, in words.</summary>
    public string SampleKind => FirstConversion ? "first" : "steady";
}
