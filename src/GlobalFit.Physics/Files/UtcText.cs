using System.Globalization;

namespace GlobalFit.Physics.Files;

/// <summary>The one way a moment is written for people and in run records: UTC to the second, ISO 8601 with a
/// <c>Z</c> (<c>2026-12-05T11:06:56Z</c>), whatever the machine's time zone.</summary>
public static class UtcText
{
    /// <summary>The text of <paramref name="moment"/> in UTC.</summary>
    /// <param name="moment">Any moment; its offset is removed.</param>
    /// <returns>The text, <c>yyyy-MM-ddTHH:mm:ssZ</c>.</returns>
    public static string Format(DateTimeOffset moment) =>
        moment.UtcDateTime.ToString("yyyy'-'MM'-'dd'T'HH':'mm':'ss'Z'", CultureInfo.InvariantCulture);
}
