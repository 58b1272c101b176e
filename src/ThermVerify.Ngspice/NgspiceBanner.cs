using System.Text.RegularExpressions;

namespace ThermVerify.Ngspice;

/// <summary>ngspice's version as its banner states it ("** ngspice-39 shared library", "** ngspice-39 : Circuit level ..."), for provenance.</summary>
internal static partial class NgspiceBanner
{
    public static string? Version(IEnumerable<string> lines) =>
        lines.Select(line => Pattern().Match(line)).FirstOrDefault(m => m.Success)?.Groups[1].Value;

    [GeneratedRegex(@"\bngspice-([0-9][0-9A-Za-z.+_-]*)")]
    private static partial Regex Pattern();
}
