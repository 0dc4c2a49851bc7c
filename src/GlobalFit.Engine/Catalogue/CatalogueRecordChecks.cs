using GlobalFit.Engine.Fitting;

namespace GlobalFit.Engine.Catalogue;

/// <summary>Checks shared by the catalogue writers, so that no writer starts a file it cannot finish.</summary>
internal static class CatalogueRecordChecks
{
    /// <summary>Throws unless every record is self-consistent and the records of one class share their columns.</summary>
    public static void Require(IReadOnlyList<CatalogueRecord> records)
    {
        ArgumentNullException.ThrowIfNull(records);
        var columnsOfClass = new Dictionary<string, string[]>(StringComparer.Ordinal);
        var ids = new HashSet<(string, string)>();
        var modesOfClass = new Dictionary<string, string[]>(StringComparer.Ordinal);
        foreach (var r in records)
        {
            if (r is null) throw new ArgumentException("a catalogue record is null", nameof(records));
            if (string.IsNullOrEmpty(r.Id) || string.IsNullOrEmpty(r.ClassId)) throw new ArgumentException("a catalogue record has no id or class", nameof(records));
            if (r.ClassId.Contains('/')) throw new ArgumentException($"class id '{r.ClassId}' contains '/'", nameof(records));
            if (!ids.Add((r.ClassId, r.Id))) throw new ArgumentException($"{r.ClassId} source {r.Id} appears twice", nameof(records));
            int width = r.ParameterNames.Length;
            if (r.Median.Length != width || r.Lower.Length != width || r.Upper.Length != width || (width == 0 ? r.Samples.Length != 0 : r.Samples.Length % width != 0))
                throw new ArgumentException($"{r.ClassId} source {r.Id}: summaries or samples do not match its {width} parameters", nameof(records));
            if (r.Convergence is { } convergence && (convergence.SplitRhat.Length != width || convergence.EffectiveSampleSize.Length != width
                || convergence.ModeNames.Length != convergence.ModeFractions.Length))
                throw new ArgumentException($"{r.ClassId} source {r.Id}: its convergence report does not match its {width} parameters or its modes", nameof(records));
            if (r.Convergence is { } reported && !modesOfClass.TryAdd(r.ClassId, [.. reported.ModeNames]) && !modesOfClass[r.ClassId].SequenceEqual(reported.ModeNames))
                throw new ArgumentException($"{r.ClassId} source {r.Id} reports other sky modes than the class's earlier sources", nameof(records));
            string[] columns = [.. r.ParameterNames];
            if (!columnsOfClass.TryAdd(r.ClassId, columns) && !columnsOfClass[r.ClassId].SequenceEqual(columns))
                throw new ArgumentException($"{r.ClassId} source {r.Id} has other parameters than the class's earlier sources", nameof(records));
        }
    }
}
