using System.Diagnostics;

namespace NetAdjust.Cli.Tests;

/// <summary>What one run of the command gave: exit code, standard output and standard error.</summary>
/// <param name="Code">The exit code (docs/cli.md).</param>
/// <param name="Out">Everything written to standard output.</param>
/// <param name="Err">Everything written to standard error.</param>
internal readonly record struct CliRun(int Code, string Out, string Err);

/// <summary>
/// The one way the tests run the <c>netadjust</c> command: in this process through <see cref="Program.Run"/>
/// (<see cref="Run"/>), or as a separate process of the built command (<see cref="RunProcess"/>), for the checks
/// that must not share state with the test process, such as the golden outputs.
/// </summary>
internal static class CliHarness
{
    /// <summary>The repository root (the folder that holds NetAdjust.sln), found upwards from the tests.</summary>
    public static string RepoRoot { get; } = FindRepoRoot();

    /// <summary>A file of the repository's demo folder data/.</summary>
    /// <param name="name">The file name, e.g. <c>brackenmoor.yaml</c>.</param>
    public static string DataFile(string name) => Path.Combine(RepoRoot, "data", name);

    /// <summary>Runs the command in this process, capturing its output with "\n" line ends.</summary>
    /// <param name="args">The command line, verb first.</param>
    public static CliRun Run(params string[] args)
    {
        var o = new StringWriter { NewLine = "\n" };
        var e = new StringWriter { NewLine = "\n" };
        int code = Program.Run(args, new CliConsole(o, e));
        return new CliRun(code, o.ToString(), e.ToString());
    }

    /// <summary>
    /// Runs the built command (NetAdjust.Cli.dll beside the test binaries, i.e. the build of the same configuration)
    /// in a child process with the given working folder; or, when the environment variable NETADJUST_COMMAND names an
    /// executable, that program instead (.ci/check-packages runs these tests through the installed native tool).
    /// </summary>
    /// <param name="workingDirectory">The child's current folder (relative paths in the arguments start there).</param>
    /// <param name="args">The command line, verb first.</param>
    public static CliRun RunProcess(string workingDirectory, params string[] args)
    {
        string? command = Environment.GetEnvironmentVariable("NETADJUST_COMMAND");
        ProcessStartInfo psi;
        if (!string.IsNullOrEmpty(command))
        {
            if (!File.Exists(command)) throw new FileNotFoundException("NETADJUST_COMMAND names no file", command);
            psi = new ProcessStartInfo(Path.GetFullPath(command));
        }
        else
        {
            string dll = Path.Combine(AppContext.BaseDirectory, "NetAdjust.Cli.dll");
            if (!File.Exists(dll)) throw new FileNotFoundException("the built command is not beside the tests", dll);
            psi = new ProcessStartInfo(DotnetHost());
            psi.ArgumentList.Add(dll);
        }
        psi.WorkingDirectory = workingDirectory;
        psi.RedirectStandardOutput = true;
        psi.RedirectStandardError = true;
        psi.UseShellExecute = false;
        foreach (var a in args) psi.ArgumentList.Add(a);
        using var p = Process.Start(psi) ?? throw new InvalidOperationException("the command could not be started");
        var stdout = p.StandardOutput.ReadToEndAsync();
        var stderr = p.StandardError.ReadToEndAsync();
        if (!p.WaitForExit(TimeSpan.FromMinutes(5)))
        {
            p.Kill(entireProcessTree: true);
            throw new TimeoutException("the command did not finish within 5 minutes: " + string.Join(' ', args));
        }
        return new CliRun(p.ExitCode, stdout.Result, stderr.Result);
    }

    private static string DotnetHost()
    {
        // The host that runs the tests (set by the dotnet CLI), else the current process when it is dotnet, else PATH.
        string? host = Environment.GetEnvironmentVariable("DOTNET_HOST_PATH");
        if (!string.IsNullOrEmpty(host) && File.Exists(host)) return host;
        string? self = Environment.ProcessPath;
        if (self is not null && Path.GetFileNameWithoutExtension(self) == "dotnet") return self;
        return "dotnet";
    }

    private static string FindRepoRoot()
    {
        var d = new DirectoryInfo(AppContext.BaseDirectory);
        while (d is not null && !File.Exists(Path.Combine(d.FullName, "NetAdjust.sln"))) d = d.Parent;
        return d?.FullName ?? throw new InvalidOperationException("repository root not found");
    }
}
