using System.Globalization;
using ThermVerify.Design;
using ThermVerify.FrontEnd;
using ThermVerify.Quantities;

namespace ThermVerify.Check;

/// <summary>
/// A differential converter converts V+ − V− only while the inputs' common mode, (V+ + V−)/2, stays inside its input
/// common-mode range. The simulated common mode (the pin and the bridge's second output, every corner of the bounds) is
/// held against the range at every temperature of the check; the finding fails, since outside the range the converter
/// no longer converts the difference the design describes. The closed form beside it is half the sum of the bridge's
/// two unloaded outputs, E·(R_s/(R_s + R_f) + R_low/(R_high + R_low))/2 for the sensor low (<see cref="BridgeFormula"/>).
/// </summary>
internal static class CommonModeRule
{
    public const string Id = "common-mode";

    public static IEnumerable<Finding> Evaluate(FrontEndDesign design, DcCorners dc, IReadOnlyList<double> temperatures, IReadOnlyList<CheckPoint> points, double lsbVolts)
    {
        if (design.Adc.CommonModeRange is not { } range || (design.Netlist is null && design is not { Divider: not null, Bridge: not null })) yield break;
        var outside = new List<(int Index, double Volts, double Beyond)>();
        for (var i = 0; i < temperatures.Count; i++)
            foreach (var corner in dc.Corners)
            {
                var v = (corner.StaticPinVolts[i] + corner.NegativeAt(i)) / 2;
                var beyond = v > range.MaxVolts ? v - range.MaxVolts : v < range.MinVolts ? v - range.MinVolts : 0;
                if (beyond != 0) outside.Add((i, v, beyond));
            }
        if (outside.Count == 0) yield break;
        var worst = outside.MaxBy(o => Math.Abs(o.Beyond));
        var t = temperatures[worst.Index];
        var closedForm = ClosedFormVolts(design, points[worst.Index].SensorOhms);
        yield return new Finding(Id, Severity.Fail,
            I($"the converter's input common mode leaves its range {V(range.MinVolts)} .. {V(range.MaxVolts)}"),
            temperatures[outside.Min(o => o.Index)], temperatures[outside.Max(o => o.Index)], t,
            worst.Beyond, worst.Beyond / lsbVolts, double.NaN,
            I($"at {t:0.##} °C the inputs' common mode (V+ + V−)/2 is {V(worst.Volts)} (closed form, {(design.Netlist is null ? "the bridge's two outputs" : "the netlist's ideal transfer at both pins")}: {V(closedForm)}), {V(Math.Abs(worst.Beyond))} ") +
            (worst.Beyond > 0 ? "above" : "below") + " the range: the converter does not convert the difference there as the design describes",
            closedForm, worst.Volts, []);
    }

    /// <summary>The unloaded common mode: half the sum of the bridge's two outputs, or of a netlist's two pins in its ideal transfer.</summary>
    private static double ClosedFormVolts(FrontEndDesign design, double sensorOhms)
    {
        if (design.Netlist is { } netlist) return NetlistTransfer.Of(netlist).CommonModeVolts(sensorOhms);
        var (half, bridge) = (design.Divider!, design.Bridge!);
        var positive = DividerFormula.OutputVolts(half.SensorSide, half.ExcitationVolts, sensorOhms, half.FixedResistorOhms);
        return (positive + BridgeFormula.NegativeVolts(half, bridge)) / 2;
    }

    private static string V(double volts) => EngineeringFormat.Format(volts, UnitKind.Volt, 4);
    private static string I(FormattableString s) => s.ToString(CultureInfo.InvariantCulture);
}
