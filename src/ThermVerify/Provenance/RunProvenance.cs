namespace ThermVerify.Provenance;

/// <summary>A setting of a run that changes its results, by the name of its option, with its value as written.</summary>
public sealed record RunSetting(string Name, string Value);

/// <summary>
/// Where an output came from: the tool's version, the engine that simulated (with its own version where it reports
/// one), the design by its content hash, and the settings that change results (not those that only change speed,
/// such as the thread count). Computed once per run, after the work (the engine's version is known then), and
/// handed to every writer, which renders it as it renders everything else. Nothing in it depends on the clock or
/// the machine, so two runs of the same design with the same settings carry the same record.
/// </summary>
public sealed record RunProvenance(string ToolVersion, string Engine, string? EngineVersion, DesignDigest? Design, IReadOnlyList<RunSetting> Settings)
{
    /// <summary>The engine that runs when none is chosen.</summary>
    public const string BuiltInEngine = "built-in";

    /// <summary>A run of this version of thermverify.</summary>
    public static RunProvenance Of(string engine, string? engineVersion, DesignDigest? design, params IEnumerable<RunSetting> settings) =>
        new(Provenance.ToolVersion.Current, engine, engineVersion, design, [.. settings]);

    public string EngineText => EngineVersion is null ? Engine : $"{Engine}, version {EngineVersion}";

    public string DesignText(bool shortHash = false) => DesignDigest.Describe(Design, shortHash);

    public string SettingsText => Settings.Count == 0 ? "defaults" : string.Join(", ", Settings.Select(s => $"{s.Name} {s.Value}"));

    /// <summary>The record as labelled lines, in the order every text form shows them.</summary>
    public IReadOnlyList<(string Label, string Value)> Lines(bool shortHash = false) =>
    [
        ("tool", $"thermverify {ToolVersion}"),
        ("engine", EngineText),
        ("design files", DesignText(shortHash)),
        ("run settings", SettingsText),
    ];

    /// <summary>
    /// How a run made as <paramref name="before"/> differs from this one in what changes results: the engine, the
    /// settings, the tool's version, the design's files. Empty when they agree; each entry is a sentence.
    /// </summary>
    public IReadOnlyList<string> DifferencesFrom(RunProvenance before)
    {
        var differences = new List<string>();
        if (before.Engine != Engine || before.EngineVersion != EngineVersion)
            differences.Add($"engine: {before.EngineText} then, {EngineText} now");
        foreach (var name in before.Settings.Select(s => s.Name).Union(Settings.Select(s => s.Name)))
        {
            var then = before.Settings.FirstOrDefault(s => s.Name == name)?.Value;
            var now = Settings.FirstOrDefault(s => s.Name == name)?.Value;
            if (then != now) differences.Add($"{name}: {then ?? "not set"} then, {now ?? "not set"} now");
        }
        if (before.ToolVersion != ToolVersion)
            differences.Add($"tool: thermverify {before.ToolVersion} then, {ToolVersion} now");
        if (before.Design is { } a && Design is { } b && !a.Equals(b))
            differences.Add($"design files: {before.DesignText(shortHash: true)} then, {DesignText(shortHash: true)} now");
        return differences;
    }
}
