using ThermVerify.Design;

namespace ThermVerify.Tests.Check;

/// <summary>
/// A plain front end for verification tests (10 kΩ NTC, 10 kΩ low-side divider, 12-bit ratiometric SAR with no
/// leakage, no pin capacitance and last-sample precharge), with any key replaced or added as TOML text.
/// </summary>
internal static class TestDesign
{
    private static readonly (string Section, string Key, string Value)[] Base =
    [
        ("", "name", "\"verification test\""),
        ("sensor", "model", "\"beta\""),
        ("sensor", "r25", "\"10 kohm\""),
        ("sensor", "beta", "3435"),
        ("divider", "sensor_side", "\"low\""),
        ("divider", "fixed_resistor", "\"10 kohm\""),
        ("divider", "fixed_tempco", "\"0 ppm/K\""),
        ("divider", "excitation", "\"3.3 V\""),
        ("adc", "bits", "12"),
        ("adc", "reference", "\"ratiometric\""),
        ("adc", "sample_rate", "\"10 kHz\""),
        ("adc", "acquisition_time", "\"2 us\""),
        ("adc", "sampling_capacitance", "\"10 pF\""),
        ("adc", "switch_resistance", "\"1 kohm\""),
        ("adc", "precharge", "\"last-sample\""),
        ("check", "range", "\"-20 degC .. 80 degC\""),
        ("check", "step", "\"5 K\""),
        ("check", "budget", "\"0.5 K\""),
    ];

    /// <summary>Overrides as ("section.key", "TOML value"); a null value removes the key.</summary>
    public static FrontEndDesign Make(params (string Path, string? Value)[] overrides)
    {
        var entries = Base.ToList();
        foreach (var (path, value) in overrides)
        {
            var dot = path.IndexOf('.');
            var (section, key) = dot < 0 ? ("", path) : (path[..dot], path[(dot + 1)..]);
            entries.RemoveAll(e => e.Section == section && e.Key == key);
            if (value is not null) entries.Add((section, key, value));
        }
        var text = string.Join("\n", entries.GroupBy(e => e.Section).OrderBy(g => g.Key == "" ? 0 : 1)
            .Select(g => (g.Key == "" ? "" : $"[{g.Key}]\n") + string.Join("\n", g.Select(e => $"{e.Key} = {e.Value}"))));
        return DesignLoader.Parse(text + "\n", "test.toml", Path.GetTempPath());
    }
}
