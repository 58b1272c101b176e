namespace ThermVerify.Check;

/// <summary>
/// The temperature error at one point split by cause, in K (reported minus true): each voltage error is mapped
/// through the exact inverse in turn (buffer, DC loading, settling), then the ADC's rounding of the sample;
/// <see cref="RestKelvin"/> is what cannot be mapped (a voltage no sensor inside its range produces).
/// </summary>
public sealed record ErrorContributions(
    double QuantisationKelvin,
    double DcLoadingKelvin,
    double SettlingKelvin,
    double BufferKelvin,
    double RestKelvin);

/// <summary>
/// The simulated voltage errors at the pin by cause: leakage and bias currents through the source (static loading),
/// the average sampling current, the buffer's own error (offset, finite gain), and the sample's distance from the
/// DC pin voltage at the first conversion and in the steady state.
/// </summary>
public sealed record VoltageErrors(
    double StaticLoadingVolts,
    double AverageSamplingVolts,
    double BufferVolts,
    double FirstSettlingVolts,
    double SteadySettlingVolts)
{
    public double WorstSettlingVolts => Math.Abs(FirstSettlingVolts) >= Math.Abs(SteadySettlingVolts) ? FirstSettlingVolts : SteadySettlingVolts;

    public bool FirstIsWorse => Math.Abs(FirstSettlingVolts) >= Math.Abs(SteadySettlingVolts);
}

/// <summary>Closed-form estimates of the effects the ideal model leaves out, in volts at the ADC pin.</summary>
public sealed record EffectEstimates(
    double SourceOhms,
    double FixedDriftVolts,
    double LeakageVolts,
    double BiasCurrentVolts,
    double AverageSamplingVolts,
    double FirstConversionVolts,
    double SteadySettlingVolts)
{
    public double StaticVolts => FixedDriftVolts + LeakageVolts + BiasCurrentVolts;
}

/// <summary>Everything known at one temperature of the check.</summary>
public sealed record CheckPoint(
    double Celsius,
    double SensorOhms,
    double IdealVolts,
    double DividerVolts,
    double DcPinVolts,
    double FirstSampleVolts,
    double SteadySampleVolts,
    double? PrechargeVolts,
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
    /// <summary>The pin's DC voltage without the average sampling current.</summary>
    public double StaticPinVolts => DcPinVolts - Simulated.AverageSamplingVolts;

    public bool WithinBudget => double.IsFinite(ErrorKelvin) && Math.Abs(ErrorKelvin) <= BudgetKelvin;

    /// <summary>The sample the firmware converts in the worse case: first conversion or steady state.</summary>
    public double WorstSampleVolts => Math.Abs(FirstSampleVolts - IdealVolts) >= Math.Abs(SteadySampleVolts - IdealVolts) ? FirstSampleVolts : SteadySampleVolts;
}
