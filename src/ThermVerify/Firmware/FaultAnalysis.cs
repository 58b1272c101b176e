using System.Globalization;
using ThermVerify.Design;
using ThermVerify.FrontEnd;

namespace ThermVerify.Firmware;

/// <summary>
/// Fault codes by Ohm's law on the ideal divider (the ADC input draws no current): an open part leaves the node tied
/// to the rail through the other part, a shorted part ties it to its own rail. The loading correction is not applied.
/// </summary>
internal static class FaultAnalysis
{
    public static FaultThresholds Thresholds(FirmwareModel model, FaultTolerances tolerances)
    {
        model.Validated();
        tolerances.Validated();
        if (model.Netlist is { } netlist) return NetlistFaultAnalysis.Thresholds(model, netlist, tolerances);
        if (model.ExcitationAmperes is { } amps) return CurrentThresholds(model, amps, tolerances);
        if (model.Bridge is { } bridge) return BridgeFaultAnalysis.Thresholds(model, bridge, tolerances);
        var corners = Corners(model, tolerances).ToArray();

        // The high rail reads Vexc/Q at each corner; the low rail is 0 V, code 0, whatever the tolerances.
        var highRail = corners.Select(c => Code(model, c, c.Excitation)).ToArray();
        var (highMin, highMax) = (highRail.Min(), highRail.Max());
        var low = model.Side == SensorSide.Low;
        FaultCode Rail(FaultKind kind, bool high) => high ? new(kind, true, highMin, highMax) : new(kind, false, 0, 0);
        FaultCode[] faults =
        [
            Rail(FaultKind.SensorOpen, low),
            Rail(FaultKind.SensorShorted, !low),
            Rail(FaultKind.FixedOpen, !low),
            Rail(FaultKind.FixedShorted, low),
        ];

        var valid = corners.SelectMany(c => new[] { model.Range.MinCelsius, model.Range.MaxCelsius }.Select(t =>
            Code(model, c, (model with { ExcitationVolts = c.Excitation, FixedOhms = c.FixedOhms }).UnloadedVolts(model.Sensor.ResistanceOhms(t))))).ToArray();
        var (lowestValid, highestValid) = (valid.Min(), valid.Max());

        if (lowestValid < 2 || highMin - highestValid < 2)
            throw new FirmwareInputException(string.Create(CultureInfo.InvariantCulture,
                $"A healthy sensor in {model.Range} reads codes {lowestValid} to {highestValid}, too close to the fault codes 0 and {highMin} to leave a threshold with margin between them; narrow the range, tighten the tolerances or move the fixed resistor."));
        // Midway; where the gap is odd the spare code goes to the healthy side, away from the threshold.
        var below = (lowestValid + 1) / 2;
        var above = highestValid + (highMin - highestValid) / 2;
        return new FaultThresholds(faults, lowestValid, highestValid, below, above);
    }

    /// <summary>
    /// A current-excited sensor, by Ohm's law with the converter drawing nothing: an open sensor lets the source drive its
    /// output to its compliance limit, beyond full scale (the top code); a shorted one reads 0 V. With a reference
    /// resistor (the "fixed" part here) an open one stops the current (0 V at the pin) and a shorted one leaves no
    /// reference (the top code). Healthy codes at the tolerance corners: I·(1 ± e)·R_s over the LSB, which scales with
    /// the reference's tolerance, or with a reference resistor with the same current and the resistor's tolerance (the
    /// current cancels).
    /// </summary>
    private static FaultThresholds CurrentThresholds(FirmwareModel model, double amps, FaultTolerances t)
    {
        var top = model.Adc.MaxCode;
        var ratiometric = t.ExcitationTracksReference;
        var valid = new List<int>();
        foreach (var se in new[] { -1, 1 })
            foreach (var sr in new[] { -1, 1 })
                foreach (var sf in new[] { -1, 1 })
                {
                    var current = amps * (1 + se * t.ExcitationFraction);
                    var lsb = model.Adc.LsbVolts * (ratiometric ? (1 + se * t.ExcitationFraction) * (1 + sf * t.FixedResistorFraction) : 1 + sr * t.ReferenceFraction);
                    valid.AddRange(new[] { model.Range.MinCelsius, model.Range.MaxCelsius }.Select(c => model.Adc.Quantise(current * model.Sensor.ResistanceOhms(c) / lsb)));
                }
        var (lowestValid, highestValid) = (valid.Min(), valid.Max());
        FaultCode[] faults =
        [
            new(FaultKind.SensorOpen, true, top, top),
            new(FaultKind.SensorShorted, false, 0, 0),
            new(FaultKind.FixedOpen, false, 0, 0),
            new(FaultKind.FixedShorted, true, top, top),
        ];
        if (lowestValid < 2 || top - highestValid < 2)
            throw new FirmwareInputException(string.Create(CultureInfo.InvariantCulture,
                $"A healthy sensor in {model.Range} reads codes {lowestValid} to {highestValid}, too close to the fault codes 0 and {top} to leave a threshold with margin between them; narrow the range, tighten the tolerances or change the current or the reference."));
        return new FaultThresholds(ratiometric ? faults : faults[..2], lowestValid, highestValid, (lowestValid + 1) / 2, highestValid + (top - highestValid) / 2);
    }

    private readonly record struct Corner(double Excitation, double LsbVolts, double FixedOhms);

    private static IEnumerable<Corner> Corners(FirmwareModel model, FaultTolerances t)
    {
        var (e, r) = t.ExcitationTracksReference ? (0.0, 0.0) : (t.ExcitationFraction, t.ReferenceFraction);
        foreach (var se in new[] { -1, 1 })
            foreach (var sr in new[] { -1, 1 })
                foreach (var sf in new[] { -1, 1 })
                    yield return new Corner(model.ExcitationVolts * (1 + se * e), model.Adc.LsbVolts * (1 + sr * r),
                        model.FixedOhms * (1 + sf * t.FixedResistorFraction));
    }

    /// <summary>The code at a corner: the voltage over the corner's LSB, quantised by the design's transfer convention.</summary>
    private static int Code(FirmwareModel model, Corner c, double volts) => model.Adc.Quantise(volts / c.LsbVolts);
}
