namespace ThermVerify.Design;

/// <summary>What the sampling capacitor holds when the acquisition window opens.</summary>
public enum PrechargeMode
{
    /// <summary>The previous sample of this same channel (a dedicated channel).</summary>
    LastSample,
    /// <summary>Another channel's voltage (a multiplexed ADC); see <see cref="AdcSpec.PrechargeVolts"/>.</summary>
    OtherChannel,
    /// <summary>0 V: the converter discharges the capacitor between samples.</summary>
    Discharged,
}

/// <summary>A successive-approximation ADC input as seen from the pin.</summary>
public sealed record AdcSpec
{
    public required int Bits { get; init; }
    /// <summary>Null when the reference is the divider's excitation (ratiometric).</summary>
    public double? ReferenceVolts { get; init; }
    public bool IsRatiometric => ReferenceVolts is null;
    public double ReferenceTolerance { get; init; } = DesignDefaults.Tolerance;
    public required double SampleRateHertz { get; init; }
    public required double AcquisitionTimeSeconds { get; init; }
    public required double SamplingCapacitanceFarads { get; init; }
    public required double SwitchResistanceOhms { get; init; }
    public double PinCapacitanceFarads { get; init; }
    /// <summary>Positive flows into the pin (pulls the node down).</summary>
    public double PinLeakageAmperes { get; init; }
    /// <summary>Temperature at which <see cref="PinLeakageAmperes"/> is given.</summary>
    public double PinLeakageCelsius { get; init; } = DesignDefaults.PinLeakageCelsius;
    /// <summary>The leakage doubles every this many kelvin.</summary>
    public double LeakageDoublingKelvin { get; init; } = DesignDefaults.LeakageDoublingKelvin;

    /// <summary>Pin leakage at a temperature: it doubles every <see cref="LeakageDoublingKelvin"/> (common practice, no source).</summary>
    public double PinLeakageAmperesAt(double celsius) =>
        PinLeakageAmperes * Math.Pow(2, (celsius - PinLeakageCelsius) / LeakageDoublingKelvin);
    public double OffsetErrorLsb { get; init; }
    /// <summary>Fraction of full scale.</summary>
    public double GainError { get; init; }
    public double InlLsb { get; init; }
    public PrechargeMode Precharge { get; init; } = PrechargeMode.LastSample;
    /// <summary>Voltage left by the other channel; null: analyses take the worse of 0 V and full scale.</summary>
    public double? PrechargeVolts { get; init; }
}
