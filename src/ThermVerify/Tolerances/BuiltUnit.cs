using ThermVerify.Design;
using ThermVerify.Sensors;

namespace ThermVerify.Tolerances;

/// <summary>
/// One built unit: the design with this unit's parts (its circuits are built from <see cref="Design"/>), the
/// converter's static errors, and the reference its LSB is a fraction of (the unit's excitation when ratiometric,
/// so that the excitation's tolerance cancels).
/// </summary>
internal sealed record BuiltUnit(FrontEndDesign Design, ISensorModel Sensor, AdcErrors Adc, double ReferenceVolts)
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

        var sensor = SensorOf(nominal.Sensor, nominalSensor, Dev(ToleranceKind.SensorResistance), Dev(ToleranceKind.SensorBeta), Dev(ToleranceKind.RtdClass));
        var divider = nominal.Divider with
        {
            FixedResistorOhms = nominal.Divider.FixedResistorOhms * (1 + Dev(ToleranceKind.FixedResistance)),
            FixedTempcoPerKelvin = set.IndexOf(ToleranceKind.FixedTempco) < 0 ? nominal.Divider.FixedTempcoPerKelvin : Dev(ToleranceKind.FixedTempco),
            ExcitationVolts = nominal.Divider.ExcitationVolts * (1 + Dev(ToleranceKind.Excitation)),
        };
        var adc = nominal.Adc with { PinLeakageAmperes = nominal.Adc.PinLeakageAmperes * (1 + Dev(ToleranceKind.Leakage)) };
        var buffer = nominal.Buffer is { } b
            ? b with
            {
                OffsetVolts = set.IndexOf(ToleranceKind.BufferOffset) < 0 ? b.OffsetVolts : Dev(ToleranceKind.BufferOffset),
                BiasCurrentAmperes = set.IndexOf(ToleranceKind.BufferBias) < 0 ? b.BiasCurrentAmperes : Dev(ToleranceKind.BufferBias),
            }
            : null;
        var design = nominal with
        {
            Sensor = new PerturbedSensorSpec(nominal.Sensor, sensor),
            Divider = divider,
            Adc = adc,
            Buffer = buffer,
        };
        var reference = nominal.Adc.ReferenceVolts is { } v ? v * (1 + Dev(ToleranceKind.Reference)) : divider.ExcitationVolts;
        var errors = new AdcErrors(Dev(ToleranceKind.AdcOffset), Dev(ToleranceKind.AdcGain), Dev(ToleranceKind.AdcInl));
        return new BuiltUnit(design, sensor, errors, reference);
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
