using System.Text;
using GlobalFit.Physics.Files;

namespace GlobalFit.Physics.Tests.Files;

public sealed class TextFileTests : IDisposable
{
    private readonly string _folder = Directory.CreateTempSubdirectory("globalfit-text-").FullName;

    [Fact]
    public void Utf8_text_reads_with_its_byte_order_mark_dropped()
    {
        string path = Path.Combine(_folder, "a.toml");
        File.WriteAllBytes(path, [.. Encoding.UTF8.Preamble, .. Encoding.UTF8.GetBytes("name = \"Δf\"\n")]);
        Assert.Equal("name = \"Δf\"\n", TextFile.ReadUtf8(path));
    }

    [Fact]
    public void Bytes_that_are_not_utf8_are_refused_in_plain_words_with_their_line()
    {
        // 0xFF never occurs in UTF-8 (RFC 3629, section 1); here it stands on line 3.
        string path = Path.Combine(_folder, "b.toml");
        File.WriteAllBytes(path, [.. Encoding.ASCII.GetBytes("a = 1\nb = 2\nc = \""), 0xFF, .. Encoding.ASCII.GetBytes("\"\n")]);
        var e = Assert.Throws<InvalidInputException>(() => TextFile.ReadUtf8(path));
        Assert.Equal($"{path}: line 3: is not UTF-8 text (a byte sequence no UTF-8 text holds)", e.Message);
    }

    [Fact]
    public void A_folder_or_a_missing_file_is_named_as_such()
    {
        Assert.Contains("is a folder", Assert.Throws<InvalidInputException>(() => TextFile.ReadUtf8(_folder)).Message, StringComparison.Ordinal);
        Assert.Contains("file not found", Assert.Throws<InvalidInputException>(() => TextFile.ReadUtf8(Path.Combine(_folder, "none"))).Message, StringComparison.Ordinal);
    }

    public void Dispose() => Directory.Delete(_folder, recursive: true);
}
