using GlobalFit.Physics.DataFiles;
using GlobalFit.Physics.Files;
using Xunit;

namespace GlobalFit.Physics.Tests.DataFiles;

internal static class BadInputAssert
{
    /// <summary>Reading <paramref name="path"/> must fail with bad input that names the file and <paramref name="location"/>
    /// (null: the whole file), and whose problem mentions <paramref name="problemFragment"/>.</summary>
    public static InvalidInputException Read(string path, string? location, string problemFragment)
    {
        var error = Assert.Throws<InvalidInputException>(() => ObservationFile.Read(path));
        Assert.Equal(path, error.InputSource);
        Assert.Equal(location, error.Location);
        Assert.Contains(problemFragment, error.Problem, StringComparison.Ordinal);
        Assert.StartsWith(path + ": ", error.Message, StringComparison.Ordinal);
        if (location is not null) Assert.Contains(location, error.Message, StringComparison.Ordinal);
        return error;
    }
}
