using ThermVerify.Design;
using ThermVerify.Tests.Check;

namespace ThermVerify.Tests.Check.Buffer;

/// <summary>The plain test front end with a follower (1 MHz, 100 Ω, 120 dB) and any key replaced.</summary>
internal static class BufferDesigns
{
    public static FrontEndDesign Follower(params (string Path, string? Value)[] overrides) =>
        TestDesign.Make([
            ("buffer.topology", "\"follower\""),
            ("buffer.gain_bandwidth", "\"1 MHz\""),
            ("buffer.dc_gain", "\"120 dB\""),
            ("buffer.output_resistance", "\"100 ohm\""),
            ("buffer.supply", "\"0 V .. 3.3 V\""),
            ("adc.sampling_capacitance", "\"1 pF\""),
            ("adc.switch_resistance", "\"100 ohm\""),
            .. overrides,
        ]);
}
