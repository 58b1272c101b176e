using ThermVerify.Components;
using ThermVerify.Design;

namespace ThermVerify.Check.Remedies;

/// <summary>
/// The design values remedies change, and which of them can shrink each finding, in the order the search tries them:
/// for an effect with parts (the converter's offset, gain and INL; the buffer's offset, drift and bias; leakage and
/// drift), the part that dominates at the finding's worst point comes first.
/// </summary>
internal static class Knobs
{
    // Declared first: static fields initialise in the order they are written, and the knobs below read it.
    private static readonly Dictionary<string, string> Removals = new()
    {
        ["filter.series_resistor"] = "remove the filter's series resistor",
        ["adc.pin_leakage"] = "choose a converter with negligible pin leakage",
        ["protection.clamp_leakage"] = "use clamp diodes with negligible reverse leakage (or none)",
        ["divider.fixed_tempco"] = "use a fixed resistor with a negligible tempco",
        ["bridge.fixed_tempco"] = "use a bridge resistor (the sensor's half) with a negligible tempco",
        ["bridge.opposite_high_tempco"] = "use an opposite-half high resistor with a negligible tempco",
        ["bridge.opposite_low_tempco"] = "use an opposite-half low resistor with a negligible tempco",
        ["amplifier.offset_voltage"] = "trim (or calibrate) the amplifier's offset out",
        ["amplifier.offset_drift"] = "use an amplifier with negligible offset drift",
        ["amplifier.gain_error"] = "calibrate the amplifier's gain error out in firmware",
        ["amplifier.bias_current"] = "use an amplifier with negligible bias current",
        ["current_source.current_tempco"] = "use a current source with a negligible tempco",
        ["current_source.reference_resistor_tempco"] = "use a reference resistor with a negligible tempco",
        ["wiring.current_mismatch"] = "match the two currents (or calibrate their mismatch out)",
        ["wiring.lead_mismatch"] = "match the bridge arms' leads (or calibrate their mismatch out)",
        ["wiring.lead_resistance"] = "use leads of negligible resistance (or measure them and correct in firmware)",
        ["buffer.offset_voltage"] = "trim (or calibrate) the op-amp's offset out",
        ["buffer.offset_drift"] = "use an op-amp with negligible offset drift (chopper-stabilised)",
        ["buffer.bias_current"] = "use an op-amp with negligible bias current",
        ["buffer.noise_voltage"] = "use an op-amp with negligible voltage noise",
        ["buffer.output_swing"] = "use an op-amp with a rail-to-rail output",
        ["adc.offset_error"] = "calibrate the converter's offset error out in firmware",
        ["adc.gain_error"] = "calibrate the converter's gain error out in firmware",
        ["adc.inl"] = "correct the converter's INL code by code in firmware",
        ["adc.reference_tempco"] = "use a reference with a negligible tempco",
        ["adc.pga_input_current"] = "use a gain stage with negligible input current",
        ["adc.pga_gain_error"] = "calibrate the gain stage's gain error out in firmware",
        ["adc.charge_injection"] = "use a multiplexer with negligible charge injection",
    };

    public static readonly Knob GainStageInputCurrent = Magnitude("adc.pga_input_current", "A", d => d.Adc.GainStage!.InputCurrentAmperes,
        (d, v) => d with { Adc = d.Adc with { GainStage = d.Adc.GainStage! with { InputCurrentAmperes = v } } },
        "choose a gain stage whose input current is at most");

    public static readonly Knob GainStageGainError = Magnitude("adc.pga_gain_error", "fraction", d => d.Adc.GainStage!.GainError,
        (d, v) => d with { Adc = d.Adc with { GainStage = d.Adc.GainStage! with { GainError = v } } },
        "choose a gain stage (or calibrate) with a gain error of at most") with { Calibrated = true };

    /// <summary>The gain searched down to a thousandth of the design's: the largest that keeps the amplified signal in range.</summary>
    public static readonly Knob Gain = new("adc.gain", "", Better.Lower, d => d.Adc.GainStage?.Gain,
        (d, v) => d with
        {
            Adc = d.Adc with { GainStage = d.Adc.GainStage! with { Gain = v }, DeltaSigma = d.Adc.DeltaSigma is { } ds ? ds with { Gain = v } : null },
        },
        d => d.Adc.ProgrammableGain * 1e-3, "lower the programmable gain to at most");

    public static readonly Knob ChargeInjectionKnob = Magnitude("adc.charge_injection", "C", d => d.Adc.ChargeInjectionCoulombs,
        (d, v) => d with { Adc = d.Adc with { ChargeInjectionCoulombs = v } }, "choose a multiplexer whose charge injection is at most");

    /// <summary>A current-excited sensor on 2 wires: 3 wires (the second current cancels the leads) or 4 (the sense pair carries no current).</summary>
    public static readonly Knob Wires = new("wiring.wires", "wires", Better.Higher, d => d.Wiring?.Wires,
        (d, v) => d with { Wiring = d.Wiring! with { Wires = (int)Math.Round(v) } }, _ => 4, "connect the sensor with at least")
    {
        Integer = true,
    };

    public static readonly Knob AcquisitionTime = new("adc.acquisition_time", "s", Better.Higher,
        d => (double?)d.Adc.AcquisitionTimeSeconds, (d, v) => d with { Adc = d.Adc with { AcquisitionTimeSeconds = v } },
        d => 0.95 / d.Adc.SampleRateHertz, "lengthen the acquisition time to at least");

    /// <summary>
    /// The reservoir's search ends at 4·2^N·C_sh, twice the charge-sharing rule for a full-scale step
    /// ((2^(N+1) − 1)·C_sh, common practice): no kick needs more.
    /// </summary>
    public static readonly Knob Reservoir = new("filter.reservoir_capacitor", "F", Better.Higher,
        d => d.Filter.ReservoirCapacitorFarads > 0 ? d.Filter.ReservoirCapacitorFarads : null,
        (d, v) => d with { Filter = d.Filter with { ReservoirCapacitorFarads = v } },
        d => d.Adc.SamplingCapacitanceFarads * 4.0 * (1 << d.Adc.Bits), "fit a reservoir capacitor at the pin (E12 value) of at least")
    {
        Floor = d => d.Adc.SamplingCapacitanceFarads,
        Standard = v => ESeries.E12.Contains(v) ? v : ESeries.E12.NextHigher(v),
    };

    public static readonly Knob SampleRate = new("adc.sample_rate", "Hz", Better.Lower,
        d => (double?)d.Adc.SampleRateHertz, (d, v) => d with { Adc = d.Adc with { SampleRateHertz = v } },
        d => Math.Max(d.Adc.SampleRateHertz * 1e-4, 1e-3), "lower this channel's sample rate to at most");

    public static readonly Knob SeriesResistor = Magnitude("filter.series_resistor", "Ω", d => d.Filter.SeriesResistorOhms,
        (d, v) => d with { Filter = d.Filter with { SeriesResistorOhms = v } }, "lower the filter's series resistor to at most");

    public static readonly Knob PinLeakage = Magnitude("adc.pin_leakage", "A", d => d.Adc.PinLeakageAmperes,
        (d, v) => d with { Adc = d.Adc with { PinLeakageAmperes = v } }, "choose a converter whose pin leakage (at pin_leakage_temperature) is at most");

    public static readonly Knob ClampLeakage = Magnitude("protection.clamp_leakage", "A", d => d.Protection!.ClampLeakageAmperes,
        (d, v) => d with { Protection = d.Protection! with { ClampLeakageAmperes = v } },
        "choose clamp diodes whose reverse leakage (at clamp_leakage_temperature) is at most");

    /// <summary>The insulation's search ends at 10 TΩ: a clean, dry board and cable do not do better (common practice).</summary>
    public static readonly Knob Insulation = new("protection.insulation_resistance", "Ω", Better.Higher,
        d => d.Protection!.InsulationOhms, (d, v) => d with { Protection = d.Protection! with { InsulationOhms = v } },
        _ => 1e13, "keep the insulation from the sensor's wire (cable, connector and board, wet and hot) at no less than");

    public static readonly Knob LeadResistance = Magnitude("wiring.lead_resistance", "Ω", d => d.Wiring!.LeadOhms,
        (d, v) => d with { Wiring = d.Wiring! with { LeadOhms = v } }, "use leads (each wire, at 25 °C) of at most");

    public static readonly Knob FixedTempco = Magnitude("divider.fixed_tempco", "ppm/K", d => d.VoltageDivider.FixedTempcoPerKelvin,
        (d, v) => d with { Divider = d.VoltageDivider with { FixedTempcoPerKelvin = v } }, "use a fixed resistor with a tempco of at most");

    public static readonly Knob BridgeFixedTempco = Magnitude("bridge.fixed_tempco", "ppm/K", d => d.VoltageDivider.FixedTempcoPerKelvin,
        (d, v) => d with { Divider = d.VoltageDivider with { FixedTempcoPerKelvin = v } }, "use a bridge resistor (the sensor's half) with a tempco of at most");

    public static readonly Knob BridgeHighTempco = Magnitude("bridge.opposite_high_tempco", "ppm/K", d => d.Bridge!.HighTempcoPerKelvin,
        (d, v) => d with { Bridge = d.Bridge! with { HighTempcoPerKelvin = v } }, "use an opposite-half high resistor with a tempco of at most");

    public static readonly Knob BridgeLowTempco = Magnitude("bridge.opposite_low_tempco", "ppm/K", d => d.Bridge!.LowTempcoPerKelvin,
        (d, v) => d with { Bridge = d.Bridge! with { LowTempcoPerKelvin = v } }, "use an opposite-half low resistor with a tempco of at most");

    public static readonly Knob AmplifierOffset = Magnitude("amplifier.offset_voltage", "V", d => d.Amplifier!.OffsetVolts,
        (d, v) => d with { Amplifier = d.Amplifier! with { OffsetVolts = v } }, "use an amplifier with an input offset of at most");

    public static readonly Knob AmplifierDrift = Magnitude("amplifier.offset_drift", "V/K", d => d.Amplifier!.OffsetDriftVoltsPerKelvin,
        (d, v) => d with { Amplifier = d.Amplifier! with { OffsetDriftVoltsPerKelvin = v } }, "use an amplifier with an offset drift of at most");

    public static readonly Knob AmplifierGainError = Magnitude("amplifier.gain_error", "fraction", d => d.Amplifier!.GainError,
        (d, v) => d with { Amplifier = d.Amplifier! with { GainError = v } }, "use an amplifier with a gain error of at most");

    /// <summary>The CMRR's search ends at 160 dB, beyond what a monolithic in-amp reaches at DC (common practice, no source).</summary>
    public static readonly Knob AmplifierCmrr = new("amplifier.cmrr", "dB", Better.Higher,
        d => d.Amplifier!.CommonModeFraction == 0 ? null : -20 * Math.Log10(Math.Abs(d.Amplifier.CommonModeFraction)),
        (d, v) => d with { Amplifier = d.Amplifier! with { CommonModeFraction = (d.Amplifier.CommonModeFraction < 0 ? -1 : 1) * Math.Pow(10, -v / 20) } },
        _ => 160, "use an amplifier with a CMRR of at least");

    public static readonly Knob AmplifierBias = Magnitude("amplifier.bias_current", "A", d => d.Amplifier!.BiasCurrentAmperes,
        (d, v) => d with { Amplifier = d.Amplifier! with { BiasCurrentAmperes = v } }, "use an amplifier with an input bias current of at most");

    public static readonly Knob CurrentTempco = Magnitude("current_source.current_tempco", "ppm/K", d => d.CurrentSource!.CurrentTempcoPerKelvin,
        (d, v) => d with { CurrentSource = d.CurrentSource! with { CurrentTempcoPerKelvin = v } }, "use a current source with a tempco of at most");

    public static readonly Knob CurrentMismatch = Magnitude("wiring.current_mismatch", "fraction", d => d.Wiring!.CurrentMismatch,
        (d, v) => d with { Wiring = d.Wiring! with { CurrentMismatch = v } }, "match the two currents of the 3-wire connection to within");

    public static readonly Knob LeadMismatch = Magnitude("wiring.lead_mismatch", "fraction", d => d.Wiring!.LeadMismatch,
        (d, v) => d with { Wiring = d.Wiring! with { LeadMismatch = v } }, "match the leads in the bridge's two arms to within");

    public static readonly Knob ReferenceResistorTempco = Magnitude("current_source.reference_resistor_tempco", "ppm/K",
        d => d.CurrentSource!.ReferenceResistorTempcoPerKelvin,
        (d, v) => d with { CurrentSource = d.CurrentSource! with { ReferenceResistorTempcoPerKelvin = v } }, "use a reference resistor with a tempco of at most");

    /// <summary>The open-loop output resistance the added follower is given: a typical CMOS op-amp's (common practice, no source).</summary>
    public const double AddedBufferOutputOhms = 100;

    /// <summary>
    /// A follower added where the design has none: rail-to-rail, offset and bias currents taken as zero, 100 Ω open-loop
    /// output resistance; the search is on its gain-bandwidth, from the single-pole closed form for settling a full-scale
    /// step within the acquisition (τ = 1/(2π·GBW), op-amp textbook result, from memory) up to a thousand times that.
    /// </summary>
    public static readonly Knob AddBuffer = new("buffer.gain_bandwidth", "Hz", Better.Higher,
        d => null,
        (d, v) => d with
        {
            Buffer = new BufferSpec
            {
                GainBandwidthHertz = v,
                OutputResistanceOhms = AddedBufferOutputOhms,
                Supply = new VoltageRange(0, Math.Max(d.VoltageDivider.ExcitationVolts, d.Adc.ReferenceVolts ?? 0)),
            },
        },
        d => FullScaleFollower(d) * 1e3,
        "buffer the divider with a rail-to-rail op-amp follower (offset and bias currents zero, 100 Ω open-loop output resistance) of gain-bandwidth at least")
    {
        Floor = FullScaleFollower,
    };

    private static double FullScaleFollower(FrontEndDesign d) =>
        FrontEnd.SamplingFormulas.FollowerGainBandwidthFor(d.NominalReferenceVolts, d.NominalReferenceVolts / (1 << d.Adc.Bits) / 2,
            d.Adc.AcquisitionTimeSeconds);

    public static readonly Knob BufferGainBandwidth = new("buffer.gain_bandwidth", "Hz", Better.Higher,
        d => (double?)d.Buffer!.GainBandwidthHertz, (d, v) => d with { Buffer = d.Buffer! with { GainBandwidthHertz = v } },
        d => d.Buffer!.GainBandwidthHertz * 1e3, "use an op-amp with gain-bandwidth of at least");

    public static readonly Knob BufferSlewRate = new("buffer.slew_rate", "V/s", Better.Higher,
        d => d.Buffer!.SlewRateVoltsPerSecond, (d, v) => d with { Buffer = d.Buffer! with { SlewRateVoltsPerSecond = v } },
        d => 1e9, "use an op-amp with a slew rate of at least");

    public static readonly Knob BufferOffset = Magnitude("buffer.offset_voltage", "V", d => d.Buffer!.OffsetVolts,
        (d, v) => d with { Buffer = d.Buffer! with { OffsetVolts = v } }, "use an op-amp with an offset of at most") with { Calibrated = true };

    public static readonly Knob BufferDrift = Magnitude("buffer.offset_drift", "V/K", d => d.Buffer!.OffsetDriftVoltsPerKelvin,
        (d, v) => d with { Buffer = d.Buffer! with { OffsetDriftVoltsPerKelvin = v } }, "use an op-amp with an offset drift of at most");

    public static readonly Knob BufferBias = Magnitude("buffer.bias_current", "A", d => d.Buffer!.BiasCurrentAmperes,
        (d, v) => d with { Buffer = d.Buffer! with { BiasCurrentAmperes = v } }, "use an op-amp with a bias current of at most");

    public static readonly Knob BufferNoise = Magnitude("buffer.noise_voltage", "V/√Hz", d => d.Buffer!.NoiseVoltsPerRootHertz,
        (d, v) => d with { Buffer = d.Buffer! with { NoiseVoltsPerRootHertz = v } }, "use an op-amp with a voltage noise of at most");

    public static readonly Knob Isolation = new("buffer.isolation_resistor", "Ω", Better.Higher,
        d => d.Buffer!.IsolationResistorOhms > 0 ? d.Buffer.IsolationResistorOhms : null,
        (d, v) => d with { Buffer = d.Buffer! with { IsolationResistorOhms = v } }, d => 1e6, "fit an isolation resistor of at least")
    {
        Floor = _ => 1e-2,
    };

    public static readonly Knob OutputSwing = Magnitude("buffer.output_swing", "V", d => d.Buffer!.OutputSwingVolts,
        (d, v) => d with { Buffer = d.Buffer! with { OutputSwingVolts = v } }, "use an op-amp whose output swings to within, of each rail,");

    public static readonly Knob AdcOffset = Magnitude("adc.offset_error", "LSB", d => d.Adc.OffsetErrorLsb,
        (d, v) => d with { Adc = d.Adc with { OffsetErrorLsb = v } }, "choose a converter (or calibrate) with an offset error of at most") with { Calibrated = true };

    public static readonly Knob AdcGain = Magnitude("adc.gain_error", "fraction", d => d.Adc.GainError,
        (d, v) => d with { Adc = d.Adc with { GainError = v } }, "choose a converter (or calibrate) with a gain error of at most") with { Calibrated = true };

    public static readonly Knob AdcInl = Magnitude("adc.inl", "LSB", d => d.Adc.InlLsb,
        (d, v) => d with { Adc = d.Adc with { InlLsb = v } }, "choose a converter with an INL of at most");

    public static readonly Knob ReferenceTempco = Magnitude("adc.reference_tempco", "ppm/K", d => d.Adc.ReferenceTempcoPerKelvin,
        (d, v) => d with { Adc = d.Adc with { ReferenceTempcoPerKelvin = v } }, "use a reference with a tempco of at most");

    public static readonly Knob Bits = new("adc.bits", "bits", Better.Higher, d => (double)d.Adc.Bits,
        (d, v) => d with { Adc = d.Adc with { Bits = (int)Math.Round(v) } }, d => DesignDefaultsMaxBits, "use a converter of at least")
    {
        Integer = true,
    };

    public static readonly Knob Dissipation = new("sensor.dissipation_constant", "W/K", Better.Higher,
        d => d.Sensor.DissipationConstantWattsPerKelvin, (d, v) => d with { Sensor = d.Sensor with { DissipationConstantWattsPerKelvin = v } },
        d => (d.Sensor.DissipationConstantWattsPerKelvin ?? 0) * 1e3, "mount the sensor (or choose one) for a dissipation constant of at least");

    private const int DesignDefaultsMaxBits = 24;

    /// <summary>The most conversions a remedy asks the firmware to average: beyond it a reading takes too long to be one.</summary>
    public const int MostReadingsAveraged = 1024;

    public static readonly Knob ReadingsAveraged = new("noise.readings_averaged", "conversions", Better.Higher,
        d => d.Noise.ReadingsAveraged, (d, v) => d with { Noise = d.Noise with { ReadingsAveraged = (int)Math.Round(v) } },
        _ => MostReadingsAveraged, "average in firmware, per reading, a mean of at least")
    {
        Integer = true,
    };

    /// <summary>Fewer conversions per reading: the mean is younger, so it lags a ramp less (at the cost of noise).</summary>
    public static readonly Knob FewerReadings = new("noise.readings_averaged", "conversions", Better.Lower,
        d => d.Noise.ReadingsAveraged, (d, v) => d with { Noise = d.Noise with { ReadingsAveraged = (int)Math.Round(v) } },
        _ => 1, "average in firmware, per reading, a mean of at most")
    {
        Integer = true,
    };

    /// <summary>The converter's own noise, searched as a voltage (the design may have declared it in LSB, or not at all).</summary>
    public static readonly Knob ConverterNoise = new("adc.noise", "V", Better.Lower,
        d => Noise.ReadingNoiseAnalysis.ConverterVolts(d, new FrontEnd.ClosedFormModel(d).Adc.LsbVolts),
        (d, v) => d with { Adc = d.Adc with { NoiseVolts = v, NoiseLsb = null } }, _ => 0, "choose a converter whose own rms noise is at most");

    /// <summary>A value that has a sign (or none) and helps by shrinking: searched by magnitude towards zero, sign kept.</summary>
    private static Knob Magnitude(string key, string unit, Func<FrontEndDesign, double> get, Func<FrontEndDesign, double, FrontEndDesign> set, string action) =>
        new(key, unit, Better.Lower, d => (double?)Math.Abs(get(d)), (d, v) => set(d, (get(d) < 0 ? -1 : 1) * v), _ => 0, action)
        {
            Removal = Removals.GetValueOrDefault(key),
        };


    /// <summary>
    /// The knobs that can shrink a finding, in the order to try them. <paramref name="worst"/> is the finding's worst
    /// point; parts of an effect are ordered by their own size there.
    /// </summary>
    public static IReadOnlyList<Knob> For(string findingId, FrontEndDesign design, CheckPoint worst)
    {
        var buffered = design.Buffer is not null;
        // A buffer behind a current-excited sensor is not modelled, so none is offered there.
        // A netlist's shape (a reservoir, an added follower) is the user's drawing; its parts' knobs are NetlistKnobs'.
        var netlist = design.Netlist is not null;
        // Nor behind a bridge, which the converter reads differentially (a follower would follow one output only); the
        // bridge's tempcos have knobs of their own (named by the bridge's keys).
        var bridge = design.Bridge is not null;
        Knob[] buffer = buffered ? [BufferGainBandwidth] : design.CurrentSource is null && !netlist && !bridge ? [AddBuffer] : [];
        switch (findingId)
        {
            case "settling":
                return netlist ? [AcquisitionTime] : [AcquisitionTime, Reservoir, .. buffer];
            case "reservoir-recovery":
                return design.Filter.SeriesResistorOhms > 0 ? [SampleRate, SeriesResistor, .. buffer] : [SampleRate, .. buffer];
            case "dc-loading":
            {
                var parts = new List<(Knob, double)>
                {
                    (PinLeakage, design.Adc.PinLeakageAmperes != 0 ? Math.Abs(worst.Estimates.LeakageVolts) : -1),
                    (FixedTempco, !bridge && design.Divider?.FixedTempcoPerKelvin is not (null or 0) ? Math.Abs(worst.Estimates.FixedDriftVolts) : -1),
                    // The three share the bridge's drift estimate: their order among themselves is the order written.
                    (BridgeFixedTempco, bridge && design.Divider?.FixedTempcoPerKelvin is not (null or 0) ? Math.Abs(worst.Estimates.FixedDriftVolts) : -1),
                    (BridgeHighTempco, design.Bridge is { HighTempcoPerKelvin: not 0 } ? Math.Abs(worst.Estimates.FixedDriftVolts) : -1),
                    (BridgeLowTempco, design.Bridge is { LowTempcoPerKelvin: not 0 } ? Math.Abs(worst.Estimates.FixedDriftVolts) : -1),
                    (ReferenceResistorTempco, design.CurrentSource?.ReferenceResistorTempcoPerKelvin is not (null or 0) ? Math.Abs(worst.Estimates.ExcitationVolts) : -1),
                    (CurrentTempco, design.CurrentSource is { ReferenceResistorOhms: null, CurrentTempcoPerKelvin: not 0 } ? Math.Abs(worst.Estimates.ExcitationVolts) : -1),
                    (CurrentMismatch, design.Wiring is { Wires: 3, CurrentMismatch: not 0 } ? Math.Abs(worst.Estimates.LeadVolts) : -1),
                    (LeadMismatch, design.Wiring is { Wires: 3, LeadMismatch: not 0 } ? Math.Abs(worst.Estimates.LeadVolts) : -1),
                    (LeadResistance, design.Wiring is { LeadOhms: > 0 } ? Math.Abs(worst.Estimates.LeadVolts) : -1),
                    (Wires, design.Wiring is { Wires: 2, LeadOhms: > 0 } && design.CurrentSource is not null ? Math.Abs(worst.Estimates.LeadVolts) : -1),
                    (GainStageInputCurrent, design.Adc.GainStage is { InputCurrentAmperes: not 0 } g
                        ? Math.Abs(g.InputCurrentAmperes * worst.Estimates.SourceOhms) : -1),
                    (ClampLeakage, design.Protection is { HasClamps: true } ? Math.Abs(worst.Estimates.ClampVolts) : -1),
                    (Insulation, design.Protection?.InsulationOhms is not null ? Math.Abs(worst.Estimates.InsulationVolts) : -1),
                };
                var knobs = Ordered(parts);
                var leaks = design.Adc.PinLeakageAmperes != 0 || design.Protection is { HasClamps: true } || design.Adc.GainStage is { InputCurrentAmperes: not 0 };
                // A leakage current at the pin drops across the series resistor: its largest value that keeps the budget.
                if (leaks && design.Filter.SeriesResistorOhms > 0) knobs.Add(SeriesResistor);
                if (leaks && !buffered) knobs.AddRange(buffer);
                return knobs;
            }
            case "buffer-static" when buffered:
            {
                var s = Buffer.BufferStaticErrors.At(design, new FrontEnd.ClosedFormModel(design).At(worst.Celsius));
                return Ordered([(BufferOffset, Present(design.Buffer!.OffsetVolts, s.OffsetVolts)),
                    (BufferDrift, Present(design.Buffer.OffsetDriftVoltsPerKelvin, s.DriftVolts)),
                    (BufferBias, Present(design.Buffer.BiasCurrentAmperes, s.BiasVolts))]);
            }
            case "amplifier-static" when design.Amplifier is { } a:
            {
                var x = worst.IdealVolts;
                var drift = a.OffsetDriftVoltsPerKelvin * ((design.Check.BoardCelsius ?? worst.Celsius) - 25);
                return Ordered([(AmplifierOffset, Present(a.OffsetVolts, a.Gain * a.OffsetVolts)), (AmplifierDrift, Present(a.OffsetDriftVoltsPerKelvin, a.Gain * drift)),
                    (AmplifierGainError, Present(a.GainError, a.GainError * x)), (AmplifierBias, Present(a.BiasCurrentAmperes, worst.Estimates.BiasCurrentVolts)),
                    (AmplifierCmrr, Present(a.CommonModeFraction, a.Gain * a.CommonModeFraction * worst.IdealVolts))]);
            }
            case "converter":
            {
                var adc = design.Adc;
                var x = worst.SampleVolts / design.FullScaleAtPinVolts;
                return Ordered([(AdcOffset, Present(adc.OffsetErrorLsb, adc.OffsetErrorLsb)),
                    (AdcGain, Present(adc.GainError, adc.GainError * x * (1 << adc.Bits))),
                    (AdcInl, Present(adc.InlLsb, adc.InlLsb * 4 * x * (1 - x))),
                    (GainStageGainError, Present(adc.GainStage?.GainError ?? 0, (adc.GainStage?.GainError ?? 0) * x * (1 << adc.Bits))),
                    (ReferenceTempco, Present(adc.ReferenceTempcoPerKelvin, adc.ReferenceTempcoPerKelvin * ((design.Check.BoardCelsius ?? worst.Celsius) - 25) * x * (1 << adc.Bits)))]);
            }
            case GainRangeRule.Id:
                return design.Adc.GainStage is not null ? [Gain] : [];
            case ChargeInjectionRule.Id:
                return design.Filter.SeriesResistorOhms > 0 ? [ChargeInjectionKnob, SeriesResistor] : [ChargeInjectionKnob];
            case "self-heating":
                return design.Sensor.DissipationConstantWattsPerKelvin is > 0 ? [Dissipation] : [];
            case "resolution":
                return [Bits];
            case "buffer-recovery" when buffered:
                return design.Buffer!.SlewRateVoltsPerSecond is null ? [BufferGainBandwidth] : [BufferGainBandwidth, BufferSlewRate];
            case Noise.NoiseFindingRules.NoiseId:
                // The op-amp first where it is the largest source; averaging otherwise (it helps every source but the filtered part).
                return worst.Noise?.Shares.FirstOrDefault()?.Source == Buffer.BufferCircuits.OpAmpName && design.Buffer!.NoiseVoltsPerRootHertz > 0
                    ? [BufferNoise, ReadingsAveraged, Reservoir, ConverterNoise]
                    : [ReadingsAveraged, Reservoir, ConverterNoise];
            case Noise.NoiseFindingRules.RampLagId:
                return [.. design.Noise.ReadingsAveraged > 1 ? [FewerReadings] : Array.Empty<Knob>(), .. design.Filter.SeriesResistorOhms > 0 ? [SeriesResistor] : Array.Empty<Knob>()];
            case "buffer-noise" when buffered:
                return design.Buffer!.NoiseVoltsPerRootHertz > 0 ? [BufferNoise] : [];
            case "buffer-stability" when buffered:
                return [Isolation];
            case "buffer-output-clipped" when buffered:
                return design.Buffer!.OutputSwingVolts > 0 ? [OutputSwing] : [];
            default:
                return [];
        }
    }

    private static double Present(double value, double size) => value != 0 ? Math.Abs(size) : -1;

    private static List<Knob> Ordered(IEnumerable<(Knob Knob, double Size)> parts) =>
        [.. parts.Where(p => p.Size >= 0).OrderByDescending(p => p.Size).Select(p => p.Knob)];
}
