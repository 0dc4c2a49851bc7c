using System.Collections.Immutable;
using GlobalFit.Engine.Configuration;
using GlobalFit.Engine.Fitting;

namespace GlobalFit.Engine.Runs;

/// <summary>The blocked-Gibbs schedule: an ordered list of stages, each a set of worker groups whose templates never
/// share a bin, so their workers may update at the same time.</summary>
/// <param name="Stages">Group names per stage, in order.</param>
public sealed record FitSchedule(ImmutableArray<ImmutableArray<string>> Stages)
{
    /// <summary>Every group in module registration order, one per stage.</summary>
    public static FitSchedule Default(IEnumerable<IFitSourceClassPlan> classes) =>
        new([.. classes.SelectMany(c => c.Groups).Select(g => ImmutableArray.Create(g.Name))]);

    /// <summary>Reads <c>[schedule] stages</c> (an array whose items are a group name or an array of group names) and
    /// checks that every group of <paramref name="classes"/> appears exactly once.</summary>
    /// <param name="table">The <c>[schedule]</c> table, or null for the default schedule.</param>
    /// <param name="classes">The planned classes.</param>
    /// <exception cref="Physics.Files.InvalidInputException">A group is unknown, repeated or missing; the message names
    /// the key.</exception>
    public static FitSchedule FromConfig(ConfigTable? table, IReadOnlyList<IFitSourceClassPlan> classes)
    {
        ArgumentNullException.ThrowIfNull(classes);
        if (table is null || !table.Has("stages"))
        {
            table?.RejectUnknownKeys(["stages"]);
            return Default(classes);
        }
        var known = classes.SelectMany(c => c.Groups).Select(g => g.Name).ToList();
        var raw = table.GetStringLists("stages");
        table.RejectUnknownKeys(["stages"]);
        var seen = new HashSet<string>(StringComparer.Ordinal);
        foreach (var stage in raw)
        {
            if (stage.Count == 0) throw table.Invalid("stages", "a stage lists no worker group");
            foreach (string group in stage)
            {
                if (!known.Contains(group))
                {
                    string? near = KeySuggestion.Closest(group, known);
                    throw table.Invalid("stages", $"no worker group is called \"{group}\"{(near is null ? "" : $"; did you mean \"{near}\"?")} (groups: {string.Join(", ", known)})");
                }
                if (!seen.Add(group)) throw table.Invalid("stages", $"group \"{group}\" appears more than once");
            }
        }
        var missing = known.Where(g => !seen.Contains(g)).ToList();
        if (missing.Count > 0) throw table.Invalid("stages", $"every worker group must run once per iteration; missing: {string.Join(", ", missing)}");
        return new FitSchedule([.. raw.Select(s => s.ToImmutableArray())]);
    }
}
