using ThermVerify.Design;
using ThermVerify.Simulation;

namespace ThermVerify.FrontEnd;

/// <summary>One acquisition window: time from the sampling switch closing, the pin and the sampling capacitor.</summary>
public sealed record AcquisitionTrace(int Conversion, double[] TimeFromStartSeconds, double[] PinVolts, double[] HoldVolts, double SampledVolts);

/// <summary>The first conversions at one temperature and precharge, recorded around each acquisition window.</summary>
public sealed record SamplingWaveform(double Celsius, double? PrechargeVolts, double AcquisitionSeconds, IReadOnlyList<AcquisitionTrace> Conversions)
{
    /// <summary>
    /// Re-simulates the sampling circuit from the settled front end for <paramref name="conversions"/> conversions.
    /// Windows are recorded rather than whole periods because the acquisition is often a thousandth of the period
    /// or less; each window starts a quarter of the acquisition time early so the level the capacitor brings is seen.
    /// </summary>
    public static SamplingWaveform Simulate(FrontEndDesign design, double celsius, double? prechargeVolts, int conversions = 3, int pointsPerWindow = 160)
    {
        if (conversions < 1) throw new ArgumentOutOfRangeException(nameof(conversions), "record at least one conversion");
        var adc = design.Adc;
        var period = 1 / adc.SampleRateHertz;
        var acquisition = adc.AcquisitionTimeSeconds;
        var lead = Math.Min(acquisition / 4, (period - acquisition) / 2);
        var windows = Enumerable.Range(0, conversions)
            .Select(k => FrontEndCircuit.SampleTimeSeconds(design, k) - acquisition)
            .Select(start => Enumerable.Range(0, pointsPerWindow + 1).Select(j => start - lead + j * (acquisition + lead) / pointsPerWindow).ToArray())
            .ToArray();

        var circuit = FrontEndCircuit.Sampling(design, prechargeVolts, conversions) with { TemperatureCelsius = celsius };
        var simulation = new TransientSimulation(circuit, new TransientOptions
        {
            StopTimeSeconds = conversions * period,
            MaxStepSeconds = period / 4,
            RelativeTolerance = 1e-5,
            VoltageToleranceVolts = Math.Max(design.Check.SettleLimitLsb * (adc.ReferenceVolts ?? design.Divider.ExcitationVolts) / (1 << adc.Bits) / 100, 1e-12),
            OutputTimesSeconds = [.. windows.SelectMany(w => w).Where(t => t > 0)],
        });
        simulation.AdvanceTo(conversions * period);
        var result = simulation.Result;
        var pin = FrontEndCircuit.PinNode(design);

        var traces = windows.Select((times, k) =>
        {
            var start = FrontEndCircuit.SampleTimeSeconds(design, k) - acquisition;
            // The last window ends at the stop time, which rounding may put a hair beyond the last recorded point.
            var inside = times.Where(t => t >= result.StartTimeSeconds).Select(t => Math.Min(t, result.EndTimeSeconds)).ToArray();
            return new AcquisitionTrace(k + 1,
                [.. inside.Select(t => t - start)],
                [.. inside.Select(t => result.VoltageAt(pin, t))],
                [.. inside.Select(t => result.VoltageAt(FrontEndNodes.Hold, t))],
                result.VoltageAt(FrontEndNodes.Hold, FrontEndCircuit.SampleTimeSeconds(design, k)));
        }).ToList();
        return new SamplingWaveform(celsius, prechargeVolts, acquisition, traces);
    }
}
