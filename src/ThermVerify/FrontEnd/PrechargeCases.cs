using ThermVerify.Design;

namespace ThermVerify.FrontEnd;

/// <summary>
/// What the sampling capacitor holds before each acquisition, as the cases the check must cover. Null means it
/// keeps this channel's last sample. "Another channel" without a stated voltage is both extremes, zero and full
/// scale, and the check reports the worse at each temperature.
/// </summary>
internal static class PrechargeCases
{
    public static IReadOnlyList<double?> For(FrontEndDesign design, double referenceVolts) => design.Adc.Precharge switch
    {
        PrechargeMode.LastSample => [null],
        PrechargeMode.Discharged => [0.0],
        _ => design.Adc.PrechargeVolts is { } volts ? [volts] : [0.0, referenceVolts],
    };

    public static string Describe(double? prechargeVolts) =>
        prechargeVolts is { } v ? FormattableString.Invariant($"precharged to {v:0.###} V") : "holding the last sample";
}
