using ThermVerify.Circuits;
using ThermVerify.Design;
using ThermVerify.Simulation;

namespace ThermVerify.FrontEnd.DeltaSigma;

/// <summary>
/// How far the front end and the digital filter keep interference at the listed frequencies (50 Hz and 60 Hz unless
/// the design lists others) out of a reading. The digital filter's part is |H(f)| of <see cref="SincFilter"/>; the
/// analog part is the engine's AC analysis from a source in series with the sensor (interference induced in its
/// leads) to the pin, with the input's average load. A declared interference amplitude at the sensor moves a reading
/// by at most its amplitude times both (a reading of a filtered sine is one value of it), in K through the closed
/// form's slope at the pin.
/// </summary>
internal static class MainsRejection
{
    public const string InterferenceSource = "Vds_interference";
    private const string SplitNode = "ds_sensor_series";

    public static IReadOnlyList<RejectionAt> At(FrontEndDesign design, double celsius)
    {
        var d = design.Adc.DeltaSigma ?? throw new ArgumentException($"{design.Name} has no delta-sigma converter.", nameof(design));
        var filter = SincFilter.Of(d);
        var frequencies = d.RejectionHertz.ToArray();
        var circuit = WithSeriesSource(InputLoading.Average(design, celsius));
        var ac = AcAnalysis.Run(circuit, FrequencySweep.At(frequencies)).Voltage(FrontEndCircuit.PinNode(design));
        var slope = Math.Abs(new ClosedFormModel(design).At(celsius).VoltsPerKelvin);
        return [.. frequencies.Select((f, i) =>
        {
            var digital = filter.Magnitude(f);
            var analog = ac[i].Magnitude;
            var volts = d.InterferenceVolts is { } a ? a * analog * digital : (double?)null;
            return new RejectionAt(f, digital, analog, volts, volts / slope);
        })];
    }

    /// <summary>The circuit with a 1 V AC source in series with the sensor, between it and the node it met.</summary>
    internal static Circuit WithSeriesSource(Circuit circuit)
    {
        var sensor = circuit.Elements.OfType<SensorResistor>().Single();
        return circuit.Replace(sensor with { NodeB = SplitNode })
            .Add(new VoltageSource(InterferenceSource, SplitNode, sensor.NodeB, new DcWaveform(0), AcMagnitude: 1));
    }
}

/// <summary>
/// The rejection at one frequency: the digital filter's |H| and the analog path's gain from the sensor to the pin
/// (fractions), and with a declared interference amplitude the largest error it makes in a reading (V at the pin, K).
/// </summary>
public sealed record RejectionAt(double Hertz, double DigitalGain, double AnalogGain, double? ErrorVolts, double? ErrorKelvin)
{
    public double DigitalDecibels => -20 * Math.Log10(DigitalGain);
    public double TotalDecibels => -20 * Math.Log10(DigitalGain * AnalogGain);
}
