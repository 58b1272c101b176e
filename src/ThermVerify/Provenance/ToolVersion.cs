using System.Reflection;

namespace ThermVerify.Provenance;

/// <summary>The version of thermverify that produced an output, as every output names it.</summary>
internal static class ToolVersion
{
    public static string Current { get; } =
        typeof(ToolVersion).Assembly.GetCustomAttribute<AssemblyInformationalVersionAttribute>()?.InformationalVersion ?? "unknown";
}
