using System.ComponentModel;
using System.Diagnostics;
using System.Text.RegularExpressions;

namespace GlobalFit.Cli.Tests.Support;

/// <summary>The names in an HDF5 file (groups, datasets, attributes, compound members) as the HDF5 Group's own
/// <c>h5dump</c> reads them: a read path independent of the library that wrote the file.</summary>
/// <remarks>Paths: <c>/tdi/A</c> for an object, <c>/tdi@dt_s</c> for an attribute (<c>/@x</c> on the root),
/// <c>/catalogue/galactic_binaries/sources#id</c> for a compound member. The tool comes from Debian's
/// <c>hdf5-tools</c>; <c>.ci/run</c> installs it, and without it the caller fails rather than passing unchecked.</remarks>
internal static partial class Hdf5Structure
{
    /// <summary>Every name in the file at <paramref name="path"/>, each as a path as described above.</summary>
    public static SortedSet<string> Read(string path)
    {
        string header;
        try
        {
            using var process = Process.Start(new ProcessStartInfo("h5dump", ["-H", path])
            {
                RedirectStandardOutput = true,
                RedirectStandardError = true,
            })!;
            var error = process.StandardError.ReadToEndAsync();
            header = process.StandardOutput.ReadToEnd();
            process.WaitForExit();
            if (process.ExitCode != 0)
                throw new InvalidOperationException($"h5dump could not read {path}: {error.Result}");
        }
        catch (Win32Exception e)
        {
            throw new InvalidOperationException("h5dump was not found: install Debian's hdf5-tools (apt-get install -y hdf5-tools), "
                + "as .ci/run does; this test reads files through the HDF5 C library on purpose.", e);
        }
        return Parse(header);
    }

    /// <summary>Reads the names out of <c>h5dump -H</c> output.</summary>
    public static SortedSet<string> Parse(string header)
    {
        var names = new SortedSet<string>(StringComparer.Ordinal);
        var open = new Stack<(string Kind, string Path, int Depth)>();
        int depth = 0;
        foreach (string line in header.Split('\n'))
        {
            var obj = ObjectLine().Match(line);
            if (obj.Success)
            {
                string kind = obj.Groups[1].Value, name = obj.Groups[2].Value;
                string parent = open.Count == 0 ? "" : open.Peek().Path;
                string path = kind switch
                {
                    "GROUP" when name == "/" => "/",
                    "ATTRIBUTE" => parent + "@" + name,
                    _ => (parent == "/" ? "" : parent) + "/" + name,
                };
                names.Add(path);
                open.Push((kind, path, depth));
            }
            else if (open.Count > 0 && open.Peek().Kind == "DATASET" && MemberLine().Match(line) is { Success: true } member)
            {
                names.Add(open.Peek().Path + "#" + member.Groups[1].Value);
            }
            depth += line.Count(c => c == '{') - line.Count(c => c == '}');
            while (open.Count > 0 && depth <= open.Peek().Depth)
                open.Pop();
        }
        return names;
    }

    [GeneratedRegex("""^\s*(GROUP|DATASET|ATTRIBUTE) "([^"]*)" \{""")]
    private static partial Regex ObjectLine();

    [GeneratedRegex("""^\s*(?:\}|H5T_\w+)\s+"([^"]+)";\s*$""")]
    private static partial Regex MemberLine();
}
