using System.Reflection;

namespace GlobalFit.Cli;

/// <summary>The program's name and version as recorded in the files it writes.</summary>
public static class ProgramInfo
{
    /// <summary>E.g. <c>globalfit 0.1.0</c>.</summary>
    public static string Generator { get; } =
        $"globalfit {typeof(ProgramInfo).Assembly.GetCustomAttribute<AssemblyInformationalVersionAttribute>()?.InformationalVersion.Split('+')[0] ?? "unknown"}";
}
