namespace ThermVerify.Baselines;

/// <summary>
/// The key figures of one design's check, with the design's fingerprint (SHA-256 of its normal form, so an edit of a
/// comment is no change) and the provenance of the run that made it (null in a file written before baselines carried it).
/// </summary>
public sealed record Baseline(string DesignName, string DesignSha256, string ToolVersion, IReadOnlyList<BaselineFigure> Figures)
{
    public Provenance.RunProvenance? Provenance { get; init; }

    /// <summary>Where a design's baseline lives unless told otherwise: beside it, "probe.toml" → "probe.baseline.json".</summary>
    public static string DefaultPathFor(string designPath) =>
        Path.Combine(Path.GetDirectoryName(Path.GetFullPath(designPath))!, Path.GetFileNameWithoutExtension(designPath) + ".baseline.json");
}
