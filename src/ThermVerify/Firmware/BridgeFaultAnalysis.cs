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
/// tolerance corners are every sign of the excitation and the reference (none where they are one, ratiometric), the
/// fixed resistor and the opposite half's two resistors; the thresholds sit midway, as for the divider (<see cref="FaultAnalysis"/>).
/// </summary>
internal static class BridgeFaultAnalysis
{
    public static FaultThresholds Thresholds(FirmwareModel model, BridgeSpec bridge, FaultTolerances t)
    {
        var (e, r) = t.ExcitationTracksReference ? (0.0, 0.0) : (t.ExcitationFraction, t.ReferenceFraction);
        var (high, low, valid) = (new List<int>(), new List<int>(), new List<int>());
        var sensorEnds = new[] { model.Sensor.ResistanceOhms(model.Range.MinCelsius), model.Sensor.ResistanceOhms(model.Range.MaxCelsius) };
        for (var mask = 0; mask < 32; mask++)
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
            int Code(double volts) => model.Adc.Quantise(Math.Clamp(volts / lsb, model.Adc.MinCode - 1.0, model.Adc.MaxCode + 1.0));
            high.Add(Code(excitation - negative));
            low.Add(Code(-negative));
            valid.AddRange(sensorEnds.Select(ohms => Code(BridgeFormula.OutputVolts(model.Side, excitation, fixedOhms, opposite, ohms))));
        }

        var (lowestValid, highestValid) = (valid.Min(), valid.Max());
        var (highMin, highMax, lowMin, lowMax) = (high.Min(), high.Max(), low.Min(), low.Max());
        var sensorLow = model.Side == SensorSide.Low;
        FaultCode Rail(FaultKind kind, bool atExcitation) => atExcitation ? new(kind, true, highMin, highMax) : new(kind, false, lowMin, lowMax);
        FaultCode[] faults =
        [
            Rail(FaultKind.SensorOpen, sensorLow),
            Rail(FaultKind.SensorShorted, !sensorLow),
            Rail(FaultKind.FixedOpen, !sensorLow),
            Rail(FaultKind.FixedShorted, sensorLow),
        ];
        if (lowestValid - lowMax < 2 || highMin - highestValid < 2)
            throw new FirmwareInputException(string.Create(CultureInfo.InvariantCulture,
                $"A healthy sensor in {model.Range} reads codes {lowestValid} to {highestValid}, too close to the fault codes {lowMax} and {highMin} (V+ at ground or at the excitation, through the bridge equation) to leave a threshold with margin between them; narrow the range, tighten the tolerances or move the bridge's balance."));
        // Midway; where the gap is odd the spare code goes to the healthy side, away from the threshold.
        var below = lowMax + (lowestValid - lowMax + 1) / 2;
        var above = highestValid + (highMin - highestValid) / 2;
        return new FaultThresholds(faults, lowestValid, highestValid, below, above);
    }
}
