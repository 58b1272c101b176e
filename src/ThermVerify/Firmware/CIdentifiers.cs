using System.Text.RegularExpressions;

namespace ThermVerify.Firmware;

/// <summary>C identifiers made from a design's name.</summary>
internal static partial class CIdentifiers
{
    /// <summary>Lower case, runs of other characters as one underscore, a letter first, at most 31 characters (C99's significant length).</summary>
    public static string PrefixFor(string designName)
    {
        var words = NonIdentifier().Replace(designName.ToLowerInvariant(), "_").Trim('_');
        var prefix = words.Length == 0 || !char.IsAsciiLetterLower(words[0]) ? "tv_" + words : words;
        return prefix.Length > 31 ? prefix[..31].TrimEnd('_') : prefix;
    }

    [GeneratedRegex("[^a-z0-9]+")]
    private static partial Regex NonIdentifier();
}
