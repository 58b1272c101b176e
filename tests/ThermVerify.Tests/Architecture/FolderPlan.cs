using System.Text.RegularExpressions;

namespace ThermVerify.Tests.Architecture;

/// <summary>
/// The plan of the library's folders as DEVELOPERS.md states it: ordered layers (a folder may use the folders of the
/// layers above its own, never its own layer's neighbours or anything below) and pairs that are forbidden outright.
/// </summary>
internal sealed record FolderPlan(IReadOnlyDictionary<string, int> Layer, IReadOnlySet<(string From, string To)> Forbidden)
{
    public static FolderPlan FromDevelopersGuide(string markdown)
    {
        var layers = new Dictionary<string, int>(StringComparer.Ordinal);
        foreach (var (line, index) in Section(markdown, "layers").Select((l, i) => (l, i)))
            foreach (var folder in Regex.Replace(line, @"^\s*\d+\.\s*", "").Split(',', StringSplitOptions.TrimEntries | StringSplitOptions.RemoveEmptyEntries))
                layers[folder] = index;
        var forbidden = new HashSet<(string, string)>();
        foreach (var line in Section(markdown, "forbidden"))
        {
            var m = Regex.Match(line, @"^\s*-\s*(\w+)\s*↛\s*([\w, ]+?)\s*(:|$)");
            if (!m.Success) throw new InvalidDataException($"DEVELOPERS.md forbidden line not understood: {line}");
            foreach (var to in m.Groups[2].Value.Split(',', StringSplitOptions.TrimEntries | StringSplitOptions.RemoveEmptyEntries))
                forbidden.Add((m.Groups[1].Value, to));
        }
        return new FolderPlan(layers, forbidden);
    }

    /// <summary>Why <paramref name="from"/> may not use <paramref name="to"/>, or null when the plan allows it.</summary>
    public string? Refusal(string from, string to)
    {
        if (Forbidden.Contains((from, to))) return $"{from} must never use {to}";
        if (!Layer.TryGetValue(from, out var a) || !Layer.TryGetValue(to, out var b)) return null; // projects outside the layers
        if (b < a) return null;
        return b == a ? $"{from} and {to} share a layer and may not use each other" : $"{to} comes after {from} in the plan, and data flows one way";
    }

    private static IEnumerable<string> Section(string markdown, string name)
    {
        var begin = markdown.IndexOf($"<!-- {name}: begin -->", StringComparison.Ordinal);
        var end = markdown.IndexOf($"<!-- {name}: end -->", StringComparison.Ordinal);
        if (begin < 0 || end < begin) throw new InvalidDataException($"DEVELOPERS.md has no '{name}' section between <!-- {name}: begin --> and <!-- {name}: end -->");
        return markdown[begin..end].Split('\n').Skip(1).Where(l => l.Trim().Length > 0);
    }
}
