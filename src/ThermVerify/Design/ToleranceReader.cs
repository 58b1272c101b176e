
namespace ThermVerify.Design;

/// <summary>Reads [tolerances].</summary>
internal static class ToleranceReader
{
    private static readonly Dictionary<string, ToleranceShape> Shapes = new()
    {
        ["uniform"] = ToleranceShape.Uniform, ["normal"] = ToleranceShape.Normal,
    };

    public static ToleranceSpec Read(TomlSection s)
    {
        s.AllowOnly(["distribution", "coverage_factor", "leakage_spread"]);
        var shape = s.Choice("distribution", Shapes) ?? ToleranceShape.Uniform;
        var k = s.Number("coverage_factor");
        if (k is not null && shape != ToleranceShape.Normal)
            throw s.ErrorAtKey("coverage_factor", "coverage_factor applies to a normal distribution only",
                "Remove coverage_factor, or write distribution = \"normal\".");
        if (k is { } factor && !(factor > 0 && factor <= 10))
            throw s.ErrorAtValue("coverage_factor", "the tolerance must lie between 0 and 10 standard deviations",
                "Write coverage_factor = 3 (the tolerance is 3σ) or 2.");
        return new ToleranceSpec
        {
            Distribution = shape,
            CoverageFactor = k ?? DesignDefaults.CoverageFactor,
            LeakageSpread = SensorReader.Tolerance(s, "leakage_spread"),
        };
    }
}
