namespace GlobalFit.Engine.Configuration;

/// <summary>Finds the known key closest to a misspelt one, for "did you mean" hints.</summary>
internal static class KeySuggestion
{
    /// <summary>The known key within edit distance 3 (and less than half the key's length) of <paramref name="key"/>, or null.</summary>
    public static string? Closest(string key, IReadOnlyList<string> known)
    {
        string? best = null;
        int bestDistance = int.MaxValue;
        foreach (var candidate in known)
        {
            int d = EditDistance(key, candidate);
            if (d < bestDistance) { bestDistance = d; best = candidate; }
        }
        return bestDistance <= Math.Min(3, Math.Max(1, key.Length / 2)) ? best : null;
    }

    // Levenshtein distance with a two-row table.
    private static int EditDistance(string a, string b)
    {
        var previous = new int[b.Length + 1];
        var current = new int[b.Length + 1];
        for (int j = 0; j <= b.Length; j++) previous[j] = j;
        for (int i = 1; i <= a.Length; i++)
        {
            current[0] = i;
            for (int j = 1; j <= b.Length; j++)
            {
                int substitution = previous[j - 1] + (a[i - 1] == b[j - 1] ? 0 : 1);
                current[j] = Math.Min(substitution, Math.Min(previous[j] + 1, current[j - 1] + 1));
            }
            (previous, current) = (current, previous);
        }
        return previous[b.Length];
    }
}
