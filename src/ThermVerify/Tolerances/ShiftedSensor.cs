using ThermVerify.Sensors;

namespace ThermVerify.Tolerances;

/// <summary>
/// A platinum RTD inside its IEC 60751 class: at a true temperature t it has the resistance the nominal curve gives
/// at t + f·(a + b·|t|), f in [−1, 1] being where this unit sits in the class band (one f for the whole range).
/// </summary>
internal sealed class ShiftedSensor(ISensorModel nominal, RtdToleranceClass toleranceClass, double fraction) : ISensorModel
{
    public string Description => FormattableString.Invariant($"{nominal.Description}, {fraction:+0.###;-0.###} of {toleranceClass}");

    /// <summary>
    /// The true temperatures whose shifted temperature lies in the nominal model's range: t + f·(a + b·|t|) = end, solved
    /// with |t| taken at the end's sign (a model built on the unit reads its own range ends, which must not step past the
    /// nominal curve's).
    /// </summary>
    public TemperatureRange ValidRange
    {
        get
        {
            var range = nominal.ValidRange;
            double Inverse(double end)
            {
                var sign = end >= 0 ? 1 : -1;
                return (end - fraction * toleranceClass.ConstantKelvin) / (1 + fraction * toleranceClass.PerKelvinOfTemperature * sign);
            }
            return new TemperatureRange(Inverse(range.MinCelsius), Inverse(range.MaxCelsius));
        }
    }

    public double ResistanceOhms(double temperatureCelsius) => nominal.ResistanceOhms(Shifted(temperatureCelsius));

    public double TemperatureCelsius(double resistanceOhms)
    {
        // t + f·(a + b|t|) = t_nominal: a contraction for |f·b| < 1, a few steps reach double precision.
        var apparent = nominal.TemperatureCelsius(resistanceOhms);
        var t = apparent;
        for (var i = 0; i < 50; i++)
        {
            var next = apparent - fraction * toleranceClass.ToleranceKelvin(t);
            if (Math.Abs(next - t) < 1e-12) return next;
            t = next;
        }
        return t;
    }

    public double SlopeOhmsPerKelvin(double temperatureCelsius) =>
        nominal.SlopeOhmsPerKelvin(Shifted(temperatureCelsius)) * (1 + fraction * toleranceClass.PerKelvinOfTemperature * Math.Sign(temperatureCelsius));

    private double Shifted(double t) => t + fraction * toleranceClass.ToleranceKelvin(t);
}
