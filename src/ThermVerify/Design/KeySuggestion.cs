namespace ThermVerify.Design;

/// <summary>Finds the valid key nearest to a misspelt one (Levenshtein distance).</summary>
internal static class KeySuggestion
{
    public static string? Nearest(string key, IEnumerable<string> valid)
    {
        var best = valid.Select(v => (Key: v, Distance: Distance(key.ToLowerInvariant(), v.ToLowerInvariant())))
            .OrderBy(c => c.Distance).ThenBy(c => c.Key, StringComparer.Ordinal).FirstOrDefault();
        if (best.Key is null)
            return null;
        // Farther than a third of the word (at least 2 edits allowed) is a different word, not a typo.
        var allowed = Math.Max(2, Math.Max(key.Length, best.Key.Length) / 3);
        return best.Distance <= allowed ? best.Key : null;
    }

    public static int Distance(string a, string b)
    {
        var previous = new int[b.Length + 1];
        var current = new int[b.Length + 1];
        for (var j = 0; j <= b.Length; j++)
            previous[j] = j;
        for (var i = 1; i <= a.Length; i++)
        {
            current[0] = i;
            for (var j = 1; j <= b.Length; j++)
            {
                var cost = a[i - 1] == b[j - 1] ? 0 : 1;
                current[j] = Math.Min(Math.Min(current[j - 1] + 1, previous[j] + 1), previous[j - 1] + cost);
            }
            (previous, current) = (current, previous);
        }
        return previous[b.Length];
    }
}
