using ThermVerify.Design;

namespace ThermVerify.FrontEnd;

/// <summary>One acquisition window: time from the sampling switch closing, the pin and the sampling capacitor.</summary>
public sealed record AcquisitionTrace(int Conversion, double[] TimeFromStartSeconds, double[] PinVolts, double[] HoldVolts, double SampledVolts);

/// <summary>The first conversions at one temperature and precharge, recorded around each acquisition window.</summary>
public sealed record SamplingWaveform(double Celsius, double? PrechargeVolts, double AcquisitionSeconds, IReadOnlyList<AcquisitionTrace> Conversions)
{
    /// <summary>Conversions a check records: the first shows the precharge step, the next ones the recovery.</summary>
    public const int DefaultConversions = 3;

    /// <summary>
    /// Runs the sampling transient from the settled front end with the engine and the tolerances of the check
    /// itself (<see cref="SamplingRun.Setup"/>), reading the pin and the sampling capacitor at
    /// <paramref name="pointsPerWindow"/> + 1 times in each acquisition window. Windows are recorded rather than whole
    /// periods because the acquisition is often a thousandth of the period or less; each starts a quarter of the
    /// acquisition time early so the level the capacitor brings is seen, and ends exactly at the sample instant.
    /// </summary>
    public static SamplingWaveform Record(FrontEndDesign design, double celsius, double? prechargeVolts, double settleVolts,
        ICheckEngine engine, int conversions = DefaultConversions, int pointsPerWindow = 160)
    {
        if (conversions < 1) throw new ArgumentOutOfRangeException(nameof(conversions), "record at least one conversion");
        var acquisition = design.Adc.AcquisitionTimeSeconds;
        var period = 1 / design.Adc.SampleRateHertz;
        var lead = Math.Min(acquisition / 4, (period - acquisition) / 2);
        var (circuit, options) = SamplingRun.Setup(design, celsius, prechargeVolts, settleVolts, conversions);
        var run = engine.StartTransient(circuit, options);
        var pin = FrontEndCircuit.PinNode(design);

        var traces = new List<AcquisitionTrace>(conversions);
        for (var k = 0; k < conversions; k++)
        {
            var sampleTime = FrontEndCircuit.SampleTimeSeconds(design, k);
            var span = acquisition + lead;
            // Counted back from the sample instant, so the last point is that instant exactly (never past the run's end).
            var times = Enumerable.Range(0, pointsPerWindow + 1).Select(j => sampleTime - (pointsPerWindow - j) * span / pointsPerWindow).ToArray();
            var pinVolts = new double[times.Length];
            var holdVolts = new double[times.Length];
            for (var j = 0; j < times.Length; j++)
            {
                pinVolts[j] = run.VoltageAt(times[j], pin);
                holdVolts[j] = run.VoltageAt(times[j], FrontEndNodes.Hold);
                // A differential input: both traces are differences, the inputs' and the two sampling capacitors'.
                if (SamplingRun.SamplesNegativeInput(design))
                {
                    pinVolts[j] -= run.VoltageAt(times[j], FrontEndCircuit.NegativeNode(design));
                    holdVolts[j] -= run.VoltageAt(times[j], FrontEndNodes.HoldNegative);
                }
            }
            traces.Add(new AcquisitionTrace(k + 1, [.. times.Select(t => t - (sampleTime - acquisition))], pinVolts, holdVolts, holdVolts[^1]));
        }
        return new SamplingWaveform(celsius, prechargeVolts, acquisition, traces);
    }
}
