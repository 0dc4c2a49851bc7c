using System.Collections.Immutable;

namespace GlobalFit.Physics.DataFiles;

/// <summary>Where an observation came from: the program that wrote it, when, and free-form notes
/// such as the scenario name, seed and command line.</summary>
/// <remarks>Immutable and safe to share between threads. Entries are kept sorted by key (ordinal) so a file
/// written twice from the same provenance is laid out the same way.</remarks>
public sealed class ObservationProvenance
{
    /// <summary>Creates a provenance record.</summary>
    /// <param name="generator">The writing program and its version, e.g. <c>globalfit 0.1.0</c>; not empty.</param>
    /// <param name="createdUtc">When the data were made; stored as UTC.</param>
    /// <param name="notes">Free-form notes; keys are non-empty, without '/' or control characters; values are any text.</param>
    /// <exception cref="ArgumentException">The generator is empty, or a key is empty, repeated or contains '/' or a control character.</exception>
    public ObservationProvenance(string generator, DateTimeOffset createdUtc, IEnumerable<KeyValuePair<string, string>> notes)
    {
        ArgumentException.ThrowIfNullOrWhiteSpace(generator);
        ArgumentNullException.ThrowIfNull(notes);
        var builder = ImmutableSortedDictionary.CreateBuilder<string, string>(StringComparer.Ordinal);
        foreach (var (key, value) in notes)
        {
            if (string.IsNullOrEmpty(key) || key.Contains('/') || key.Any(char.IsControl))
                throw new ArgumentException($"provenance key '{key}' must be non-empty and free of '/' and control characters");
            ArgumentNullException.ThrowIfNull(value, $"provenance[{key}]");
            if (!builder.TryAdd(key, value))
                throw new ArgumentException($"provenance key '{key}' appears twice");
        }
        Generator = generator;
        CreatedUtc = createdUtc.ToUniversalTime();
        Entries = builder.ToImmutable();
    }

    /// <summary>The writing program and its version.</summary>
    public string Generator { get; }

    /// <summary>When the data were made, in UTC.</summary>
    public DateTimeOffset CreatedUtc { get; }

    /// <summary>Free-form notes, sorted by key.</summary>
    public IReadOnlyDictionary<string, string> Entries { get; }
}
