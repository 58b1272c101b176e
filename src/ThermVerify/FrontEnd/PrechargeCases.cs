using System.Globalization;
using ThermVerify.Design;

namespace ThermVerify.FrontEnd;

/// <summary>
/// One thing the sampling capacitor may hold when the acquisition window opens: its last sample of this channel
/// (<see cref="Volts"/> null), or a fixed level (0 V when the converter discharges it, another channel's voltage).
/// <see cref="Name"/> is what reports and JSON call it.
/// </summary>
public sealed record PrechargeCase(string Name, double? Volts)
{
    public static readonly PrechargeCase LastSample = new("last-sample", null);

    /// <summary>The case in words, for methods and figure captions.</summary>
    public string Describe() =>
        Volts is { } v ? string.Create(CultureInfo.InvariantCulture, $"{Name}: precharged to {v:0.###} V") : "last-sample: holding this channel's last sample";
}

/// <summary>
/// The precharge cases a check must cover. "other-channel" without a stated voltage is both extremes, 0 V and full
/// scale; "worst" (the default, for a design that does not say) is the last sample, 0 V and full scale. The check
/// runs every case and reports the worst at each temperature.
/// </summary>
internal static class PrechargeCases
{
    public static IReadOnlyList<PrechargeCase> For(FrontEndDesign design, double referenceVolts) => design.Adc.Precharge switch
    {
        PrechargeMode.LastSample => [PrechargeCase.LastSample],
        PrechargeMode.Discharged => [new("discharged", 0.0)],
        PrechargeMode.OtherChannel => design.Adc.PrechargeVolts is { } volts
            ? [new("other-channel", volts)]
            : [new("other-channel 0 V", 0.0), new("other-channel full scale", referenceVolts)],
        _ => [PrechargeCase.LastSample, new("0 V", 0.0), new("full scale", referenceVolts)],
    };

    /// <summary>The design's precharge setting in words, for headers and JSON.</summary>
    public static string Mode(FrontEndDesign design) => design.Adc.Precharge switch
    {
        PrechargeMode.LastSample => "last-sample",
        PrechargeMode.Discharged => "discharged",
        PrechargeMode.OtherChannel => "other-channel",
        _ => "worst",
    };

    public static string Describe(double? prechargeVolts) =>
        prechargeVolts is { } v ? string.Create(CultureInfo.InvariantCulture, $"precharged to {v:0.###} V") : "holding the last sample";
}
