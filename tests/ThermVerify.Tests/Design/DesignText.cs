namespace ThermVerify.Tests.Design;

/// <summary>A small valid design, line by line, so tests can break one line and know its position.</summary>
internal static class DesignText
{
    public static readonly string[] Lines =
    [
        "name = \"test divider\"",            // 1
        "",                                   // 2
        "[sensor]",                           // 3
        "model = \"beta\"",                   // 4
        "r25 = \"10 kohm\"",                  // 5
        "beta = 3435",                        // 6
        "",                                   // 7
        "[divider]",                          // 8
        "sensor_side = \"low\"",              // 9
        "fixed_resistor = \"10k\"",           // 10
        "excitation = \"3.3 V\"",             // 11
        "",                                   // 12
        "[adc]",                              // 13
        "bits = 12",                          // 14
        "reference = \"3.3 V\"",              // 15
        "sample_rate = \"10 kHz\"",           // 16
        "acquisition_time = \"2 us\"",        // 17
        "sampling_capacitance = \"5 pF\"",    // 18
        "switch_resistance = \"1 kohm\"",     // 19
        "",                                   // 20
        "[check]",                            // 21
        "range = \"-40 degC .. 125 degC\"",   // 22
        "budget = \"0.5 K\"",                 // 23
    ];

    public static string Valid => string.Join("\n", Lines) + "\n";

    /// <summary>The design with 1-based line <paramref name="line"/> replaced.</summary>
    public static string With(int line, string replacement)
    {
        var copy = (string[])Lines.Clone();
        copy[line - 1] = replacement;
        return string.Join("\n", copy) + "\n";
    }
}
