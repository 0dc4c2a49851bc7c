namespace GlobalFit.Engine.Tests.Catalogue;

/// <summary>A run folder under the temporary folder, removed after the test.</summary>
internal sealed class TemporaryRunFolder : IDisposable
{
    public TemporaryRunFolder() => Directory.CreateDirectory(Path);

    public string Path { get; } = System.IO.Path.Combine(System.IO.Path.GetTempPath(), "globalfit-engine-tests-" + Guid.NewGuid().ToString("N"));

    public string File(params string[] parts) => System.IO.Path.Combine([Path, .. parts]);

    public void Dispose()
    {
        try { Directory.Delete(Path, recursive: true); }
        catch (IOException) { }
    }
}
