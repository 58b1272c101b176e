using System.Globalization;
using ThermVerify.Design;
using ThermVerify.FrontEnd;
using ThermVerify.Quantities;

namespace ThermVerify.Check;

/// <summary>
/// A programmable-gain stage multiplies the pin voltage before the converter: the converter sees G·(1 + e)·V_pin and
/// reads only 0 .. V_ref of it. Where the amplified signal leaves that range at any temperature of the check (at either
/// corner of the bounds, its gain error at the sign that pushes it out), the codes pin at an end and the reading is
/// not a temperature any more: the finding fails. The closed form beside it is G·(1 + e)·V with the ideal pin voltage
/// (the hand calculation, ClosedFormModel). Only a design with a gain stage is judged: without one, V_ref is the
/// range the divider or the current is sized for.
/// </summary>
internal static class GainRangeRule
{
    public const string Id = "gain-range";

    public static IEnumerable<Finding> Evaluate(FrontEndDesign design, DcCorners dc, IReadOnlyList<double> temperatures, IReadOnlyList<CheckPoint> points)
    {
        if (design.Adc.GainStage is not { } stage) yield break;
        var gain = stage.Gain;
        // The gain error at the sign that pushes the signal out of the range: a bound takes +|e| (the range's lower end
        // is 0 V, which a gain never crosses), a signed value is what it is.
        var factor = 1 + (stage.GainErrorSigned ? stage.GainError : Math.Abs(stage.GainError));
        var outside = new List<(int Index, double Volts, double Beyond, double Reference)>();
        for (var i = 0; i < temperatures.Count; i++)
        {
            foreach (var corner in dc.Corners)
            {
                var reference = corner.ReferenceVolts?[i] ?? design.NominalReferenceVolts;
                var v = gain * factor * (corner.StaticPinVolts[i] - corner.NegativeAt(i));
                var beyond = v > reference ? v - reference : v < 0 ? v : 0;
                if (beyond != 0) outside.Add((i, v, beyond, reference));
            }
        }
        if (outside.Count == 0) yield break;
        var worst = outside.MaxBy(o => Math.Abs(o.Beyond));
        var t = temperatures[worst.Index];
        var closedForm = gain * factor * points[worst.Index].IdealVolts;
        var lsb = design.NominalReferenceVolts / (1 << design.Adc.Bits);
        yield return new Finding(Id, Severity.Fail,
            I($"the amplified signal leaves the converter's range 0 V .. {V(worst.Reference)} (gain {gain:G6})"),
            temperatures[outside.Min(o => o.Index)], temperatures[outside.Max(o => o.Index)], t,
            worst.Beyond, worst.Beyond / lsb, double.NaN,
            I($"at {t:0.##} °C the gain stage puts {V(worst.Volts)} on the converter (closed form G·(1 + e)·V_pin = {gain:G6}·{factor:0.######}·{V(points[worst.Index].IdealVolts)} = {V(closedForm)}), {V(Math.Abs(worst.Beyond))} ") +
            (worst.Beyond > 0 ? "above the reference" : "below 0 V") + ": the code sits at the end of the scale and the reading is no temperature; lower the gain",
            closedForm, worst.Volts, []);
    }

    /// <summary>
    /// How far the amplified signal goes beyond the converter's range at one temperature, referred to the pin (0 when
    /// it stays inside at every corner): what a remedy search on the gain holds at zero.
    /// </summary>
    public static double ExcessPinVolts(FrontEndDesign design, DcCorners dc, int i)
    {
        if (design.Adc.GainStage is not { } stage) return 0;
        var factor = 1 + (stage.GainErrorSigned ? stage.GainError : Math.Abs(stage.GainError));
        var worst = 0.0;
        foreach (var corner in dc.Corners)
        {
            var reference = corner.ReferenceVolts?[i] ?? design.NominalReferenceVolts;
            var v = stage.Gain * factor * (corner.StaticPinVolts[i] - corner.NegativeAt(i));
            worst = Math.Max(worst, Math.Max(v - reference, -v) / stage.Gain);
        }
        return worst;
    }

    private static string V(double volts) => EngineeringFormat.Format(volts, UnitKind.Volt, 4);
    private static string I(FormattableString s) => s.ToString(CultureInfo.InvariantCulture);
}
