using ThermVerify.Quantities;

namespace ThermVerify.Design;

/// <summary>Reads [noise]: coverage, firmware averaging and the ramp the reading must follow.</summary>
internal static class NoiseReader
{
    public static NoiseSpec Read(TomlSection s)
    {
        s.AllowOnly(["coverage", "readings_averaged", "ramp_rate"]);
        var coverage = s.Number("coverage");
        if (coverage is { } k && !(k > 0 && k <= 10))
            throw s.ErrorAtValue("coverage", "the noise must be counted at between 0 and 10 standard deviations",
                "Write coverage = 3 (noise counted as ±3σ, the default) or 2.");
        var averaged = s.Integer("readings_averaged");
        if (averaged is { } n && n is < 1 or > DesignDefaults.MaxReadingsAveraged)
            throw s.ErrorAtValue("readings_averaged", $"{n} is outside 1..{DesignDefaults.MaxReadingsAveraged}",
                "Give the number of consecutive conversions the firmware averages into one reading, e.g. readings_averaged = 16 (1: no averaging).");
        return new NoiseSpec
        {
            Coverage = coverage ?? DesignDefaults.NoiseCoverage,
            ReadingsAveraged = (int)(averaged ?? 1),
            RampKelvinPerSecond = s.Quantity("ramp_rate", Bound.Positive, UnitKind.KelvinPerSecond)?.Value,
        };
    }
}
