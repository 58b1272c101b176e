using System.Text;
using ThermVerify.Provenance;

namespace ThermVerify.Reporting.Text;

/// <summary>The provenance under a terminal header: two lines, the run (tool, engine, settings) and the design's files by hash.</summary>
internal static class ProvenanceText
{
    public static void Append(StringBuilder text, RunProvenance p)
    {
        AppendRun(text, p);
        AppendFiles(text, "files   ", p);
    }

    public static void AppendRun(StringBuilder text, RunProvenance p) =>
        text.AppendLine($"  run      thermverify {p.ToolVersion}, engine {p.EngineText}; {p.SettingsText}");

    /// <param name="label">Eight characters, so the value lines up under the run line's.</param>
    public static void AppendFiles(StringBuilder text, string label, RunProvenance p) =>
        text.AppendLine($"  {label} {p.DesignText(shortHash: true)}");
}
