using System.Globalization;
using ThermVerify.Design;
using ThermVerify.Quantities;

namespace ThermVerify.Check;

/// <summary>The amplifier's static errors in words, with their closed form beside them.</summary>
internal static class AmplifierWords
{
    public static string Cause(FrontEndDesign design, CheckPoint p)
    {
        var a = design.Amplifier!;
        var parts = new List<string>();
        string V(double v) => EngineeringFormat.Format(v, UnitKind.Volt, 4);
        if (a.OffsetVolts != 0)
            parts.Add("offset " + FindingRules.Bounded(V(Math.Abs(a.OffsetVolts)), a.OffsetSigned, a.OffsetVolts));
        if (a.OffsetDriftVoltsPerKelvin != 0)
            parts.Add("drift " + FindingRules.Bounded(EngineeringFormat.Format(Math.Abs(a.OffsetDriftVoltsPerKelvin), UnitKind.VoltPerKelvin, 4), a.OffsetDriftSigned, a.OffsetDriftVoltsPerKelvin) +
                      I($" to {design.Check.BoardCelsius ?? p.Celsius:0.##} °C"));
        if (a.GainError != 0)
            parts.Add("gain error " + FindingRules.Bounded(I($"{Math.Abs(a.GainError) * 100:0.###} %"), a.GainErrorSigned, a.GainError));
        if (a.CommonModeFraction != 0)
            parts.Add(I($"common mode through a CMRR of {-20 * Math.Log10(Math.Abs(a.CommonModeFraction)):0.#} dB (a bound)"));
        var inner = parts.Count == 0 ? "" : string.Join(", ", parts) + I($" at a gain of {a.Gain:0.###}: G·(1 + ε)·(V_d + V_os) + G·CMRR⁻¹·V_cm − G·V_d = {FindingRules.Volts(p.Estimates.BufferOffsetVolts)}");
        if (a.BiasCurrentAmperes != 0)
            inner += (inner.Length > 0 ? ", and " : "") + "bias current " + FindingRules.Bounded(EngineeringFormat.Format(Math.Abs(a.BiasCurrentAmperes), UnitKind.Ampere, 4), a.BiasCurrentSigned, a.BiasCurrentAmperes) +
                     I($" into each input through the two outputs' Thevenin resistances (Ohm's law), times G: {FindingRules.Volts(p.Estimates.BiasCurrentVolts)}");
        return inner + FindingRules.CornerNote(p);
    }

    private static string I(FormattableString s) => s.ToString(CultureInfo.InvariantCulture);
}
