using System.Globalization;
using ThermVerify.Design;
using ThermVerify.FrontEnd;
using ThermVerify.Quantities;

namespace ThermVerify.Check;

/// <summary>
/// A current source holds its current only while its output stays inside its compliance range. The source's simulated
/// output voltage (every corner of the bounds) is held against the range at every temperature of the check: the
/// sensor's resistance is monotonic, so the coldest or the hottest point is where it leaves first. The finding fails,
/// since beyond the range the current, and with it every reading, is no longer what the design says. The closed form
/// beside it is Ohm's law, V = I·(R_ref + R_s) and the leads (<see cref="CurrentFormula.Network"/>).
/// </summary>
internal static class ComplianceRule
{
    public const string Id = "compliance";

    public static IEnumerable<Finding> Evaluate(FrontEndDesign design, DcCorners dc, IReadOnlyList<double> temperatures, IReadOnlyList<CheckPoint> points, double lsbVolts)
    {
        if (design.CurrentSource is not { Compliance: { } range } source) yield break;
        var outside = new List<(int Index, double Volts, double Beyond)>();
        for (var i = 0; i < temperatures.Count; i++)
        {
            foreach (var corner in dc.Corners)
            {
                var v = corner.SourceVolts![i];
                var beyond = v > range.MaxVolts ? v - range.MaxVolts : v < range.MinVolts ? v - range.MinVolts : 0;
                if (beyond != 0) outside.Add((i, v, beyond));
            }
        }
        if (outside.Count == 0) yield break;
        var worst = outside.MaxBy(o => Math.Abs(o.Beyond));
        var t = temperatures[worst.Index];
        var closedForm = CurrentFormula.Network(design, points[worst.Index].SensorOhms, EffectEstimator.PinCurrentAmps(design, t), design.Check.BoardCelsius ?? t).SourceVolts;
        yield return new Finding(Id, Severity.Fail,
            I($"the current source's output leaves its compliance range {V(range.MinVolts)} .. {V(range.MaxVolts)}"),
            temperatures[outside.Min(o => o.Index)], temperatures[outside.Max(o => o.Index)], t,
            worst.Beyond, worst.Beyond / lsbVolts, double.NaN,
            I($"at {t:0.##} °C the source's output is {V(worst.Volts)} (closed form I·(R_ref + R_s + leads) = {V(closedForm)}), {V(Math.Abs(worst.Beyond))} ") +
            (worst.Beyond > 0 ? "above" : "below") + " the range: the source cannot hold its current there, and the readings are not what the design says",
            closedForm, worst.Volts, []);
    }

    private static string V(double volts) => EngineeringFormat.Format(volts, UnitKind.Volt, 4);
    private static string I(FormattableString s) => s.ToString(CultureInfo.InvariantCulture);
}
