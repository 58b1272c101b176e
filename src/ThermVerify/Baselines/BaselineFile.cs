using System.Text.Json;
using System.Text.Json.Nodes;
using ThermVerify.Files;
using ThermVerify.Provenance;

namespace ThermVerify.Baselines;

/// <summary>
/// A baseline on disk: JSON, schema "thermverify.baseline/1", with the provenance of the run that made it. Written atomically and never over an existing file
/// unless asked; read strictly, so a hand-edited file with a missing or mistyped field is refused with its name.
/// </summary>
public static class BaselineFile
{
    public const string Schema = "thermverify.baseline/1";

    private static readonly JsonSerializerOptions Indented = new() { WriteIndented = true };

    public static string ToJson(Baseline baseline)
    {
        var figures = new JsonArray();
        foreach (var f in baseline.Figures)
            figures.Add(new JsonObject
            {
                ["id"] = f.Id,
                ["description"] = f.Description,
                ["value"] = f.Value is { } v && double.IsFinite(v) ? v : null,
                ["unit"] = f.Unit,
                ["better"] = f.Better == Better.Lower ? "lower" : "higher",
                ["tolerance"] = f.Tolerance,
            });
        var root = new JsonObject
        {
            ["schema"] = Schema,
            ["tool"] = baseline.ToolVersion,
            ["design"] = new JsonObject { ["name"] = baseline.DesignName, ["sha256"] = baseline.DesignSha256 },
            ["provenance"] = baseline.Provenance is { } p ? ProvenanceJson.ToJson(p) : null,
            ["figures"] = figures,
        };
        return root.ToJsonString(Indented) + "\n";
    }

    public static void Write(string path, Baseline baseline, bool overwrite) => AtomicFile.WriteAllText(path, ToJson(baseline), overwrite);

    public static Baseline Read(string path)
    {
        if (!File.Exists(path))
            throw new BaselineException($"{path}: no baseline there; write one with 'thermverify baseline <design.toml>'");
        JsonNode? root;
        try
        {
            // A regular file of bounded size only: a FIFO or a device named as the baseline is refused, never waited on.
            root = JsonNode.Parse(InputFile.ReadText(path, Limits.Work.Limits.MaximumFileBytes), documentOptions: new JsonDocumentOptions { MaxDepth = 64 });
        }
        catch (InputFileException e)
        {
            throw new BaselineException($"{path}: the baseline {e.Problem}. {e.Hint}");
        }
        catch (JsonException e)
        {
            throw new BaselineException($"{path}: not valid JSON ({e.Message}); write it again with 'thermverify baseline <design.toml> --force'");
        }
        if (root is not JsonObject doc) throw Bad(path, "the top level", "an object");
        var schema = Text(doc, "schema", path, "the top level");
        if (schema != Schema)
            throw new BaselineException($"{path}: schema \"{schema}\" is not \"{Schema}\"; write the baseline again with this version (--force)");
        var design = doc["design"] as JsonObject ?? throw Bad(path, "design", "an object with name and sha256");
        var list = doc["figures"] as JsonArray ?? throw Bad(path, "figures", "an array");
        var figures = list.Select((node, i) => Figure(node, path, $"figures[{i}]")).ToList();
        var duplicate = figures.GroupBy(f => f.Id).FirstOrDefault(g => g.Count() > 1);
        if (duplicate is not null) throw new BaselineException($"{path}: figure \"{duplicate.Key}\" appears twice; keep one");
        var provenance = doc["provenance"] switch
        {
            null => null, // written before baselines carried it
            JsonObject o => ProvenanceJson.FromJson(o, (field, expected) => Bad(path, $"provenance.{field}", expected)),
            _ => throw Bad(path, "provenance", "an object"),
        };
        return new Baseline(Text(design, "name", path, "design"), Text(design, "sha256", path, "design"), Text(doc, "tool", path, "the top level"), figures)
        {
            Provenance = provenance,
        };
    }

    private static BaselineFigure Figure(JsonNode? node, string path, string where)
    {
        if (node is not JsonObject o) throw Bad(path, where, "an object");
        var better = Text(o, "better", path, where) switch
        {
            "lower" => Better.Lower,
            "higher" => Better.Higher,
            var other => throw new BaselineException($"{path}: {where}.better is \"{other}\"; write \"lower\" or \"higher\""),
        };
        var tolerance = Number(o, "tolerance", path, where) ?? throw Bad(path, $"{where}.tolerance", "a number ≥ 0");
        if (!(tolerance >= 0)) throw Bad(path, $"{where}.tolerance", "a number ≥ 0");
        return new BaselineFigure(Text(o, "id", path, where), Text(o, "description", path, where), Number(o, "value", path, where),
            Text(o, "unit", path, where), better, tolerance);
    }

    private static string Text(JsonObject o, string key, string path, string where) =>
        o[key] is JsonValue v && v.TryGetValue<string>(out var s) ? s : throw Bad(path, $"{where}.{key}", "a string");

    private static double? Number(JsonObject o, string key, string path, string where)
    {
        if (!o.ContainsKey(key)) throw Bad(path, $"{where}.{key}", "present (a number, or null)");
        return o[key] switch
        {
            null => null,
            JsonValue v when v.TryGetValue<double>(out var d) => d,
            _ => throw Bad(path, $"{where}.{key}", "a number or null"),
        };
    }

    private static BaselineException Bad(string path, string what, string expected) =>
        new($"{path}: {what} must be {expected}; fix the file or write it again with 'thermverify baseline <design.toml> --force'");
}

/// <summary>A baseline file that is missing, unreadable or not in the expected form.</summary>
public sealed class BaselineException(string message) : Exception(message);
