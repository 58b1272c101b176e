using ThermVerify.Quantities;

namespace ThermVerify.Design;

/// <summary>Reads the programmable-gain stage's keys of [adc]: gain, pga_gain_error, pga_input_current.</summary>
internal static class GainStageReader
{
    public static readonly string[] Keys = ["gain", "pga_gain_error", "pga_input_current"];

    /// <summary>
    /// The gain stage, or null when none of its keys is written (on a delta-sigma converter: also when its gain is 1 and
    /// nothing else is said). <paramref name="deltaSigmaGain"/> is the gain a delta-sigma converter's reader has read.
    /// </summary>
    public static GainStageSpec? Read(TomlSection s, double? deltaSigmaGain)
    {
        var gain = deltaSigmaGain ?? s.Number("gain");
        if (gain is null && !s.Has("pga_gain_error") && !s.Has("pga_input_current")) return null;
        if (deltaSigmaGain == 1 && !s.Has("pga_gain_error") && !s.Has("pga_input_current")) return null;
        if (gain is not null && !(gain > 0))
            throw s.ErrorAtValue("gain", "the gain must be greater than zero", "Write gain = 1 (or the programmable gain the firmware sets, e.g. 16).");
        return new GainStageSpec(gain ?? 1,
            s.ValueOr("pga_gain_error", 0, Bound.Any, UnitKind.Percent, UnitKind.Ppm),
            s.ValueOr("pga_input_current", 0, Bound.Any, UnitKind.Ampere))
        {
            GainErrorSigned = SignWritten.Of(s, "pga_gain_error"),
            InputCurrentSigned = SignWritten.Of(s, "pga_input_current"),
        };
    }
}
