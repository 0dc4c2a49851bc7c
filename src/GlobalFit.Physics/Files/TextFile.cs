using System.Text;

namespace GlobalFit.Physics.Files;

/// <summary>Reads the text files globalfit takes from users and from its run folders (configurations, telemetry, commit
/// and identity records), refusing what is not UTF-8 text in plain words.</summary>
public static class TextFile
{
    private static readonly UTF8Encoding Strict = new(encoderShouldEmitUTF8Identifier: false, throwOnInvalidBytes: true);

    /// <summary>The text of <paramref name="path"/>, a leading byte-order mark dropped.</summary>
    /// <exception cref="InvalidInputException">The file is missing, is a folder, cannot be read, or is not UTF-8 text
    /// (the message gives the line of the first bad byte).</exception>
    public static string ReadUtf8(string path)
    {
        byte[] bytes;
        try
        {
            bytes = File.ReadAllBytes(path);
        }
        catch (FileNotFoundException)
        {
            throw new InvalidInputException(path, null, "file not found");
        }
        catch (DirectoryNotFoundException)
        {
            throw new InvalidInputException(path, null, "file not found (its folder does not exist)");
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            throw new InvalidInputException(path, null, $"cannot read the file: {FileProblem.Describe(path, e)}", e);
        }
        var span = bytes.AsSpan();
        if (span.StartsWith(Encoding.UTF8.Preamble)) span = span[Encoding.UTF8.Preamble.Length..];
        try
        {
            return Strict.GetString(span);
        }
        catch (DecoderFallbackException e)
        {
            int at = e.Index >= 0 ? e.Index : 0;
            int line = 1 + span[..Math.Min(at, span.Length)].Count((byte)'\n');
            throw new InvalidInputException(path, $"line {line}", "is not UTF-8 text (a byte sequence no UTF-8 text holds)", e);
        }
    }
}
