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
            Code(model, c, DividerFormula.OutputVolts(model.Side, c.Excitation, model.Sensor.ResistanceOhms(t), c.FixedOhms)))).ToArray();
        var (lowestValid, highestValid) = (valid.Min(), valid.Max());

        if (lowestValid < 2 || highMin - highestValid < 2)
            throw new FirmwareInputException(string.Create(CultureInfo.InvariantCulture,
                $"A healthy sensor in {model.Range} reads codes {lowestValid} to {highestValid}, too close to the fault codes 0 and {highMin} to leave a threshold with margin between them; narrow the range, tighten the tolerances or move the fixed resistor."));
        // Midway; where the gap is odd the spare code goes to the healthy side, away from the threshold.
        var below = (lowestValid + 1) / 2;
        var above = highestValid + (highMin - highestValid) / 2;
        return new FaultThresholds(faults, lowestValid, highestValid, below, above);
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
