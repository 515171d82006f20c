using System.CommandLine;
using NetAdjust.IO.Project;

namespace NetAdjust.Cli.Commands;

/// <summary><c>netadjust check FILE</c>: reads and validates a project without adjusting it.</summary>
internal static class CheckCommand
{
    public static Command Create(CliConsole console)
    {
        var file = new Argument<string>("FILE") { Description = "The project file (YAML) to validate." };
        var cmd = new Command("check", "Read and validate a project file and its CSV files, and check the datum " +
            "as adjust does; adjust nothing.") { file };
        cmd.SetAction(parse => CommandRunner.Guard(console, () =>
        {
            var project = ProjectReader.Read(parse.GetValue(file)!);
            NetAdjust.Adjustment.AdjustmentPreflight.Check(project.Network, project.Options); // fails as adjust would
            foreach (var w in project.Warnings) console.Error.WriteLine($"warning: {w}");
            var n = project.Network;
            console.Out.WriteLine(
                $"{parse.GetValue(file)}: valid: {n.Points.Count} points, {n.Observations.Count} observations " +
                                  $"from {project.InputFiles.Count} file(s).");
            // the checks before the adjustment: level loops and lines, traverses (a failing one is a result: exit 0)
            var closures = NetAdjust.Misclosures.MisclosureCheck.Run(n, project.Checks);
            if (!closures.IsEmpty)
            {
                console.Out.WriteLine();
                console.Out.Write(NetAdjust.IO.Results.MisclosureText.Write(closures, n, project.Units));
            }
            return ExitCodes.Success;
        }));
        return cmd;
    }
}
