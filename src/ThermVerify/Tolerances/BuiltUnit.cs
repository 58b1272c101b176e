using ThermVerify.Design;
using ThermVerify.FrontEnd;
using ThermVerify.Sensors;

namespace ThermVerify.Tolerances;

/// <summary>
/// One built unit: the design with this unit's parts (its circuits are built from <see cref="Design"/>) and its
/// converter: the reference its LSB is a fraction of (the unit's excitation when ratiometric, so that the excitation's
/// tolerance cancels), the reference's tempco and the converter's own offset, gain error and signed INL bow.
/// </summary>
internal sealed record BuiltUnit(FrontEndDesign Design, ISensorModel Sensor, Converter Converter)
{
    /// <param name="nominalSensor">The nominal design's sensor model, built once (a table is read from its file).</param>
    public static BuiltUnit Build(FrontEndDesign nominal, ISensorModel nominalSensor, ToleranceSet set, ReadOnlySpan<double> deviations)
    {
        var values = deviations.ToArray();
        double Dev(ToleranceKind kind)
        {
            var i = set.IndexOf(kind);
            return i < 0 ? 0 : values[i];
        }
        // A bound spread about zero: the unit's value is its deviation; a value that is not spread stays as written.
        double Bound(ToleranceKind kind, double written) => set.IndexOf(kind) < 0 ? written : Dev(kind);

        var sensor = SensorOf(nominal.Sensor, nominalSensor, Dev(ToleranceKind.SensorResistance), Dev(ToleranceKind.SensorBeta), Dev(ToleranceKind.RtdClass));
        // A built unit has every value at its own sign: nothing of it is a bound any more.
        var divider = nominal.Divider is { } d
            ? d with
            {
                FixedResistorOhms = d.FixedResistorOhms * (1 + Dev(ToleranceKind.FixedResistance)),
                FixedTempcoPerKelvin = Bound(ToleranceKind.FixedTempco, d.FixedTempcoPerKelvin),
                FixedTempcoSigned = true,
                ExcitationVolts = d.ExcitationVolts * (1 + Dev(ToleranceKind.Excitation)),
            }
            : null;
        var bridge = nominal.Bridge is { } br
            ? br with
            {
                HighOhms = br.HighOhms * (1 + Dev(ToleranceKind.BridgeHighResistance)),
                HighTempcoPerKelvin = Bound(ToleranceKind.BridgeHighTempco, br.HighTempcoPerKelvin),
                HighTempcoSigned = true,
                LowOhms = br.LowOhms * (1 + Dev(ToleranceKind.BridgeLowResistance)),
                LowTempcoPerKelvin = Bound(ToleranceKind.BridgeLowTempco, br.LowTempcoPerKelvin),
                LowTempcoSigned = true,
            }
            : null;
        // The unit's current and reference resistor are in its circuit: the reference the converter divides by is the
        // unit's own I·R_ref, simulated, so the current's deviation cancels there as in the part.
        var source = nominal.CurrentSource is { } c
            ? c with
            {
                CurrentAmperes = c.CurrentAmperes * (1 + Dev(ToleranceKind.Current)),
                CurrentTempcoPerKelvin = Bound(ToleranceKind.CurrentTempco, c.CurrentTempcoPerKelvin),
                CurrentTempcoSigned = true,
                ReferenceResistorOhms = c.ReferenceResistorOhms * (1 + Dev(ToleranceKind.ReferenceResistance)),
                ReferenceResistorTempcoPerKelvin = Bound(ToleranceKind.ReferenceResistorTempco, c.ReferenceResistorTempcoPerKelvin),
                ReferenceResistorTempcoSigned = true,
            }
            : null;
        var stage = nominal.Adc.GainStage is { } g
            ? g with
            {
                GainError = Bound(ToleranceKind.GainStageGain, g.GainError),
                GainErrorSigned = true,
                InputCurrentAmperes = Bound(ToleranceKind.GainStageInputCurrent, g.InputCurrentAmperes),
                InputCurrentSigned = true,
            }
            : null;
        var adc = nominal.Adc with
        {
            PinLeakageAmperes = nominal.Adc.PinLeakageAmperes * (1 + Dev(ToleranceKind.Leakage)),
            PinLeakageSigned = true,
            NegativeInput = nominal.Adc.NegativeInput is { } n
                ? n with { PinLeakageAmperes = n.PinLeakageAmperes * (1 + Dev(ToleranceKind.Leakage)), PinLeakageSigned = true }
                : null,
            GainStage = stage,
            DeltaSigma = nominal.Adc.DeltaSigma is { } ds
                ? ds with { InputCurrentAmperes = Bound(ToleranceKind.DeltaSigmaInputCurrent, ds.InputCurrentAmperes), InputCurrentSigned = true }
                : null,
        };
        var buffer = nominal.Buffer is { } b
            ? b with
            {
                OffsetVolts = Bound(ToleranceKind.BufferOffset, b.OffsetVolts),
                OffsetDriftVoltsPerKelvin = Bound(ToleranceKind.BufferDrift, b.OffsetDriftVoltsPerKelvin),
                BiasCurrentAmperes = Bound(ToleranceKind.BufferBias, b.BiasCurrentAmperes),
                OffsetSigned = true,
                OffsetDriftSigned = true,
                BiasCurrentSigned = true,
            }
            : null;
        var amplifier = nominal.Amplifier is { } am
            ? am with
            {
                OffsetVolts = Bound(ToleranceKind.AmplifierOffset, am.OffsetVolts),
                OffsetDriftVoltsPerKelvin = Bound(ToleranceKind.AmplifierDrift, am.OffsetDriftVoltsPerKelvin),
                GainError = Bound(ToleranceKind.AmplifierGainError, am.GainError),
                CommonModeFraction = Bound(ToleranceKind.AmplifierCommonMode, am.CommonModeFraction),
                BiasCurrentAmperes = Bound(ToleranceKind.AmplifierBias, am.BiasCurrentAmperes),
                OffsetSigned = true,
                OffsetDriftSigned = true,
                GainErrorSigned = true,
                BiasCurrentSigned = true,
            }
            : null;
        var wiring = nominal.Wiring is { } w
            ? w with
            {
                CurrentMismatch = Bound(ToleranceKind.CurrentMismatch, w.CurrentMismatch), CurrentMismatchSigned = true,
                LeadMismatch = Bound(ToleranceKind.LeadMismatch, w.LeadMismatch), LeadMismatchSigned = true,
            }
            : null;
        var protection = nominal.Protection is { } pr
            ? pr with { ClampLeakageAmperes = Bound(ToleranceKind.ClampLeakage, pr.ClampLeakageAmperes), ClampLeakageSigned = true }
            : null;
        var design = nominal with
        {
            Netlist = nominal.Netlist is { } netlist ? NetlistUnit.Build(netlist, set, values) : null,
            Wiring = wiring,
            Protection = protection,
            Sensor = new PerturbedSensorSpec(nominal.Sensor, sensor),
            Divider = divider,
            Bridge = bridge,
            CurrentSource = source,
            Adc = adc,
            Buffer = buffer,
            Amplifier = amplifier,
        };
        // The converter's scale at the pin: its reference over the programmable gain.
        var reference = (nominal.Adc.ReferenceVolts is { } v ? v * (1 + Dev(ToleranceKind.Reference)) : design.NominalReferenceVolts) / nominal.Adc.ProgrammableGain;
        var tempco = nominal.Adc.IsRatiometric ? 0 : Bound(ToleranceKind.ReferenceTempco, nominal.Adc.ReferenceTempcoPerKelvin);
        var errors = new ConverterErrors(Bound(ToleranceKind.AdcOffset, nominal.Adc.OffsetErrorLsb),
            ConverterErrors.WithAmplifier(Bound(ToleranceKind.AdcGain, nominal.Adc.GainError), stage?.GainError ?? 0), Dev(ToleranceKind.AdcInl));
        return new BuiltUnit(design, sensor, new Converter(nominal.Adc.Bits, reference, tempco, [errors], TempcoIsBound: false));
    }

    /// <summary>The unit's sensor model: R0 and β scaled (Beta), the whole curve scaled (Steinhart–Hart, table), or shifted in its class band (RTD).</summary>
    private static ISensorModel SensorOf(SensorSpec spec, ISensorModel model, double resistance, double beta, double rtdFraction)
    {
        switch (spec)
        {
            case BetaSensorSpec b:
                return new BetaThermistor(b.R0Ohms * (1 + resistance), b.BetaKelvin * (1 + beta), b.ReferenceCelsius,
                    b.ValidRange, b.BetaFromCelsius, b.BetaToCelsius);
            case RtdSensorSpec r when r.ToleranceClass is { } c && rtdFraction != 0:
                return new ShiftedSensor(model, RtdToleranceClass.Parse(c.ToString()), rtdFraction);
            default:
                return resistance == 0 ? model : new ScaledSensor(model, 1 + resistance);
        }
    }
}
