using System.Text.Json.Nodes;

namespace ThermVerify.Provenance;

/// <summary>
/// The "provenance" object every JSON document of thermverify carries (docs/json-output.md), and its strict reading
/// back from a baseline file: a missing or mistyped field is an error through <c>bad</c>, naming the field.
/// </summary>
internal static class ProvenanceJson
{
    public static JsonObject ToJson(RunProvenance p)
    {
        var settings = new JsonObject();
        foreach (var s in p.Settings) settings[s.Name] = s.Value;
        return new JsonObject
        {
            ["tool"] = new JsonObject { ["name"] = "thermverify", ["version"] = p.ToolVersion },
            ["engine"] = new JsonObject { ["name"] = p.Engine, ["version"] = p.EngineVersion },
            ["design"] = p.Design is not { } d ? null : new JsonObject
            {
                ["sha256"] = d.Sha256,
                ["files"] = new JsonArray([.. d.Files.Select(f => (JsonNode)new JsonObject { ["name"] = f.Name, ["sha256"] = f.Sha256 })]),
            },
            ["settings"] = settings,
        };
    }

    /// <param name="bad">Makes the error for a field (its path below "provenance") that is missing or not of the form expected.</param>
    internal static RunProvenance FromJson(JsonObject o, Func<string, string, Exception> bad)
    {
        var tool = o["tool"] as JsonObject ?? throw bad("tool", "an object with name and version");
        var engine = o["engine"] as JsonObject ?? throw bad("engine", "an object with name and version");
        DesignDigest? design = null;
        if (o["design"] is JsonObject d)
        {
            var files = (d["files"] as JsonArray ?? throw bad("design.files", "an array")).Select((f, i) => f is JsonObject file
                ? new SourceFile(Text(file, "name", $"design.files[{i}].name", bad), Text(file, "sha256", $"design.files[{i}].sha256", bad))
                : throw bad($"design.files[{i}]", "an object with name and sha256")).ToList();
            if (files.Count == 0) throw bad("design.files", "a list of at least the design file");
            design = new DesignDigest(files);
            if (Text(d, "sha256", "design.sha256", bad) != design.Sha256) throw bad("design.sha256", "the hash of the files listed");
        }
        else if (o["design"] is not null) throw bad("design", "an object with sha256 and files, or null");
        var settings = o["settings"] as JsonObject ?? throw bad("settings", "an object of option names and values");
        return new RunProvenance(Text(tool, "version", "tool.version", bad), Text(engine, "name", "engine.name", bad),
            engine["version"] is null ? null : Text(engine, "version", "engine.version", bad), design,
            [.. settings.Select(s => new RunSetting(s.Key, s.Value is JsonValue v && v.TryGetValue<string>(out var text) ? text : throw bad($"settings.{s.Key}", "a string")))]);
    }

    private static string Text(JsonObject o, string key, string path, Func<string, string, Exception> bad) =>
        o[key] is JsonValue v && v.TryGetValue<string>(out var s) ? s : throw bad(path, "a string");
}
