using System.Collections.Immutable;
using ThermVerify.Circuits;
using ThermVerify.Design;
using ThermVerify.Simulation;

namespace ThermVerify.FrontEnd;

/// <summary>
/// A divider excited only while measuring: a GPIO switch joins the excitation to the divider at t = 0 (1 ns after, so
/// that the operating point is the one with the excitation off), and the first acquisition window opens after the
/// switch-on lead. The first sample is compared with the settled pin voltage; the reservoir and the divider must have
/// settled by then. Every switch is a timed switch with one window of a common period ending at the sample, so the
/// built-in engine propagates the run exactly (no time step) when the front end is linear; any engine can run it.
/// The tolerances are those of every sampling run (<see cref="SamplingRun.Setup"/>).
/// </summary>
internal static class SwitchOnSettling
{
    /// <summary>When the excitation switch closes: short against any time constant of the front end.</summary>
    private const double EdgeSeconds = 1e-9;

    /// <summary>
    /// The GPIO's resistance when on: small enough that its drop on any divider the loader accepts is far below 0.01 LSB
    /// (1 mΩ on a 1 kΩ divider is 1 ppm), large enough to leave the matrix well conditioned.
    /// </summary>
    private const double SwitchOnOhms = 1e-3;

    public static double FirstSampleVolts(FrontEndDesign design, double celsius, double? prechargeVolts, double settleVolts,
        ICheckEngine? engine = null)
    {
        var (circuit, options) = Setup(design, celsius, prechargeVolts, settleVolts);
        var run = (engine ?? BuiltInEngine.Instance).StartTransient(circuit, options);
        return run.VoltageAt(options.StopTimeSeconds, FrontEndNodes.Hold);
    }

    /// <summary>The switch-on circuit and its transient's options, for every engine; the run stops at the sample.</summary>
    internal static (Circuit Circuit, TransientOptions Options) Setup(FrontEndDesign design, double celsius, double? prechargeVolts, double settleVolts)
    {
        var lead = design.Divider?.SwitchOnLeadSeconds
            ?? throw new ArgumentException("The design has no switched excitation ([divider] switch_on_lead).", nameof(design));
        var adc = design.Adc;
        var period = 1 / adc.SampleRateHertz;
        var sampleAt = lead + adc.AcquisitionTimeSeconds;
        var (circuit, options) = SamplingRun.Setup(design, celsius, prechargeVolts, settleVolts, 1);
        var excitation = (VoltageSource)circuit["Vexc"];
        circuit = circuit.Replace(excitation with { Positive = FrontEndNodes.Supply });
        circuit = circuit.Add(new TimedSwitch(FrontEndNodes.ExcitationSwitch, FrontEndNodes.Supply, FrontEndNodes.Excitation, SwitchOnOhms,
            FrontEndCircuit.SwitchOffOhms, Once(EdgeSeconds, sampleAt)));
        var sampling = (TimedSwitch)circuit[FrontEndNodes.SamplingSwitch];
        circuit = circuit.Replace(sampling with { Schedule = Once(lead, sampleAt) });
        if (prechargeVolts is not null)
        {
            var precharge = (TimedSwitch)circuit[FrontEndNodes.PrechargeSwitch];
            var gap = FrontEndCircuit.PrechargeGapSeconds(design);
            var open = Math.Max(lead - gap, EdgeSeconds * 2);
            var close = Math.Max(0, open - (period - adc.AcquisitionTimeSeconds - gap));
            circuit = circuit.Replace(precharge with { Schedule = new PeriodicSchedule(close, sampleAt, open - close, 1) });
        }
        return (circuit, options with
        {
            StopTimeSeconds = sampleAt,
            MaxStepSeconds = Math.Max(sampleAt / 50, adc.AcquisitionTimeSeconds / 4),
        });
    }

    /// <summary>Closed once, from <paramref name="closeSeconds"/> until the sample instant (one period that ends there).</summary>
    private static PeriodicSchedule Once(double closeSeconds, double sampleAtSeconds) =>
        new(closeSeconds, sampleAtSeconds, sampleAtSeconds - closeSeconds, 1);
}
