using ThermVerify.Design;

namespace ThermVerify.Tests.Design;

/// <summary>
/// Delta-sigma designs for tests: a 10 kΩ NTC divider read by a 24-bit ratiometric delta-sigma converter, unbuffered,
/// 256 kHz modulator, sinc3 at 50 Hz, and the text of one with a noise table (invented values, for the tests only).
/// </summary>
internal static class DeltaSigmaDesigns
{
    /// <summary>The [adc] keys of the plain delta-sigma test converter, replacing the successive-approximation ones.</summary>
    public static readonly (string Path, string? Value)[] Adc =
    [
        ("adc.kind", "\"delta-sigma\""),
        ("adc.bits", "24"),
        ("adc.sample_rate", null),
        ("adc.acquisition_time", null),
        ("adc.switch_resistance", null),
        ("adc.precharge", null),
        ("adc.modulator_rate", "\"256 kHz\""),
        ("adc.data_rate", "\"50 Hz\""),
        ("adc.input", "\"unbuffered\""),
        ("adc.sampling_capacitance", "\"8 pF\""),
        ("adc.filter", "\"sinc3\""),
    ];

    public static FrontEndDesign Make(params (string Path, string? Value)[] overrides) =>
        Check.TestDesign.Make([.. Adc, .. overrides]);

    public static string WithNoiseTable(string rows) => $$"""
        name = "delta-sigma test"

        [sensor]
        model = "beta"
        r25 = "10 kohm"
        beta = 3435

        [divider]
        sensor_side = "low"
        fixed_resistor = "10 kohm"
        excitation = "3.3 V"

        [adc]
        kind = "delta-sigma"
        bits = 24
        reference = "ratiometric"
        modulator_rate = "256 kHz"
        data_rate = "50 Hz"
        input = "buffered"
        input_current = "+2 nA"
        gain = 4
        filter = "sinc4"
        average_length = 2
        filter_reset = false
        channel_filter = "shared"
        readings_discarded = 3
        rejection_frequencies = ["50 Hz", "60 Hz", "400 Hz"]
        interference = "10 mV"
        {{rows}}

        [check]
        range = "-20 degC .. 80 degC"
        budget = "0.5 K"
        """;

    public const string TwoRows = """
        [[adc.noise_table]]
        data_rate = "50 Hz"
        gain = 4
        noise = "0.4 uV"

        [[adc.noise_table]]
        data_rate = "10 Hz"
        gain = 4
        noise = "0.2 uV"
        """;
}
