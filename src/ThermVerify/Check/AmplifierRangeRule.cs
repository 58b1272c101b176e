using System.Globalization;
using ThermVerify.Design;
using ThermVerify.FrontEnd;
using ThermVerify.Quantities;

namespace ThermVerify.Check;

/// <summary>
/// An amplifier amplifies as its design says only while its inputs' common mode lies inside its input common-mode range
/// and its output inside its output range. Both are held, simulated (every corner of the bounds), against the ranges at
/// every temperature of the check; each finding fails, with its closed form beside it: (V+ + V−)/2 of the unloaded
/// bridge, and the amplifier's output G·(1 + ε)·(V_d + V_os) + G·CMRR⁻¹·V_cm (<see cref="AmplifierStage.OutputVolts"/>).
/// </summary>
internal static class AmplifierRangeRule
{
    public const string CommonModeId = "amplifier-common-mode";
    public const string OutputId = "amplifier-output";

    public static IEnumerable<Finding> Evaluate(FrontEndDesign design, DcCorners dc, IReadOnlyList<double> temperatures, IReadOnlyList<CheckPoint> points, double lsbVolts)
    {
        if (design is not { Amplifier: { } a, Divider: { } half, Bridge: { } bridge }) yield break;
        var negative = BridgeFormula.NegativeVolts(half, bridge);
        double Positive(int i) => DividerFormula.OutputVolts(half.SensorSide, half.ExcitationVolts, points[i].SensorOhms, half.FixedResistorOhms);
        if (a.InputCommonMode is { } input &&
            Outside(input, (corner, i) => (dc.Base.DividerVolts[i] + corner.SecondOutputVolts![i]) / 2) is { } cm)
            yield return Make(CommonModeId, "the amplifier's input common mode leaves its range", input, cm, "the inputs' common mode (V+ + V−)/2",
                (Positive(cm.Index) + negative) / 2, "the amplifier does not reject the common mode and amplify the difference there as the design describes");
        if (a.OutputRange is { } output &&
            Outside(output, (corner, i) => corner.AmplifierOutputVolts![i]) is { } o)
            yield return Make(OutputId, "the amplifier's output leaves its output range", output, o, "the amplifier's output",
                AmplifierStage.OutputVolts(a, Positive(o.Index), negative, design.Check.BoardCelsius ?? temperatures[o.Index]),
                "the output saturates there and the readings are not what the design says");

        (int Index, double Volts, double Beyond, int From, int To)? Outside(VoltageRange range, Func<DcLevels, int, double> volts)
        {
            var outside = new List<(int Index, double Volts, double Beyond)>();
            for (var i = 0; i < temperatures.Count; i++)
                foreach (var corner in dc.Corners)
                {
                    var v = volts(corner, i);
                    var beyond = v > range.MaxVolts ? v - range.MaxVolts : v < range.MinVolts ? v - range.MinVolts : 0;
                    if (beyond != 0) outside.Add((i, v, beyond));
                }
            if (outside.Count == 0) return null;
            var worst = outside.MaxBy(x => Math.Abs(x.Beyond));
            return (worst.Index, worst.Volts, worst.Beyond, outside.Min(x => x.Index), outside.Max(x => x.Index));
        }

        Finding Make(string id, string title, VoltageRange range, (int Index, double Volts, double Beyond, int From, int To) w, string what, double closedForm, string consequence)
        {
            var t = temperatures[w.Index];
            return new Finding(id, Severity.Fail, I($"{title} {V(range.MinVolts)} .. {V(range.MaxVolts)}"),
                temperatures[w.From], temperatures[w.To], t, w.Beyond, w.Beyond / lsbVolts, double.NaN,
                I($"at {t:0.##} °C {what} is {V(w.Volts)} (closed form {V(closedForm)}), {V(Math.Abs(w.Beyond))} ") +
                (w.Beyond > 0 ? "above" : "below") + $" the range: {consequence}",
                closedForm, w.Volts, []);
        }
    }

    private static string V(double volts) => EngineeringFormat.Format(volts, UnitKind.Volt, 4);
    private static string I(FormattableString s) => s.ToString(CultureInfo.InvariantCulture);
}
