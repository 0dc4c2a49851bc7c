using System.Diagnostics;
using GlobalFit.Cli.Tests.Support;

namespace GlobalFit.Cli.Tests.Commands;

/// <summary>Drives the built <c>globalfit</c> program as a separate process, as a user's shell would.</summary>
public class ProcessTests
{
    private static (int Code, string Out, string Error) Start(params string[] args)
    {
        string program = Path.Combine(AppContext.BaseDirectory, "globalfit.dll");
        var info = new ProcessStartInfo("dotnet") { RedirectStandardOutput = true, RedirectStandardError = true };
        info.ArgumentList.Add(program);
        foreach (var a in args) info.ArgumentList.Add(a);
        using var process = Process.Start(info)!;
        string output = process.StandardOutput.ReadToEnd();
        string error = process.StandardError.ReadToEnd();
        process.WaitForExit();
        return (process.ExitCode, output, error);
    }

    [Fact]
    public void Help_lists_the_commands()
    {
        var (code, output, _) = Start("--help");
        Assert.Equal(0, code);
        foreach (var command in new[] { "simulate", "inspect", "sensitivity", "demo", "bench" })
            Assert.Contains(command, output);
    }

    [Fact]
    public void Bad_input_exits_with_code_two_and_a_message_on_standard_error()
    {
        using var folder = new TempFolder();
        var (code, output, error) = Start("inspect", folder.File("missing.h5"));
        Assert.Equal(2, code);
        Assert.Equal("", output);
        Assert.Contains("missing.h5", error);
    }

    [Fact]
    public void Redirected_progress_is_plain_lines_without_terminal_codes()
    {
        using var folder = new TempFolder();
        string scenario = folder.Write("s.toml", Scenarios.TwoDays);
        var (code, _, error) = Start("simulate", scenario, "--out", folder.File("d.h5"));
        Assert.Equal(0, code);
        Assert.Contains("simulate: 100%", error);
        Assert.DoesNotContain("\r", error);
        Assert.DoesNotContain("\u001b[", error);
    }
}
