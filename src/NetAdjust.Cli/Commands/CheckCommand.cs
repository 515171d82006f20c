using System.CommandLine;
using NetAdjust.IO.Project;

namespace NetAdjust.Cli.Commands;

/// <summary><c>netadjust check FILE</c>: reads and validates a project without adjusting it.</summary>
internal static class CheckCommand
{
    public static Command Create(CliConsole console)
    {
        var file = new Argument<string>("FILE") { Description = "The project file (YAML) to validate." };
        var cmd = new Command("check", "Read and validate a project file and its CSV files; adjust nothing.") { file };
        cmd.SetAction(parse => CommandRunner.Guard(console, () =>
        {
            var project = ProjectReader.Read(parse.GetValue(file)!);
            var n = project.Network;
            console.Out.WriteLine($"{parse.GetValue(file)}: valid: {n.Points.Count} points, {n.Observations.Count} observations " +
                                  $"from {project.InputFiles.Count} file(s).");
            return ExitCodes.Success;
        }));
        return cmd;
    }
}
