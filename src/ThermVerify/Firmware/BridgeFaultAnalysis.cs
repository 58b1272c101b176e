using System.Globalization;
using ThermVerify.Design;
using ThermVerify.FrontEnd;

namespace ThermVerify.Firmware;

/// <summary>
/// Fault codes of a bridge by Ohm's law and the bridge equation (the converter draws no current): an open or shorted
/// part of the sensor's half ties V+ to a rail, so V_d = E − V− (V+ at the excitation) or −V− (V+ at ground), with
/// V− = E·R_low/(R_high + R_low) from the intact opposite half. With the sensor low an open sensor or a shorted fixed
/// resistor reads high, a shorted sensor or an open fixed resistor low; the other way round with the sensor high. On
/// unsigned codes the negative V_d is the bottom code; on signed codes (a differential input) it reads as itself. The
/// opposite half's arms, open or shorted, put V− at 0 V or at E with a healthy sensor anywhere in the range (V_d = V+ or
/// V+ − E); one that reads among the healthy codes is refused by name, as for a netlist's fixed resistor. The
/// tolerance corners are every sign of the excitation and the reference (none where they are one, ratiometric), the
/// fixed resistor and the opposite half's two resistors; the thresholds sit midway, as for the divider (<see cref="FaultAnalysis"/>).
/// Behind an amplifier V_d reaches the converter as its output (<see cref="FirmwareAmplifier"/>), at every sign of its
/// gain error and input-referred offset, clipped to its output range: an open sensor then reads the output's top.
/// </summary>
internal static class BridgeFaultAnalysis
{
    public static FaultThresholds Thresholds(FirmwareModel model, BridgeSpec bridge, FaultTolerances t)
    {
        var (e, r) = t.ExcitationTracksReference ? (0.0, 0.0) : (t.ExcitationFraction, t.ReferenceFraction);
        var (high, low, valid) = (new List<int>(), new List<int>(), new List<int>());
        var (oppositeAtGround, oppositeAtExcitation) = (new List<int>(), new List<int>());
        var sensorEnds = new[] { model.Sensor.ResistanceOhms(model.Range.MinCelsius), model.Sensor.ResistanceOhms(model.Range.MaxCelsius) };
        // Two more corners behind an amplifier: its gain error and its input-referred offset, each at either sign.
        for (var mask = 0; mask < (model.Amplifier is null ? 32 : 128); mask++)
        {
            double Sign(int bit) => ((mask >> bit) & 1) == 1 ? 1 : -1;
            var excitation = model.ExcitationVolts * (1 + Sign(0) * e);
            var lsb = model.Adc.LsbVolts * (1 + Sign(1) * r);
            var fixedOhms = model.FixedOhms * (1 + Sign(2) * t.FixedResistorFraction);
            var opposite = bridge with
            {
                HighOhms = bridge.HighOhms * (1 + Sign(3) * t.OppositeHighFraction),
                LowOhms = bridge.LowOhms * (1 + Sign(4) * t.OppositeLowFraction),
            };
            var negative = BridgeFormula.NegativeVolts(excitation, opposite.HighOhms, opposite.LowOhms);
            // Beyond the converter's ends every voltage reads the end code; the clamp keeps the division finite.
            // V_d reaches the converter through the amplifier where there is one (at this corner, its output clipped to its range).
            double Out(double volts) => model.Amplifier is { } a ? a.CornerOutputVolts(volts, Sign(5), Sign(6)) : volts;
            int Code(double volts) => model.Adc.Quantise(Math.Clamp(Out(volts) / lsb, model.Adc.MinCode - 1.0, model.Adc.MaxCode + 1.0));
            high.Add(Code(excitation - negative));
            low.Add(Code(-negative));
            valid.AddRange(sensorEnds.Select(ohms => Code(BridgeFormula.OutputVolts(model.Side, excitation, fixedOhms, opposite, ohms))));
            // An opposite arm open or shorted puts V− at 0 V or at E, with a healthy sensor anywhere in the range: V_d = V+ or V+ − E.
            foreach (var ohms in sensorEnds)
            {
                var plus = DividerFormula.OutputVolts(model.Side, excitation, ohms, fixedOhms);
                oppositeAtGround.Add(Code(plus));
                oppositeAtExcitation.Add(Code(plus - excitation));
            }
        }

        var (lowestValid, highestValid) = (valid.Min(), valid.Max());
        var (highMin, highMax, lowMin, lowMax) = (high.Min(), high.Max(), low.Min(), low.Max());
        var sensorLow = model.Side == SensorSide.Low;
        FaultCode Rail(FaultKind kind, bool atExcitation) => atExcitation ? new(kind, true, highMin, highMax) : new(kind, false, lowMin, lowMax);
        List<FaultCode> faults =
        [
            Rail(FaultKind.SensorOpen, sensorLow),
            Rail(FaultKind.SensorShorted, !sensorLow),
            Rail(FaultKind.FixedOpen, !sensorLow),
            Rail(FaultKind.FixedShorted, sensorLow),
        ];
        // The opposite half's faults: its high arm open or its low arm shorted leave V− at 0 V, the other two at E.
        foreach (var (kind, codes) in new[]
                 {
                     (FaultKind.OppositeHighOpen, oppositeAtGround), (FaultKind.OppositeHighShorted, oppositeAtExcitation),
                     (FaultKind.OppositeLowOpen, oppositeAtExcitation), (FaultKind.OppositeLowShorted, oppositeAtGround),
                 })
        {
            var (lo, hi) = (codes.Min(), codes.Max());
            // A fault that can read like a healthy sensor cannot be told from one by thresholds: said, not left out.
            if (lo <= highestValid && hi >= lowestValid)
                throw new FirmwareInputException(string.Create(CultureInfo.InvariantCulture,
                    $"With the bridge's opposite {(kind is FaultKind.OppositeHighOpen or FaultKind.OppositeHighShorted ? "high" : "low")} resistor {(kind is FaultKind.OppositeHighOpen or FaultKind.OppositeLowOpen ? "open" : "shorted")} the converter reads codes {lo} to {hi}, among the codes a healthy sensor in {model.Range} reads ({lowestValid} to {highestValid}): no threshold tells that fault from a reading. Move the bridge's balance closer to the range, so that V_d stays well below V+."));
            faults.Add(new FaultCode(kind, lo > highestValid, lo, hi));
        }
        (lowMax, highMin) = (faults.Where(f => !f.HighRail).Max(f => f.MaxCode), faults.Where(f => f.HighRail).Min(f => f.MinCode));
        if (lowestValid - lowMax < 2 || highMin - highestValid < 2)
            throw new FirmwareInputException(string.Create(CultureInfo.InvariantCulture,
                $"A healthy sensor in {model.Range} reads codes {lowestValid} to {highestValid}, too close to the fault codes {lowMax} and {highMin} (V+ at ground or at the excitation, through the bridge equation) to leave a threshold with margin between them; narrow the range, tighten the tolerances or move the bridge's balance."));
        // Midway; where the gap is odd the spare code goes to the healthy side, away from the threshold.
        var below = lowMax + (lowestValid - lowMax + 1) / 2;
        var above = highestValid + (highMin - highestValid) / 2;
        return new FaultThresholds(faults, lowestValid, highestValid, below, above);
    }
}
