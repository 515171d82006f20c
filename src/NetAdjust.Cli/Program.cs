using System.CommandLine;
using System.CommandLine.Help;
using NetAdjust.Cli.Commands;

namespace NetAdjust.Cli;

/// <summary>Entry point of the <c>netadjust</c> command.</summary>
public static class Program
{
    /// <summary>Runs the command with the process's console.</summary>
    /// <param name="args">Command-line arguments.</param>
    /// <returns>The exit code (see <see cref="ExitCodes"/>).</returns>
    public static int Main(string[] args)
    {
        var stdout = new StreamWriter(Console.OpenStandardOutput(), new System.Text.UTF8Encoding(false)) { AutoFlush =
            true, NewLine = "\n" };
        var stderr = new StreamWriter(Console.OpenStandardError(), new System.Text.UTF8Encoding(false)) { AutoFlush =
            true, NewLine = "\n" };
        return Run(args, new CliConsole(stdout, stderr));
    }

    /// <summary>Runs the command with the given writers.</summary>
    /// <param name="args">Command-line arguments.</param>
    /// <param name="console">Where output and messages go.</param>
    /// <returns>The exit code.</returns>
    public static int Run(string[] args, CliConsole console)
    {
        // A plain command named "netadjust" as the root, so help shows the tool's name however it was started
        // (dotnet run, the packed tool, or a test host); it gets the help and version options a RootCommand has.
        var root = new Command("netadjust",
            "NetAdjust: least-squares adjustment of survey control networks (traverses, horizontal and 3D networks " +
            "with trigonometric heights, level networks).")
        {
            new HelpOption { Recursive = true },
            new VersionOption(),
        };
        root.Subcommands.Add(AdjustCommand.Create(console));
        root.Subcommands.Add(CheckCommand.Create(console));
        root.Subcommands.Add(BudgetCommand.Create(console));
        root.Subcommands.Add(SimulateCommand.Create(console));
        root.Subcommands.Add(PlanCommand.Create(console));
        var parse = root.Parse(args);
        var config = new InvocationConfiguration { Output = console.Out, Error = console.Error,
            EnableDefaultExceptionHandler = false };
        try
        {
            return parse.Invoke(config);
        }
        catch (Exception e)
        {
            console.Error.WriteLine($"netadjust: internal error: {e.Message}");
            console.Error.WriteLine("This is a defect in NetAdjust; please report it with the input that caused it.");
            return ExitCodes.InternalError;
        }
    }
}
