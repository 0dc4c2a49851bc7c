using System.Globalization;
using System.Text;

namespace GlobalFit.Engine.Samples;

/// <summary>Maps a worker id (<c>class_id/label</c>) to the name of its sample file in <c>RUN/samples/</c>
/// (<c>class_id.label.samples</c>) and back.</summary>
/// <remarks>Lower-case letters, digits, <c>_</c> and <c>-</c> are kept; <c>/</c> becomes <c>.</c>; every other byte of the
/// id's UTF-8 form (upper case included, so that ids differing only in case never share a file on a case-insensitive
/// file system) becomes <c>%XX</c>. A leading <c>/</c> is escaped too, so no file is hidden. The mapping is therefore
/// one-to-one and <see cref="ToWorkerId"/> inverts it.</remarks>
public static class WorkerFileName
{
    /// <summary>The extension of every sample file.</summary>
    public const string Extension = ".samples";

    /// <summary>The file name of <paramref name="workerId"/>'s samples.</summary>
    /// <param name="workerId">A non-empty worker id.</param>
    /// <returns>A file name without folder.</returns>
    /// <exception cref="ArgumentException">The id is empty.</exception>
    public static string FromWorkerId(string workerId)
    {
        ArgumentException.ThrowIfNullOrEmpty(workerId);
        var name = new StringBuilder(workerId.Length + Extension.Length);
        byte[] utf8 = Encoding.UTF8.GetBytes(workerId);
        for (int i = 0; i < utf8.Length; i++)
        {
            char c = (char)utf8[i];
            if (c is (>= 'a' and <= 'z') or (>= '0' and <= '9') or '_' or '-') name.Append(c);
            else if (c == '/' && i > 0) name.Append('.');
            else name.Append('%').Append(utf8[i].ToString("X2", CultureInfo.InvariantCulture));
        }
        return name.Append(Extension).ToString();
    }

    /// <summary>The worker id whose samples <paramref name="fileName"/> holds, or null when the name is not one that
    /// <see cref="FromWorkerId"/> produces.</summary>
    /// <param name="fileName">A file name without folder.</param>
    /// <returns>The id, or null.</returns>
    public static string? ToWorkerId(string fileName)
    {
        ArgumentNullException.ThrowIfNull(fileName);
        if (!fileName.EndsWith(Extension, StringComparison.Ordinal) || fileName.Length == Extension.Length) return null;
        string stem = fileName[..^Extension.Length];
        var bytes = new List<byte>(stem.Length);
        for (int i = 0; i < stem.Length; i++)
        {
            char c = stem[i];
            if (c is (>= 'a' and <= 'z') or (>= '0' and <= '9') or '_' or '-') bytes.Add((byte)c);
            else if (c == '.' && i > 0) bytes.Add((byte)'/');
            else if (c == '%' && i + 2 < stem.Length && byte.TryParse(stem.AsSpan(i + 1, 2), NumberStyles.AllowHexSpecifier, CultureInfo.InvariantCulture, out byte escaped))
            {
                bytes.Add(escaped);
                i += 2;
            }
            else return null;
        }
        string id;
        try
        {
            id = new UTF8Encoding(false, throwOnInvalidBytes: true).GetString(bytes.ToArray());
        }
        catch (DecoderFallbackException)
        {
            return null;
        }
        // Only the canonical spelling maps back, so two file names can never claim the same worker.
        return FromWorkerId(id) == fileName ? id : null;
    }
}
