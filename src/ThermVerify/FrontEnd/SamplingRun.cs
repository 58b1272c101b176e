using ThermVerify.Circuits;
using ThermVerify.Design;
using ThermVerify.Simulation;

namespace ThermVerify.FrontEnd;

/// <summary>Successive conversions at one temperature, from a settled front end, until the sampled value is stable.</summary>
public sealed record SamplingOutcome(
    double Celsius,
    double? PrechargeVolts,
    double FirstVolts,
    double SteadyVolts,
    int ConversionsSimulated,
    bool Extrapolated,
    IReadOnlyList<double> SampledVolts)
{
    /// <summary>The steady sample is the exact periodic steady state (one solve), not the end of a run of conversions.</summary>
    public bool ExactSteadyState { get; init; }
}

/// <summary>
/// Simulates conversion after conversion with the sampling circuit. The sampled value is the sampling capacitor's
/// voltage when the switch opens. It is stable when successive samples differ by less than the settle limit
/// three times running. For a linear front end the samples then approach their limit geometrically (one slow mode,
/// the reservoir, dominates); when the ratio of successive differences has been steady for three conversions the
/// limit is extrapolated as s_n + Δ_n·r/(1 − r) (Aitken's Δ² process) instead of simulating hundreds of periods,
/// and the outcome says so. Where the engine propagates the circuit exactly (the built-in engine on a front end that
/// is linear between switch edges), the steady sample is the exact periodic steady state instead.
/// </summary>
internal static class SamplingRun
{
    /// <summary>The default bound on conversions per run; the run's limit (--max-conversions) applies unless a caller gives one.</summary>
    public const int DefaultMaximumConversions = 20000;

    /// <summary>The first conversion alone, from the settled front end.</summary>
    public static double FirstSampleVolts(FrontEndDesign design, double celsius, double? prechargeVolts, double settleVolts,
        ICheckEngine? engine = null)
    {
        var simulation = Start(engine, design, celsius, prechargeVolts, settleVolts, conversions: 1);
        return Sample(design, simulation, 0);
    }

    /// <summary>Whether the converter samples its negative input too (a differential input): its samples are then v(hold) − v(holdn).</summary>
    public static bool SamplesNegativeInput(FrontEndDesign design) => design.Adc.NegativeInput is not null;

    /// <summary>Conversion k's sample: the sampling capacitor's voltage, less the negative one's for a differential input.</summary>
    private static double Sample(FrontEndDesign design, ISampledTransient simulation, int k)
    {
        var t = FrontEndCircuit.SampleTimeSeconds(design, k);
        var positive = simulation.VoltageAt(t, FrontEndNodes.Hold);
        return SamplesNegativeInput(design) ? positive - simulation.VoltageAt(t, FrontEndNodes.HoldNegative) : positive;
    }

    /// <summary>The exact periodic steady sample, where the engine has it (both capacitors for a differential input).</summary>
    private static bool TrySteady(FrontEndDesign design, ISampledTransient simulation, out double volts)
    {
        if (!simulation.TryPeriodicSteadyState(FrontEndNodes.SamplingSwitch, FrontEndNodes.Hold, out volts)) return false;
        if (!SamplesNegativeInput(design)) return true;
        if (!simulation.TryPeriodicSteadyState(FrontEndNodes.NegativeSamplingSwitch, FrontEndNodes.HoldNegative, out var negative)) return false;
        volts -= negative;
        return true;
    }

    public static SamplingOutcome Run(FrontEndDesign design, double celsius, double? prechargeVolts, double settleVolts,
        int? maximumConversions = null, CancellationToken cancel = default, ICheckEngine? engine = null)
    {
        var limit = maximumConversions ?? Limits.Work.Limits.MaximumConversions;
        var simulation = Start(engine, design, celsius, prechargeVolts, settleVolts, limit);
        if (TrySteady(design, simulation, out var exactSteady))
            return ApproachTo(exactSteady);

        var samples = new List<double>();
        var stableRuns = 0;
        var steadyRatioRuns = 0;
        for (var k = 0; k < limit; k++)
        {
            cancel.ThrowIfCancellationRequested();
            samples.Add(Sample(design, simulation, k));
            if (k == 0) continue;

            var delta = samples[k] - samples[k - 1];
            stableRuns = Math.Abs(delta) < settleVolts ? stableRuns + 1 : 0;
            if (stableRuns >= 3) return Outcome(samples[k], extrapolated: false);
            if (k < 3) continue;

            var previousDelta = samples[k - 1] - samples[k - 2];
            var ratio = delta / previousDelta;
            var earlierRatio = previousDelta / (samples[k - 2] - samples[k - 3]);
            steadyRatioRuns = ratio is > 0 and < 0.999 && Math.Abs(ratio - earlierRatio) < 1e-3 * ratio ? steadyRatioRuns + 1 : 0;
            if (steadyRatioRuns >= 3) return Outcome(samples[k] + delta * ratio / (1 - ratio), extrapolated: true);
        }
        throw new SimulationException(
            $"Sampling at {celsius:0.##} °C did not settle to {settleVolts * 1e6:G3} µV within {limit} conversions " +
            $"(last change {(samples.Count > 1 ? (samples[^1] - samples[^2]) * 1e6 : double.NaN):G3} µV); loosen [check] settle_limit, raise --max-conversions, " +
            "or check the front end for oscillation.");

        SamplingOutcome Outcome(double steady, bool extrapolated) =>
            new(celsius, prechargeVolts, samples[0], steady, samples.Count, extrapolated, samples);

        // With the limit known exactly, the conversions are read only until they are within the settle limit of it
        // three times running (at most 64), so that the outcome still shows how the samples approach it.
        SamplingOutcome ApproachTo(double steady)
        {
            var approach = new List<double>();
            var near = 0;
            for (var k = 0; k < Math.Min(limit, ApproachConversions) && near < 3; k++)
            {
                cancel.ThrowIfCancellationRequested();
                approach.Add(Sample(design, simulation, k));
                near = Math.Abs(approach[k] - steady) < settleVolts ? near + 1 : 0;
            }
            return new SamplingOutcome(celsius, prechargeVolts, approach[0], steady, approach.Count, false, approach) { ExactSteadyState = true };
        }
    }

    /// <summary>Conversions read to show the approach to an exact steady state.</summary>
    private const int ApproachConversions = 64;

    /// <summary>The sampling transient's circuit and options, the same for every engine.</summary>
    public static (Circuit Circuit, TransientOptions Options) Setup(FrontEndDesign design, double celsius, double? prechargeVolts,
        double settleVolts, int conversions)
    {
        var period = 1 / design.Adc.SampleRateHertz;
        var circuit = FrontEndCircuit.Sampling(design, prechargeVolts, conversions, celsius);
        return (circuit, new TransientOptions
        {
            // The last sample instant itself, computed as every sample time is, so a read there is never past the end.
            StopTimeSeconds = FrontEndCircuit.SampleTimeSeconds(design, conversions - 1),
            MaxStepSeconds = period / 4,
            RelativeTolerance = RelativeToleranceFor(AdcTransfer.Of(design)),
            VoltageToleranceVolts = Math.Max(settleVolts / 1000, 1e-12),
            AccuracyVolts = LinearityToleranceFor(design),
        });
    }

    /// <summary>
    /// How far a buffer's op-amp may depart from linear and still be propagated exactly: 0.01 LSB at the pin, divided by
    /// the buffer's gain, the accuracy every check figure is held to. Exact propagation carries the slewing stage's
    /// residual to first order and holds its effect on every node within half of this where a value is read
    /// (docs/engine.md), and holds the output clamp's departure to it.
    /// </summary>
    internal static double LinearityToleranceFor(FrontEndDesign design) =>
        0.01 * AdcTransfer.Of(design).LsbVolts / Math.Max(1, Math.Abs(design.StageGain));

    /// <summary>
    /// The time-stepping engine's relative tolerance for the accuracy the check needs: a sample within 0.01 LSB, with
    /// a factor 2 to spare. The global error of a sample grows as the local tolerance to the power 2/3 (second-order
    /// steps) and the relative part dominates at volt levels; on the worst case measured, a charge-sharing step onto
    /// an unbuffered 100 kΩ divider, relative 1e-8 left about 2 µV against ngspice and the two-capacitor closed form
    /// (1e-5 left 0.2 mV). Scaled from there: 2.9e-8 for 12 bits on 3.3 V, 2.3e-7 for 10 bits, 4.5e-10 for 16 bits.
    /// Exact propagation, where the circuit allows it, has no such error and ignores the setting.
    /// </summary>
    internal static double RelativeToleranceFor(AdcTransfer adc)
    {
        const double MeasuredErrorVolts = 2e-6, AtTolerance = 1e-8;
        var wantedVolts = 0.005 * adc.LsbVolts;
        return Math.Clamp(AtTolerance * Math.Pow(wantedVolts / MeasuredErrorVolts, 1.5), 1e-11, 1e-5);
    }

    private static ISampledTransient Start(ICheckEngine? engine, FrontEndDesign design, double celsius, double? prechargeVolts,
        double settleVolts, int conversions)
    {
        var (circuit, options) = Setup(design, celsius, prechargeVolts, settleVolts, conversions);
        return (engine ?? BuiltInEngine.Instance).StartTransient(circuit, options);
    }
}
