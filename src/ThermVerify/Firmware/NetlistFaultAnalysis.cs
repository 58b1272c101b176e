using System.Globalization;
using ThermVerify.Design;
using ThermVerify.Circuits;
using ThermVerify.FrontEnd;
using ThermVerify.Simulation;

namespace ThermVerify.Firmware;

/// <summary>
/// Fault codes of a netlist front end from its ideal transfer v(R) = (a·R + b)/(c·R + 1) (<see cref="NetlistTransfer"/>:
/// nominal parts, no converter, diodes open): a shorted sensor reads v(0) = b, an open one the limit R → ∞, a/c (beyond
/// either rail when c = 0, a sensor fed by a current). Since v is monotone in R the two faults lie on either side of
/// the healthy codes. Where [netlist] names a `fixed` resistor its open and short are added (scaled far up or down in
/// the ideal netlist, with a healthy sensor at either end of the range); one that reads among the healthy codes is
/// refused by name, since no threshold can tell it from a reading. The tolerance corners are every sign combination of the [[netlist.part]] value tolerances (each
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
        var (fixedOpen, fixedShorted) = (new List<int>(), new List<int>());
        var sensorEnds = new[] { model.Sensor.ResistanceOhms(model.Range.MinCelsius), model.Sensor.ResistanceOhms(model.Range.MaxCelsius) };
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
                int Code(double volts) => model.Adc.Quantise(Math.Clamp(volts / lsb, model.Adc.MinCode - 1.0, model.Adc.MaxCode + 1.0));
                shorted.Add(Code(transfer.OutputVolts(0)));
                open.Add(Code(c != 0 ? a / c : a * double.PositiveInfinity));
                foreach (var r in sensorEnds)
                    valid.Add(Code(transfer.OutputVolts(r)));
                if (netlist.FixedElement is { } name)
                    foreach (var r in sensorEnds)
                    {
                        fixedOpen.Add(Code(FixedFaultVolts(corner, name, r, OpenFactor)));
                        fixedShorted.Add(Code(FixedFaultVolts(corner, name, r, ShortFactor)));
                    }
            }
        }

        var (lowestValid, highestValid) = (valid.Min(), valid.Max());
        var openHigh = open.Min() > highestValid || open.Average() > shorted.Average();
        var faults = new List<FaultCode>
        {
            new(FaultKind.SensorOpen, openHigh, open.Min(), open.Max()),
            new(FaultKind.SensorShorted, !openHigh, shorted.Min(), shorted.Max()),
        };
        // The named fixed resistor's faults, with a healthy sensor anywhere in the range: a fault that can read like a
        // healthy sensor cannot be told from one by thresholds, and is said rather than left out.
        foreach (var (kind, codes) in new[] { (FaultKind.FixedOpen, fixedOpen), (FaultKind.FixedShorted, fixedShorted) }.Where(x => x.Item2.Count > 0))
        {
            var (lo, hi) = (codes.Min(), codes.Max());
            if (lo <= highestValid && hi >= lowestValid)
                throw new FirmwareInputException(string.Create(CultureInfo.InvariantCulture,
                    $"With {netlist.FixedElement} {(kind == FaultKind.FixedOpen ? "open" : "shorted")} the pin reads codes {lo} to {hi}, among the codes a healthy sensor in {model.Range} reads ({lowestValid} to {highestValid}): no threshold tells that fault from a reading. Remove fixed from [netlist] to have the sensor's faults alone, or change the front end."));
            faults.Add(new FaultCode(kind, lo > highestValid, lo, hi));
        }
        var (lowFault, highFault) = (faults.Where(f => !f.HighRail).Max(f => f.MaxCode), faults.Where(f => f.HighRail).Min(f => f.MinCode));
        if (lowestValid - lowFault < 2 || highFault - highestValid < 2)
            throw new FirmwareInputException(string.Create(CultureInfo.InvariantCulture,
                $"A healthy sensor in {model.Range} reads codes {lowestValid} to {highestValid}, too close to the fault codes {lowFault} and {highFault} (an open or shorted sensor through the netlist's ideal transfer) to leave a threshold with margin between them; narrow the range or tighten the tolerances."));
        // Midway; where the gap is odd the spare code goes to the healthy side, away from the threshold.
        var below = lowFault + (lowestValid - lowFault + 1) / 2;
        var above = highestValid + (highFault - highestValid) / 2;
        return new FaultThresholds(faults, lowestValid, highestValid, below, above);
    }

    /// <summary>The fixed resistor's open and short, as its resistance scaled far up or down (the pin's voltage is bilinear in it, so this is its limit to a few parts in 10⁹).</summary>
    private const double OpenFactor = 1e9, ShortFactor = 1e-9;

    /// <summary>The ideal netlist's pin voltage (a differential input's two pins' difference) with the fixed resistor scaled by <paramref name="factor"/> and the sensor at <paramref name="sensorOhms"/>.</summary>
    private static double FixedFaultVolts(NetlistSpec netlist, string fixedName, double sensorOhms, double factor)
    {
        var circuit = NetlistCircuit.Ideal(netlist, sensorOhms);
        var resistor = (Resistor)circuit[fixedName];
        var solved = OperatingPoint.Solve(circuit.Replace(resistor with { ResistanceOhms = resistor.ResistanceOhms * factor }));
        // A differential input converts the difference of its two pins.
        return solved.Voltage(netlist.PinNode) - (netlist.NegativePinNode is { } negative ? solved.Voltage(negative) : 0);
    }
}
