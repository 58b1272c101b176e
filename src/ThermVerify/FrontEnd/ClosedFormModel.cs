using ThermVerify.Design;
using ThermVerify.Sensors;

namespace ThermVerify.FrontEnd;

/// <summary>What the hand calculation and the firmware assume at one temperature.</summary>
internal readonly record struct ClosedFormPoint(
    double Celsius,
    double SensorOhms,
    double IdealVolts,
    double IdealCode,
    double VoltsPerKelvin,
    double TheveninOhms);

/// <summary>
/// The model hand calculations and firmware use: an unloaded divider (or an ideal current through the sensor, V = I·R_s), an ideal ADC (see <see cref="AdcTransfer"/>)
/// and the firmware's inverse, code → voltage → sensor resistance → temperature with the nominal sensor model.
/// </summary>
internal sealed class ClosedFormModel
{
    public ClosedFormModel(FrontEndDesign design)
    {
        Design = design;
        Sensor = design.Sensor.Build();
        Adc = AdcTransfer.Of(design);
        var (atLow, atHigh) = (Sensor.ResistanceOhms(Sensor.ValidRange.MinCelsius), Sensor.ResistanceOhms(Sensor.ValidRange.MaxCelsius));
        (readableLowOhms, readableHighOhms) = (Math.Min(atLow, atHigh) * (1 - ReadableMargin), Math.Max(atLow, atHigh) * (1 + ReadableMargin));
    }

    // Resistances the sensor model can read, widened by a margin far above its own edge slack: a code clearly outside
    // reads NaN without asking the model, whose range exception (with its formatted message) cost about 20 µs a code,
    // most of the time of a 16-bit firmware table, where most codes are out of range. Near the edges the model decides.
    private const double ReadableMargin = 1e-9;
    private readonly double readableLowOhms, readableHighOhms;

    public FrontEndDesign Design { get; }
    public ISensorModel Sensor { get; }
    public AdcTransfer Adc { get; }

    /// <summary>Gain from the divider to the ADC pin: 1 without a buffer or with a follower.</summary>
    public double BufferGain => Design.StageGain;

    public ClosedFormPoint At(double celsius)
    {
        var r = Sensor.ResistanceOhms(celsius);
        var volts = BufferGain * SensorTransfer.OutputVolts(Design, r);
        var slope = BufferGain * SensorTransfer.SlopeVoltsPerOhm(Design, r) * Sensor.SlopeOhmsPerKelvin(celsius);
        return new ClosedFormPoint(celsius, r, volts, Adc.IdealCode(volts), slope, SensorTransfer.TheveninOhms(Design, r));
    }

    /// <summary>
    /// The temperature the firmware reports for a code: the code's voltage, through the divider's inverse and the
    /// nominal sensor model. NaN for codes no sensor inside its valid range can produce (the rails, shorts, opens).
    /// </summary>
    public double ReportedCelsius(int code)
    {
        return CelsiusAtVolts(Adc.VoltsOf(code));
    }

    /// <summary>The temperature whose ideal pin voltage this is (no quantisation); NaN outside the sensor's range.</summary>
    public double CelsiusAtVolts(double volts)
    {
        var ohms = SensorTransfer.SensorOhms(Design, volts / BufferGain);
        if (!(ohms >= readableLowOhms && ohms <= readableHighOhms)) return double.NaN;
        try
        {
            return Sensor.TemperatureCelsius(ohms);
        }
        catch (SensorRangeException)
        {
            return double.NaN;
        }
    }
}
