using System.Collections.Immutable;
using ThermVerify.Circuits;
using ThermVerify.Design;

namespace ThermVerify.FrontEnd;

/// <summary>
/// A divider excited only while measuring: the excitation steps from 0 V at t = 0, every capacitor starts from the
/// operating point with the excitation off, and the first acquisition window opens after the switch-on lead. The
/// first sample is compared with the settled pin voltage; the reservoir and the divider must have settled by then.
/// Run by the check's engine at the tolerances of every sampling run (<see cref="SamplingRun.Setup"/>).
/// </summary>
internal static class SwitchOnSettling
{
    /// <summary>Rise time of the excitation switch: short against any time constant of the front end.</summary>
    private const double EdgeSeconds = 1e-9;

    public static double FirstSampleVolts(FrontEndDesign design, double celsius, double? prechargeVolts, double settleVolts,
        ICheckEngine? engine = null)
    {
        var lead = design.Divider?.SwitchOnLeadSeconds
            ?? throw new ArgumentException("The design has no switched excitation ([divider] switch_on_lead).", nameof(design));
        var adc = design.Adc;
        var period = 1 / adc.SampleRateHertz;
        var (circuit, options) = SamplingRun.Setup(design, celsius, prechargeVolts, settleVolts, 1);
        circuit = circuit.Replace(new VoltageSource("Vexc", FrontEndNodes.Excitation, Circuit.Ground,
            new PiecewiseLinearWaveform((0, 0), (EdgeSeconds, design.VoltageDivider.ExcitationVolts))));
        var sampling = (TimedSwitch)circuit[FrontEndNodes.SamplingSwitch];
        var sampleAt = lead + adc.AcquisitionTimeSeconds;
        circuit = circuit.Replace(sampling with { Schedule = new IntervalSchedule((lead, sampleAt)) });
        if (prechargeVolts is not null)
        {
            var precharge = (TimedSwitch)circuit[FrontEndNodes.PrechargeSwitch];
            var gap = FrontEndCircuit.PrechargeGapSeconds(design);
            var open = Math.Max(lead - gap, EdgeSeconds * 2);
            var close = Math.Max(0, open - (period - adc.AcquisitionTimeSeconds - gap));
            circuit = circuit.Replace(precharge with { Schedule = new IntervalSchedule(ImmutableArray.Create((close, open))) });
        }
        var run = (engine ?? BuiltInEngine.Instance).StartTransient(circuit, options with
        {
            StopTimeSeconds = sampleAt,
            MaxStepSeconds = Math.Max(sampleAt / 50, adc.AcquisitionTimeSeconds / 4),
        });
        return run.VoltageAt(sampleAt, FrontEndNodes.Hold);
    }
}
