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
/// A netlist's excitation switches as its sources say (<see cref="NetlistCircuit.SwitchedOn"/>: a PULSE as written,
/// a DC source stepping from 0), and the lead counts from that switch-on; the built-in engine steps it up to the
/// pulse's last corner and propagates the rest exactly (<see cref="SettledSourcesTransient"/>), ngspice steps it all.
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

    /// <summary>The design switches its excitation on only to measure (a divider's or a netlist's switch_on_lead).</summary>
    public static bool Applies(FrontEndDesign design) => LeadSeconds(design) is not null;

    /// <summary>How long before the first acquisition window the excitation switches on; null when it is on all the time.</summary>
    public static double? LeadSeconds(FrontEndDesign design) => design.Divider?.SwitchOnLeadSeconds ?? design.Netlist?.SwitchOnLeadSeconds;

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
        var lead = LeadSeconds(design)
            ?? throw new ArgumentException("The design has no switched excitation (switch_on_lead).", nameof(design));
        var adc = design.Adc;
        var period = 1 / adc.SampleRateHertz;
        var (circuit, options) = SamplingRun.Setup(design, celsius, prechargeVolts, settleVolts, 1);
        double switchOn;
        if (design.Netlist is { } netlist)
            (circuit, switchOn) = NetlistCircuit.SwitchedOn(circuit, netlist);
        else
        {
            switchOn = 0;
            var excitation = (VoltageSource)circuit["Vexc"];
            circuit = circuit.Replace(excitation with { Positive = FrontEndNodes.Supply });
            circuit = circuit.Add(new TimedSwitch(FrontEndNodes.ExcitationSwitch, FrontEndNodes.Supply, FrontEndNodes.Excitation, SwitchOnOhms,
                FrontEndCircuit.SwitchOffOhms, Once(EdgeSeconds, lead + adc.AcquisitionTimeSeconds)));
        }
        var windowOpens = switchOn + lead;
        var sampleAt = windowOpens + adc.AcquisitionTimeSeconds;
        var sampling = (TimedSwitch)circuit[FrontEndNodes.SamplingSwitch];
        circuit = circuit.Replace(sampling with { Schedule = Once(windowOpens, sampleAt) });
        if (prechargeVolts is not null)
        {
            var precharge = (TimedSwitch)circuit[FrontEndNodes.PrechargeSwitch];
            var gap = FrontEndCircuit.PrechargeGapSeconds(design);
            var open = Math.Max(windowOpens - gap, EdgeSeconds * 2);
            var close = Math.Max(0, open - (period - adc.AcquisitionTimeSeconds - gap));
            circuit = circuit.Replace(precharge with { Schedule = new PeriodicSchedule(close, sampleAt, open - close, 1) });
        }
        return (circuit, options with
        {
            StopTimeSeconds = sampleAt,
            // A netlist's switch-on is time-stepped (by ngspice all of it, by the built-in engine up to the pulse's last
            // corner, SettledSourcesTransient; its sources change over time): steps of a 500th of the
            // lead keep ngspice's trapezoidal charging within a few µV of the closed form (1 ms into 100 nF: 2 µV at 2 µs
            // steps and 5 µs, 70 µV at 20 µs; NetlistSwitchOnTests).
            MaxStepSeconds = design.Netlist is null
                ? Math.Max(sampleAt / 50, adc.AcquisitionTimeSeconds / 4)
                : Math.Min(Math.Max(sampleAt / 50, adc.AcquisitionTimeSeconds / 4), lead / 500),
        });
    }

    /// <summary>Closed once, from <paramref name="closeSeconds"/> until the sample instant (one period that ends there).</summary>
    private static PeriodicSchedule Once(double closeSeconds, double sampleAtSeconds) =>
        new(closeSeconds, sampleAtSeconds, sampleAtSeconds - closeSeconds, 1);
}
