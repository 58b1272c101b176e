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
    /// <summary>Not known: every case above (last sample, 0 V, full scale) is checked and the worst reported at each temperature.</summary>
    Worst,
}

/// <summary>Where the converter's first code transition lies (IEEE Std 1241 code transition levels).</summary>
public enum FirstTransition
{
    /// <summary>At ½ LSB: code = round(V/Q), every bin but the ends is centred on code·Q (the IEEE Std 1241 ideal converter).</summary>
    HalfLsb,

    /// <summary>At 1 LSB: code = floor(V/Q), bin k spans k·Q to (k+1)·Q (a truncating converter; common practice, no source).</summary>
    OneLsb,
}

/// <summary>Which voltage of a code's bin the firmware takes the code to stand for.</summary>
public enum CodeInverse
{
    /// <summary>The middle of the bin: the quantisation error is centred on zero, ±Q/2.</summary>
    BinMiddle,

    /// <summary>The lower edge of the bin: the reading is biased by half a bin (error 0 to −Q in voltage).</summary>
    BinEdge,
}

/// <summary>
/// The converter's input as seen from the pin: a successive-approximation converter (the default), or a delta-sigma
/// converter when <see cref="DeltaSigma"/> is set. For a delta-sigma converter the acquisition keys of a
/// successive-approximation converter do not apply: <see cref="SampleRateHertz"/> is its data rate, the acquisition
/// time, sampling capacitance and switch resistance here are 0, and its input is described by <see cref="DeltaSigma"/>.
/// </summary>
public sealed record AdcSpec
{
    /// <summary>The delta-sigma converter's input and filter; null for a successive-approximation converter.</summary>
    public DeltaSigmaSpec? DeltaSigma { get; init; }
    /// <summary>The programmable-gain stage ahead of the converter; null: the pin drives the converter itself.</summary>
    public GainStageSpec? GainStage { get; init; }
    /// <summary>G, the programmable gain (1 without a gain stage): full scale at the pin is the reference over it.</summary>
    public double ProgrammableGain => GainStage?.Gain ?? 1;
    public ConverterKind Kind => DeltaSigma is null ? ConverterKind.SuccessiveApproximation : ConverterKind.DeltaSigma;
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
        Quantities.DoublingLaw.At(PinLeakageAmperes, PinLeakageCelsius, LeakageDoublingKelvin, celsius);
    public double OffsetErrorLsb { get; init; }
    /// <summary>Fraction of full scale.</summary>
    public double GainError { get; init; }
    public double InlLsb { get; init; }
    /// <summary>Reference tempco, fraction per kelvin, at the sign written; the reference sits at the board temperature (fixed reference only).</summary>
    public double ReferenceTempcoPerKelvin { get; init; }
    /// <summary>
    /// The charge the multiplexer's switch puts into the pin at each switch event (the acquisition window opening),
    /// coulombs, positive into the pin; taken as written (a successive-approximation converter only).
    /// </summary>
    public double ChargeInjectionCoulombs { get; init; }
    public PrechargeMode Precharge { get; init; } = PrechargeMode.Worst;
    /// <summary>Voltage left by the other channel; null: analyses take the worse of 0 V and full scale.</summary>
    public double? PrechargeVolts { get; init; }
    /// <summary>
    /// Whether each static error was written with a sign: without one it is a bound the check takes at the worse sign
    /// at each temperature; with one, at that sign (<see cref="SignWritten"/>). INL is always a bound.
    /// </summary>
    public bool OffsetErrorSigned { get; init; }
    public bool GainErrorSigned { get; init; }
    public bool PinLeakageSigned { get; init; }
    public bool ReferenceTempcoSigned { get; init; }
    /// <summary>The converter's transfer convention: the first code transition at ½ LSB (round) or 1 LSB (floor).</summary>
    public FirstTransition FirstTransition { get; init; } = FirstTransition.HalfLsb;
    /// <summary>The firmware's inverse: a code stands for the middle of its bin or its lower edge.</summary>
    public CodeInverse FirmwareInverse { get; init; } = CodeInverse.BinMiddle;
    /// <summary>The converter's own input-referred rms noise per conversion, as declared in LSB (null: not declared this way).</summary>
    public double? NoiseLsb { get; init; }
    /// <summary>The same as a voltage at the input (null: not declared this way). At most one of the two is set.</summary>
    public double? NoiseVolts { get; init; }
    /// <summary>Single-ended (the default), differential (signed codes) or pseudo-differential.</summary>
    public AdcInput Input { get; init; } = AdcInput.SingleEnded;
    /// <summary>The negative input's sampling network; null for a single-ended converter.</summary>
    public NegativeInputSpec? NegativeInput { get; init; }
    /// <summary>The input common-mode range, (V+ + V−)/2, the converter works over; null: not checked.</summary>
    public VoltageRange? CommonModeRange { get; init; }
    /// <summary>Codes are signed (two's complement) for a differential input.</summary>
    public bool IsBipolar => Input == AdcInput.Differential;
    /// <summary>The negative input's leakage at a temperature, doubling as the positive pin's.</summary>
    public double NegativeLeakageAmperesAt(double celsius) =>
        Quantities.DoublingLaw.At(NegativeInput?.PinLeakageAmperes ?? 0, PinLeakageCelsius, LeakageDoublingKelvin, celsius);

    /// <summary>Whether the design declares the converter's noise; otherwise <see cref="DesignDefaults.ConverterNoiseLsb"/> is assumed.</summary>
    public bool NoiseDeclared => NoiseLsb is not null || NoiseVolts is not null || DeltaSigma?.TableNoise is not null;
}
