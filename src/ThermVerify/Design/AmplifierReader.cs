using ThermVerify.Quantities;

namespace ThermVerify.Design;

/// <summary>Reads [amplifier].</summary>
internal static class AmplifierReader
{
    private static readonly string[] Keys =
        ["gain", "gain_error", "offset_voltage", "offset_drift", "cmrr", "bias_current", "output_range", "input_common_mode"];

    public static AmplifierSpec Read(TomlSection s)
    {
        s.AllowOnly(Keys);
        var gain = s.Number("gain") ?? throw s.Missing("gain", "Write gain = 50 (the amplifier's differential gain).");
        if (!(gain > 0))
            throw s.ErrorAtValue("gain", "the gain must be positive", "Write the differential gain, e.g. gain = 50.");
        foreach (var key in new[] { "output_range", "input_common_mode" })
            if (s.Range(key, UnitKind.Volt) is { } r && !(r.Max > r.Min))
                throw s.ErrorAtValue(key, $"the range {key} is empty", "Write low .. high, e.g. \"0.1 V .. 4.9 V\".");
        var gainError = s.ValueOr("gain_error", 0, Bound.Any, UnitKind.Percent, UnitKind.Ppm);
        if (Math.Abs(gainError) >= 1)
            throw s.ErrorAtValue("gain_error", "a gain error of 100 % or more", "Write the gain error as a fraction of the gain, e.g. \"0.1 %\".");
        var cmrr = s.Quantity("cmrr", Bound.Positive, UnitKind.Decibel)?.Value;
        return new AmplifierSpec
        {
            Gain = gain,
            GainError = gainError,
            GainErrorSigned = SignWritten.Of(s, "gain_error"),
            OffsetVolts = s.ValueOr("offset_voltage", 0, Bound.Any, UnitKind.Volt),
            OffsetSigned = SignWritten.Of(s, "offset_voltage"),
            OffsetDriftVoltsPerKelvin = s.ValueOr("offset_drift", 0, Bound.Any, UnitKind.VoltPerKelvin),
            OffsetDriftSigned = SignWritten.Of(s, "offset_drift"),
            CommonModeFraction = cmrr is { } db ? Math.Pow(10, -db / 20) : 0,
            BiasCurrentAmperes = s.ValueOr("bias_current", 0, Bound.Any, UnitKind.Ampere),
            BiasCurrentSigned = SignWritten.Of(s, "bias_current"),
            OutputRange = CircuitReaders.VoltageRange(s, "output_range"),
            InputCommonMode = CircuitReaders.VoltageRange(s, "input_common_mode"),
        };
    }
}
