using ThermVerify.Design;
using ThermVerify.Firmware;
using ThermVerify.FrontEnd;
using ThermVerify.Sensors;

namespace ThermVerify.Tests.Firmware;

/// <summary>Invented front ends for the firmware tests (our own values, not any product's).</summary>
internal static class FirmwareTestModels
{
    public static readonly TemperatureRange Range = new(-40, 125);

    /// <summary>10 kΩ β = 3435 K NTC on the low side of 10 kΩ, 3.3 V excitation, 12-bit ADC on the same 3.3 V.</summary>
    public static FirmwareModel NtcLowSide(SensorSide side = SensorSide.Low, double beta = 3435, double fixedOhms = 10_000, int bits = 12) =>
        new(new BetaThermistor(10_000, beta), side, fixedOhms, 3.3, new AdcTransfer(bits, 3.3), Range);

    /// <summary>A Pt1000 on the high side of 1 kΩ from 2.5 V into a 10-bit ADC with a 2.5 V reference.</summary>
    public static FirmwareModel Pt1000HighSide() =>
        new(new PlatinumRtd(1000), SensorSide.High, 1000, 2.5, new AdcTransfer(10, 2.5), new TemperatureRange(-50, 300));
}
