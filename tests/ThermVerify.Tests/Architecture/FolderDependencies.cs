using System.Text.RegularExpressions;

namespace ThermVerify.Tests.Architecture;

/// <summary>One use of another folder: where, and the text that makes it.</summary>
internal sealed record FolderUse(string FromFolder, string ToFolder, string File, int Line, string Text);

/// <summary>
/// Finds which folder of the library each source file uses. A file belongs to the folder its namespace names
/// (ThermVerify.Check.Buffer belongs to Check); it uses another folder through a using directive, a qualified name
/// (ThermVerify.Simulation.X, or Simulation.X where X is a type or namespace of that folder). Comments and the text of
/// literals are ignored.
/// </summary>
internal static partial class FolderDependencies
{
    public static IReadOnlyList<FolderUse> Find(IReadOnlyList<(string Path, string Text)> sources)
    {
        var declared = new Dictionary<string, HashSet<string>>(StringComparer.Ordinal); // folder → its type and sub-namespace names
        var folders = new List<(string Path, string Folder, string Code)>();
        foreach (var (path, text) in sources)
        {
            var code = SourceText.CodeOnly(text);
            var ns = Namespace().Match(code);
            if (!ns.Success) continue;
            var parts = ns.Groups[1].Value.Split('.');
            if (parts.Length < 2 || parts[0] != "ThermVerify") continue;
            var folder = parts[1];
            folders.Add((path, folder, code));
            var names = declared.TryGetValue(folder, out var set) ? set : declared[folder] = new HashSet<string>(StringComparer.Ordinal);
            foreach (Match m in TypeDeclaration().Matches(code)) names.Add(m.Groups[1].Value);
            foreach (var sub in parts.Skip(2)) names.Add(sub);
        }

        var uses = new List<FolderUse>();
        foreach (var (path, folder, code) in folders)
        {
            var lines = code.Split('\n');
            for (var i = 0; i < lines.Length; i++)
            {
                var line = lines[i];
                foreach (Match m in QualifiedUse().Matches(line))
                    Add(m.Groups[1].Value, m.Value);
                foreach (Match m in ShortUse().Matches(line))
                    if (declared.TryGetValue(m.Groups[1].Value, out var names) && names.Contains(m.Groups[2].Value))
                        Add(m.Groups[1].Value, m.Value);

                void Add(string to, string text)
                {
                    if (to != folder && declared.ContainsKey(to)) uses.Add(new FolderUse(folder, to, path, i + 1, text.Trim()));
                }
            }
        }
        return uses;
    }

    [GeneratedRegex(@"^\s*namespace\s+([\w.]+)", RegexOptions.Multiline)]
    private static partial Regex Namespace();

    [GeneratedRegex(@"\b(?:class|record\s+struct|record|struct|enum|interface)\s+([A-Z]\w*)")]
    private static partial Regex TypeDeclaration();

    /// <summary>using ThermVerify.X, using static ThermVerify.X.Y, alias = ThermVerify.X, global::ThermVerify.X, ThermVerify.X.Y.</summary>
    [GeneratedRegex(@"(?<![\w.])(?:global::)?ThermVerify\.([A-Z]\w*)")]
    private static partial Regex QualifiedUse();

    /// <summary>X.Y not preceded by a dot or identifier: a folder's namespace seen from a sibling namespace.</summary>
    [GeneratedRegex(@"(?<![\w.])([A-Z]\w*)\.([A-Z]\w*)")]
    private static partial Regex ShortUse();
}
