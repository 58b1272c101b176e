using ThermVerify.Quantities;

namespace ThermVerify.Design;

/// <summary>Reads [adc].</summary>
internal static class AdcReader
{
    private static readonly Dictionary<string, PrechargeMode> Precharges = new()
    {
        ["last-sample"] = PrechargeMode.LastSample,
        ["other-channel"] = PrechargeMode.OtherChannel,
        ["discharged"] = PrechargeMode.Discharged,
        ["worst"] = PrechargeMode.Worst,
    };

    private static readonly Dictionary<string, FirstTransition> Transitions = new()
    {
        ["half-lsb"] = FirstTransition.HalfLsb,
        ["one-lsb"] = FirstTransition.OneLsb,
    };

    private static readonly Dictionary<string, CodeInverse> Inverses = new()
    {
        ["bin-middle"] = CodeInverse.BinMiddle,
        ["bin-edge"] = CodeInverse.BinEdge,
    };

    private static readonly string[] Keys =
    [
        "bits", "reference", "reference_tolerance", "sample_rate", "acquisition_time", "sampling_capacitance",
        "switch_resistance", "pin_capacitance", "pin_leakage", "pin_leakage_temperature", "leakage_doubling",
        "offset_error", "gain_error", "inl", "precharge", "precharge_voltage", "reference_tempco", "first_transition",
        "firmware_inverse", "noise", "kind", "input", "common_mode_range", "negative_sampling_capacitance", "negative_switch_resistance",
        "negative_pin_capacitance", "negative_pin_leakage", "negative_precharge_voltage",
        "charge_injection", .. GainStageReader.Keys,
    ];

    private static readonly Dictionary<string, AdcInput> Inputs = new()
    {
        ["single-ended"] = AdcInput.SingleEnded,
        ["differential"] = AdcInput.Differential,
        ["pseudo-differential"] = AdcInput.PseudoDifferential,
    };

    private static readonly string[] DifferentialKeys =
        ["common_mode_range", "negative_sampling_capacitance", "negative_switch_resistance", "negative_pin_capacitance", "negative_pin_leakage",
         "negative_precharge_voltage"];

    private static readonly Dictionary<string, ConverterKind> Kinds = new()
    {
        ["successive-approximation"] = ConverterKind.SuccessiveApproximation,
        ["delta-sigma"] = ConverterKind.DeltaSigma,
    };

    public static AdcSpec Read(TomlSection s)
    {
        var kind = s.Choice("kind", Kinds) ?? ConverterKind.SuccessiveApproximation;
        if (kind == ConverterKind.DeltaSigma)
        {
            s.AllowOnly([.. Keys.Except(DeltaSigmaReader.SuccessiveApproximationKeys).Except(DifferentialKeys).Except(["input"]), .. DeltaSigmaReader.OwnKeys],
                key => DeltaSigmaReader.SuccessiveApproximationKeys.Contains(key) || DifferentialKeys.Contains(key) || key == "input"
                    ? $"{key} applies only to a successive-approximation converter; a delta-sigma converter samples its input at modulator_rate and reads at data_rate. Remove it, or set kind = \"successive-approximation\"."
                    : null);
            var deltaSigma = DeltaSigmaReader.Read(s);
            // The acquisition window of a successive-approximation converter does not exist here: its fields are 0 and
            // every analysis built on them branches to the delta-sigma one before using them; the sample rate is the data rate.
            return Common(s) with
            {
                DeltaSigma = deltaSigma,
                GainStage = GainStageReader.Read(s, deltaSigma.Gain),
                SampleRateHertz = deltaSigma.DataRateHertz,
                Precharge = PrechargeMode.LastSample,
            };
        }
        s.AllowOnly(Keys, key => DeltaSigmaReader.OwnKeys.Contains(key)
            ? $"{key} applies only to a delta-sigma converter. Remove it, or set kind = \"delta-sigma\" (docs/design-file.md)."
            : null);
        var common = Common(s);
        var sampleRate = s.RequiredValue("sample_rate", Bound.Positive, "Write sample_rate = \"10 kHz\" (conversions per second on this channel's converter).", UnitKind.Hertz);
        var acquisition = s.RequiredValue("acquisition_time", Bound.Positive, "Write acquisition_time = \"1.5 us\".", UnitKind.Second);
        if (acquisition >= 1 / sampleRate)
            throw s.ErrorAtValue("acquisition_time", $"{EngineeringFormat.Format(acquisition, UnitKind.Second)} is not shorter than the sample period {EngineeringFormat.Format(1 / sampleRate, UnitKind.Second)}",
                "The acquisition window must fit inside one sample period: shorten it or lower sample_rate.");
        var precharge = s.Choice("precharge", Precharges) ?? PrechargeMode.Worst;
        var prechargeVolts = s.Quantity("precharge_voltage", Bound.Any, UnitKind.Volt)?.Value;
        if (prechargeVolts is not null && precharge != PrechargeMode.OtherChannel)
            throw s.ErrorAtKey("precharge_voltage", "precharge_voltage applies only to precharge = \"other-channel\"", "Remove it, or set precharge = \"other-channel\".");
        var (input, negative, commonMode) = ReadInputs(s);
        var injection = s.ValueOr("charge_injection", 0, Bound.Any, UnitKind.Coulomb);
        if (injection != 0 && s.Has("gain") | s.Has("pga_gain_error") | s.Has("pga_input_current"))
            throw s.ErrorAtKey("charge_injection", "charge_injection is not modelled behind a programmable-gain stage yet (the sampling capacitor is behind the amplifier, the multiplexer in front of it)",
                "Remove charge_injection, or the gain stage's keys (gain, pga_gain_error, pga_input_current).");
        return common with
        {
            Input = input,
            NegativeInput = negative,
            CommonModeRange = commonMode,
            ChargeInjectionCoulombs = injection,
            SampleRateHertz = sampleRate,
            AcquisitionTimeSeconds = acquisition,
            SamplingCapacitanceFarads = s.RequiredValue("sampling_capacitance", Bound.Positive, "Write sampling_capacitance = \"5 pF\".", UnitKind.Farad),
            SwitchResistanceOhms = s.RequiredValue("switch_resistance", Bound.NonNegative, "Write switch_resistance = \"1 kohm\" (sampling switch on-resistance).", UnitKind.Ohm),
            Precharge = precharge,
            PrechargeVolts = prechargeVolts,
            GainStage = GainStageReader.Read(s, null),
        };
    }

    /// <summary>
    /// The input: single-ended, or two sampled inputs whose negative one has its own sampling network (each value
    /// defaulting to the positive input's) and a common-mode range; the negative input's keys are refused on a
    /// single-ended converter.
    /// </summary>
    private static (AdcInput, NegativeInputSpec?, VoltageRange?) ReadInputs(TomlSection s)
    {
        var input = s.Choice("input", Inputs) ?? AdcInput.SingleEnded;
        if (input == AdcInput.SingleEnded)
        {
            foreach (var key in DifferentialKeys.Where(s.Has))
                throw s.ErrorAtKey(key, $"{key} applies only to a differential or pseudo-differential input",
                    "Remove it, or write input = \"differential\" (or \"pseudo-differential\").");
            return (input, null, null);
        }
        var range = s.Range("common_mode_range", UnitKind.Volt);
        if (range is { } r && !(r.Max > r.Min))
            throw s.ErrorAtValue("common_mode_range", "the common-mode range is empty", "Write the input common-mode range the converter works over, e.g. \"0.5 V .. 2.8 V\".");
        var negative = new NegativeInputSpec
        {
            SamplingCapacitanceFarads = s.Quantity("negative_sampling_capacitance", Bound.Positive, UnitKind.Farad)?.Value
                ?? s.RequiredValue("sampling_capacitance", Bound.Positive, "Write sampling_capacitance = \"5 pF\".", UnitKind.Farad),
            SwitchResistanceOhms = s.Quantity("negative_switch_resistance", Bound.NonNegative, UnitKind.Ohm)?.Value
                ?? s.RequiredValue("switch_resistance", Bound.NonNegative, "Write switch_resistance = \"1 kohm\" (sampling switch on-resistance).", UnitKind.Ohm),
            PinCapacitanceFarads = s.Quantity("negative_pin_capacitance", Bound.NonNegative, UnitKind.Farad)?.Value ?? s.ValueOr("pin_capacitance", 0, Bound.NonNegative, UnitKind.Farad),
            PinLeakageAmperes = s.Quantity("negative_pin_leakage", Bound.Any, UnitKind.Ampere)?.Value ?? s.ValueOr("pin_leakage", 0, Bound.Any, UnitKind.Ampere),
            PinLeakageSigned = SignWritten.Of(s, s.Has("negative_pin_leakage") ? "negative_pin_leakage" : "pin_leakage"),
            PrechargeVolts = s.Quantity("negative_precharge_voltage", Bound.Any, UnitKind.Volt)?.Value,
        };
        return (input, negative, range is { } c ? new VoltageRange(c.Min, c.Max) : null);
    }

    /// <summary>The keys both kinds of converter share: resolution, reference, pin, static errors, conventions, noise.</summary>
    private static AdcSpec Common(TomlSection s)
    {
        var bits = s.Integer("bits") ?? throw s.Missing("bits", "Write bits = 12.");
        if (bits is < DesignDefaults.MinBits or > DesignDefaults.MaxBits)
            throw s.ErrorAtValue("bits", $"{bits} bits is outside {DesignDefaults.MinBits}..{DesignDefaults.MaxBits}", "Give the converter's resolution, e.g. bits = 12.");
        var referenceText = s.RequiredString("reference", "Write reference = \"3.3 V\", or \"ratiometric\" when the ADC reference is the divider's excitation.");
        double? referenceVolts = referenceText == "ratiometric" ? null : s.Quantity("reference", Bound.Positive, UnitKind.Volt)!.Value.Value;
        var referenceTempco = s.ValueOr("reference_tempco", 0, Bound.Any, UnitKind.PpmPerKelvin);
        if (referenceTempco != 0 && referenceVolts is null)
            throw s.ErrorAtKey("reference_tempco", "reference_tempco applies only to a fixed reference; a ratiometric converter's reference is the excitation itself",
                "Remove it, or give reference as a voltage.");
        var referenceTolerance = SensorReader.Tolerance(s, "reference_tolerance");
        if (referenceTolerance != 0 && referenceVolts is null)
            throw s.ErrorAtKey("reference_tolerance", "reference_tolerance applies only to a fixed reference; a ratiometric converter's reference is the excitation itself, whose tolerance cancels",
                "Remove it (the excitation's own tolerance is divider.excitation_tolerance), or give reference as a voltage.");
        // The converter's own noise: in LSB (as converter data gives it for a code histogram) or as a voltage at the input.
        var noise = s.Quantity("noise", Bound.NonNegative, UnitKind.Lsb, UnitKind.Volt);
        return new AdcSpec
        {
            NoiseLsb = noise is { Unit: UnitKind.Lsb } lsb ? lsb.Value : null,
            NoiseVolts = noise is { Unit: UnitKind.Volt } volts ? volts.Value : null,
            Bits = (int)bits,
            ReferenceVolts = referenceVolts,
            ReferenceTolerance = referenceTolerance,
            PinCapacitanceFarads = s.ValueOr("pin_capacitance", 0, Bound.NonNegative, UnitKind.Farad),
            PinLeakageAmperes = s.ValueOr("pin_leakage", 0, Bound.Any, UnitKind.Ampere),
            PinLeakageCelsius = s.ValueOr("pin_leakage_temperature", DesignDefaults.PinLeakageCelsius, Bound.Any, UnitKind.Celsius),
            LeakageDoublingKelvin = s.ValueOr("leakage_doubling", DesignDefaults.LeakageDoublingKelvin, Bound.Positive, UnitKind.Kelvin),
            OffsetErrorLsb = s.ValueOr("offset_error", 0, Bound.Any, UnitKind.Lsb),
            GainError = s.ValueOr("gain_error", 0, Bound.Any, UnitKind.Percent, UnitKind.Ppm),
            InlLsb = s.ValueOr("inl", 0, Bound.NonNegative, UnitKind.Lsb),
            ReferenceTempcoPerKelvin = referenceTempco,
            OffsetErrorSigned = SignWritten.Of(s, "offset_error"),
            GainErrorSigned = SignWritten.Of(s, "gain_error"),
            PinLeakageSigned = SignWritten.Of(s, "pin_leakage"),
            ReferenceTempcoSigned = SignWritten.Of(s, "reference_tempco"),
            FirstTransition = s.Choice("first_transition", Transitions) ?? FirstTransition.HalfLsb,
            FirmwareInverse = s.Choice("firmware_inverse", Inverses) ?? CodeInverse.BinMiddle,
            SampleRateHertz = 0,
            AcquisitionTimeSeconds = 0,
            SamplingCapacitanceFarads = 0,
            SwitchResistanceOhms = 0,
        };
    }
}
