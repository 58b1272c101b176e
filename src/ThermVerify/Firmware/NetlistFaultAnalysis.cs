using System.Globalization;
using ThermVerify.Design;
using ThermVerify.FrontEnd;

namespace ThermVerify.Firmware;

/// <summary>
/// Fault codes of a netlist front end from its ideal transfer v(R) = (a·R + b)/(c·R + 1) (<see cref="NetlistTransfer"/>:
/// nominal parts, no converter, diodes open): a shorted sensor reads v(0) = b, an open one the limit R → ∞, a/c (beyond
/// either rail when c = 0, a sensor fed by a current). Since v is monotone in R the two faults lie on either side of
/// the healthy codes. The tolerance corners are every sign combination of the [[netlist.part]] value tolerances (each
/// resistance enters the nodal matrix as a rank-one term, so a node voltage is monotone in each part and its extremes
/// over the box lie at corners) and, with a fixed reference, its tolerance and drift; a ratiometric reference is the
/// corner's own reference-node source. The thresholds sit midway, as for the divider (<see cref="FaultAnalysis"/>).
/// </summary>
internal static class NetlistFaultAnalysis
{
    /// <summary>Parts whose corners are enumerated (2ⁿ transfers); more are refused rather than sampled.</summary>
    public const int MaximumParts = 10;

    public static FaultThresholds Thresholds(FirmwareModel model, NetlistSpec netlist, FaultTolerances tolerances)
    {
        var parts = netlist.Parts.Where(p => p.Tolerance != 0).ToList();
        if (parts.Count > MaximumParts)
            throw new FirmwareInputException(string.Create(CultureInfo.InvariantCulture,
                $"Fault thresholds enumerate every corner of the netlist's part tolerances, and {parts.Count} parts carry one (at most {MaximumParts}); give the parts whose tolerance matters."));
        var bits = model.Adc.Bits;
        var referenceSpread = netlist.ReferenceNode is null ? tolerances.ReferenceFraction : 0;
        var (open, shorted, valid) = (new List<int>(), new List<int>(), new List<int>());
        for (var mask = 0; mask < 1 << parts.Count; mask++)
        {
            var corner = netlist.WithScaledValues(parts.Select((p, i) => (p.Name, Fraction: ((mask >> i) & 1) == 1 ? p.Tolerance : -p.Tolerance))
                .ToDictionary(x => x.Name, x => x.Fraction, StringComparer.OrdinalIgnoreCase));
            var transfer = NetlistTransfer.Of(corner);
            var (a, _, c) = transfer.Coefficients;
            var reference = corner.ReferenceVolts ?? model.Adc.ReferenceVolts;
            foreach (var sign in new[] { -1, 1 })
            {
                var lsb = reference * (1 + sign * referenceSpread) / (1 << bits);
                int Code(double volts) => model.Adc.Quantise(Math.Clamp(volts / lsb, -1, model.Adc.MaxCode + 1.0));
                shorted.Add(Code(transfer.OutputVolts(0)));
                open.Add(Code(c != 0 ? a / c : a * double.PositiveInfinity));
                valid.Add(Code(transfer.OutputVolts(model.Sensor.ResistanceOhms(model.Range.MinCelsius))));
                valid.Add(Code(transfer.OutputVolts(model.Sensor.ResistanceOhms(model.Range.MaxCelsius))));
            }
        }

        var (lowestValid, highestValid) = (valid.Min(), valid.Max());
        var openHigh = open.Min() > highestValid || open.Average() > shorted.Average();
        var (high, low) = openHigh ? (open, shorted) : (shorted, open);
        FaultCode[] faults =
        [
            new(FaultKind.SensorOpen, openHigh, open.Min(), open.Max()),
            new(FaultKind.SensorShorted, !openHigh, shorted.Min(), shorted.Max()),
        ];
        var (lowFault, highFault) = (low.Max(), high.Min());
        if (lowestValid - lowFault < 2 || highFault - highestValid < 2)
            throw new FirmwareInputException(string.Create(CultureInfo.InvariantCulture,
                $"A healthy sensor in {model.Range} reads codes {lowestValid} to {highestValid}, too close to the fault codes {lowFault} and {highFault} (an open or shorted sensor through the netlist's ideal transfer) to leave a threshold with margin between them; narrow the range or tighten the tolerances."));
        // Midway; where the gap is odd the spare code goes to the healthy side, away from the threshold.
        var below = lowFault + (lowestValid - lowFault + 1) / 2;
        var above = highestValid + (highFault - highestValid) / 2;
        return new FaultThresholds(faults, lowestValid, highestValid, below, above);
    }
}
