using System.CommandLine;
using System.Globalization;
using NetAdjust.Design;
using NetAdjust.IO.Project;

namespace NetAdjust.Cli.Commands;

/// <summary>
/// <c>netadjust simulate --points N [--kind plane|levels] [--seed S] --out FILE.yaml</c>: writes a seeded synthetic
/// network (project file and CSV observations) so that anyone can reproduce the performance figures.
/// </summary>
internal static class SimulateCommand
{
    public static Command Create(CliConsole console)
    {
        var points = new Option<int>("--points") { Description = "Number of points (at least 3).", Required = true };
        var kind = new Option<string>("--kind") { Description = "plane (directions and distances) or levels (height differences).", DefaultValueFactory = _ => "plane" };
        var seed = new Option<int>("--seed") { Description = "Random seed; the same seed gives the same network.", DefaultValueFactory = _ => 1 };
        var neighbours = new Option<int>("--neighbours") { Description = "Nearest neighbours each point is joined to.", DefaultValueFactory = _ => 6 };
        var output = new Option<string>("--out") { Description = "The project file to write (YAML); the CSV file is written beside it.", Required = true };
        var cmd = new Command("simulate", "Write a synthetic network (seeded, reproducible) as a project file and CSV observations.")
            { points, kind, seed, neighbours, output };
        cmd.SetAction(parse => CommandRunner.Guard(console, () =>
        {
            string k = parse.GetValue(kind)!;
            var networkKind = k switch
            {
                "plane" => SyntheticNetworkKind.Plane,
                "levels" => SyntheticNetworkKind.Levels,
                _ => throw new InvalidInputException($"--kind must be 'plane' or 'levels', not '{k}'"),
            };
            int n = parse.GetValue(points);
            int nb = parse.GetValue(neighbours);
            if (n < 3) throw new InvalidInputException($"--points must be at least 3, not {n}");
            if (nb < 2 || nb >= n) throw new InvalidInputException($"--neighbours must be at least 2 and below the number of points, not {nb}");
            var spec = new SyntheticNetworkSpec(networkKind, n, parse.GetValue(seed)) { Neighbours = nb };
            var network = SyntheticNetworks.Create(spec);
            string path = parse.GetValue(output)!;
            NetAdjust.IO.SafeFileWriter.CheckPlan([path],
                []); // an empty or unusable path: exit 4, not an internal error
            ProjectFileWriter.Write(network, path, string.Create(CultureInfo.InvariantCulture,
                $"Synthetic network written by: netadjust simulate --kind {k} --points {n} --seed {spec.Seed} --neighbours {nb}"));
            console.Out.WriteLine(string.Create(CultureInfo.InvariantCulture,
                $"{path}: {network.Points.Count} points, {network.Observations.Count} observations (seed {spec.Seed})."));
            return ExitCodes.Success;
        }));
        return cmd;
    }
}
