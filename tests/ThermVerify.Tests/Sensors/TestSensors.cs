using ThermVerify.Sensors;

namespace ThermVerify.Tests.Sensors;

/// <summary>Invented sensors shared by the sensor tests (our own values, not any product's).</summary>
internal static class TestSensors
{
    public static BetaThermistor Beta10k() => new(10_000, 3435);

    /// <summary>A 3-term curve with a clearly non-zero C, so it is not a Beta model in disguise.</summary>
    public static SteinhartHartThermistor SteinhartHart() => new(1.1e-3, 2.4e-4, 1.0e-7);

    /// <summary>The same with a squared term, so the inverse must take the Newton path.</summary>
    public static SteinhartHartThermistor SteinhartHartFourTerm() => new(1.1e-3, 2.3e-4, 1.0e-7, 1.5e-6);

    public static PlatinumRtd Pt100() => new(100);

    /// <summary>Rows every <paramref name="stepCelsius"/> from −40 °C up to at most 125 °C taken from <paramref name="model"/>.</summary>
    public static TablePoint[] Rows(ISensorModel model, double stepCelsius = 5)
    {
        var count = (int)Math.Floor(165 / stepCelsius + 1e-9) + 1;
        return [.. Enumerable.Range(0, count).Select(i => -40 + i * stepCelsius).Select(t => new TablePoint(t, model.ResistanceOhms(t)))];
    }
}
