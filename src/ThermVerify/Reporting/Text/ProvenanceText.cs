using System.Text;
using ThermVerify.Provenance;

namespace ThermVerify.Reporting.Text;

/// <summary>The provenance under a terminal header: two lines, the run (tool, engine, settings) and the design's files by hash.</summary>
internal static class ProvenanceText
{
    public static void Append(StringBuilder text, RunProvenance p)
    {
        text.AppendLine($"  run      thermverify {p.ToolVersion}, engine {p.EngineText}; {p.SettingsText}");
        text.AppendLine($"  files    {p.DesignText(shortHash: true)}");
    }
}
