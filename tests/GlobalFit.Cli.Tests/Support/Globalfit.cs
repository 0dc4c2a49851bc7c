using System.Diagnostics;

namespace GlobalFit.Cli.Tests.Support;

/// <summary>Starts the built <c>globalfit</c> program as a separate process.</summary>
internal static class Globalfit
{
    public static Process Start(params string[] args)
    {
        var info = new ProcessStartInfo("dotnet") { RedirectStandardOutput = true, RedirectStandardError = true };
        info.ArgumentList.Add(Path.Combine(AppContext.BaseDirectory, "globalfit.dll"));
        foreach (var a in args) info.ArgumentList.Add(a);
        var process = Process.Start(info)!;
        // Drain both pipes so a chatty child never blocks on a full pipe.
        process.OutputDataReceived += (_, _) => { };
        process.ErrorDataReceived += (_, _) => { };
        process.BeginOutputReadLine();
        process.BeginErrorReadLine();
        return process;
    }

    public static (int Code, string Out, string Error) Run(params string[] args)
    {
        var info = new ProcessStartInfo("dotnet") { RedirectStandardOutput = true, RedirectStandardError = true };
        info.ArgumentList.Add(Path.Combine(AppContext.BaseDirectory, "globalfit.dll"));
        foreach (var a in args) info.ArgumentList.Add(a);
        using var process = Process.Start(info)!;
        var error = process.StandardError.ReadToEndAsync();
        string output = process.StandardOutput.ReadToEnd();
        process.WaitForExit();
        return (process.ExitCode, output, error.Result);
    }
}
