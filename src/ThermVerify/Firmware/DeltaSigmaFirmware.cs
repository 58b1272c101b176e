using ThermVerify.Design;
using ThermVerify.FrontEnd;
using ThermVerify.FrontEnd.DeltaSigma;
using ThermVerify.Sensors;

namespace ThermVerify.Firmware;

/// <summary>
/// The firmware model of a design read by a delta-sigma converter. Its code is the converter's static transfer, the
/// settled output of the digital filter: the same <see cref="AdcTransfer"/> as any converter's (Q = V_ref/(G·2^N) at
/// the pin with the programmable gain G, unipolar codes 0 … 2^N − 1: a delta-sigma [adc] has no differential input),
/// so the table inverts it as for a successive-approximation converter. The loading correction is the pin's DC offset
/// from the unloaded node with the input's average load (R_eq = 1/(f_mod·C) to ground, or the buffer's input current;
/// <see cref="InputLoading.Average"/>) and the front end's own leakage, swept over the check range on the built-in
/// engine, interpolated linearly in the unloaded voltage: the level a settled reading takes, for a divider, a current
/// source alike (a bridge is not read by a delta-sigma converter: the loader refuses it).
/// </summary>
internal static class DeltaSigmaFirmware
{
    public static FirmwareModel Corrected(FrontEndDesign design, FirmwareModel model)
    {
        if (design.Netlist is not null)
            throw new FirmwareInputException(
                "The loading correction of a netlist front end is not made; make the table without it (leave out --corrected).");
        var temperatures = SensorTabulation.Grid(design.Check.Range, design.Check.StepKelvin).ToArray();
        var pin = FrontEndCircuit.PinNode(design);
        var loaded = BuiltInEngine.Instance.TemperatureSweep(InputLoading.WithAverageLoad(design, FrontEndCircuit.Dc(design, null)), temperatures, [pin])[0];
        var closedForm = new ClosedFormModel(design);
        var gain = closedForm.BufferGain;
        var points = temperatures
            .Select((t, i) => (Unloaded: closedForm.At(t).IdealVolts / gain, Offset: (loaded[i] - closedForm.At(t).IdealVolts) / gain))
            .OrderBy(p => p.Unloaded).ToArray();
        return (model with { LoadingCorrectionVolts = v => FirmwareFromDesign.Interpolate(points, v) }).Validated();
    }
}
