using System.Reflection;
using System.Text.Json;
using System.Text.Json.Serialization;
using ThermVerify.Design;
using ThermVerify.FrontEnd;
using ThermVerify.Provenance;
using ThermVerify.Tolerances;

namespace ThermVerify.Reporting;

/// <summary>
/// What every JSON document of thermverify shares (docs/json-output.md): camelCase names, every field always
/// present, SI numbers, null where a value does not exist (never NaN or infinity), the tool and the design named.
/// </summary>
internal static class ReportJson
{
    public static readonly JsonSerializerOptions Options = new()
    {
        WriteIndented = true,
        PropertyNamingPolicy = JsonNamingPolicy.CamelCase,
        DefaultIgnoreCondition = JsonIgnoreCondition.Never,
    };

    /// <summary>A number, or null when it does not exist (NaN from an unreadable code, infinity from an unbounded search).</summary>
    public static double? N(double? value) => value is { } v && double.IsFinite(v) ? v : null;

    /// <summary>The tool as every document named it before the provenance object held it too (kept: field names never change within a schema).</summary>
    public static object Tool(RunProvenance provenance) => new { name = "thermverify", version = provenance.ToolVersion };

    public static object DesignDocument(FrontEndDesign design, string? designPath) =>
        new { name = design.Name, file = designPath, sensor = new ClosedFormModel(design).Sensor.Description };

    /// <summary>A tolerance as the analyses use it: its key, what it moves, its half-width in its own unit and its spread.</summary>
    public static object Parameter(ToleranceParameter p) => new
    {
        key = p.Key,
        kind = p.Kind.ToString(),
        halfWidth = p.HalfWidth,
        unit = p.Unit,
        distribution = p.Distribution.Shape.ToString().ToLowerInvariant(),
        coverageFactor = p.Distribution.Shape == ToleranceShape.Normal ? p.Distribution.CoverageFactor : (double?)null,
        standardDeviation = p.StandardDeviation,
    };

}
