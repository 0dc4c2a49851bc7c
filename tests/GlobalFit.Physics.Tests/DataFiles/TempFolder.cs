namespace GlobalFit.Physics.Tests.DataFiles;

/// <summary>A fresh folder under the system temp folder, deleted with everything in it on dispose.</summary>
internal sealed class TempFolder : IDisposable
{
    public TempFolder()
    {
        Path = System.IO.Path.Combine(System.IO.Path.GetTempPath(), "globalfit-datafiles-" + Guid.NewGuid().ToString("N"));
        Directory.CreateDirectory(Path);
    }

    public string Path { get; }

    public string File(string name) => System.IO.Path.Combine(Path, name);

    /// <summary>Names of everything in the folder, hidden files included, sorted.</summary>
    public string[] Entries() =>
        Directory.GetFileSystemEntries(Path).Select(p => System.IO.Path.GetFileName(p)!).Order(StringComparer.Ordinal).ToArray();

    public void Dispose() => Directory.Delete(Path, recursive: true);
}
