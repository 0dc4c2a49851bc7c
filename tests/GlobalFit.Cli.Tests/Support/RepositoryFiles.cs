namespace GlobalFit.Cli.Tests.Support;

/// <summary>Finds files of the repository the tests were built from (configs, README).</summary>
internal static class RepositoryFiles
{
    public static string Root
    {
        get
        {
            var folder = new DirectoryInfo(AppContext.BaseDirectory);
            while (folder is not null && !File.Exists(Path.Combine(folder.FullName, "globalfit.sln")))
                folder = folder.Parent;
            return folder?.FullName ?? throw new InvalidOperationException("globalfit.sln not found above the test folder");
        }
    }

    public static string PathOf(string relative) => Path.Combine(Root, relative);
}
