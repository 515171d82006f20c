using System.CommandLine;
using System.Globalization;
using NetAdjust.Simulation;
using NetAdjust.IO;
using NetAdjust.IO.Project;
using NetAdjust.IO.Text;

namespace NetAdjust.Cli.Commands;

/// <summary>
/// <c>netadjust simulate --points N [--kind plane|levels] [--seed S] --out FILE.yaml</c>: writes a seeded synthetic
/// network (project file and CSV observations) so that anyone can reproduce the performance figures;
/// <c>netadjust simulate --scenario NAME [--seed S] --out FILE.yaml</c> draws a demo project of data/ anew.
/// </summary>
internal static class SimulateCommand
{
    public static Command Create(CliConsole console)
    {
        var points = new Option<int?>("--points")
        {
            Description = "Number of points (at least 3); not with --scenario.",
        };
        var kind = new Option<string>("--kind")
        {
            Description = "plane (directions and distances) or levels (height differences).",
            DefaultValueFactory = _ => "plane",
        };
        var scenario = new Option<string?>("--scenario")
        {
            Description = "Draw a demo project of data/ instead: " + OptionGrammars.DemoScenarios.Legal + ".",
            HelpName = "NAME",
        };
        var seed = new Option<int>("--seed")
        {
            Description = "Random seed; the same seed gives the same network (default 1, or the scenario's own seed).",
            DefaultValueFactory = _ => 1,
        };
        var neighbours = new Option<int>("--neighbours") { Description = "Nearest neighbours each point is joined to.",
            DefaultValueFactory = _ => 6 };
        var output = new Option<string>("--out") { Description =
            "The project file to write (YAML); the CSV file is written beside it.", Required = true };
        var cmd = new Command("simulate",
            "Write a synthetic network (seeded, reproducible) as a project file and CSV observations.")
            { points, kind, scenario, seed, neighbours, output };
        cmd.SetAction(parse => CommandRunner.Guard(console, () =>
        {
            string path = parse.GetValue(output)!;
            SafeFileWriter.CheckPlan([path], []); // an empty or unusable path: exit 4, not an internal error
            if (parse.GetValue(scenario) is string name)
            {
                var clash = parse.Tokens.Select(t => t.Value)
                    .FirstOrDefault(t => t is "--points" or "--kind" or "--neighbours");
                if (clash is not null) throw new InvalidInputException($"--scenario cannot be combined with {clash}");
                var which = CliChoice.Parse(name, "--scenario", OptionGrammars.DemoScenarios);
                bool seedGiven = parse.GetResult(seed) is { Implicit: false };
                int s = seedGiven ? parse.GetValue(seed) : DemoScenarios.DefaultSeed(which);
                var survey = DemoProjectWriter.Draw(which, s);
                string dir = Path.GetDirectoryName(Path.GetFullPath(path))!;
                var files = DemoProjectWriter.Format(survey, Path.GetFileNameWithoutExtension(path))
                    .Select(f => (Path.Combine(dir, f.Name), f.Text)).ToList();
                SafeFileWriter.WriteAll(files);
                console.Out.WriteLine(string.Create(CultureInfo.InvariantCulture,
                    $"{path}: demo scenario {name} drawn with seed {survey.Seed} ({files.Count} file(s))."));
                return ExitCodes.Success;
            }
            if (parse.GetValue(points) is not int n)
                throw new InvalidInputException("--points is required (or give --scenario)");
            string k = parse.GetValue(kind)!;
            var networkKind = CliChoice.Parse(k, "--kind", OptionGrammars.SyntheticKinds);
            int nb = parse.GetValue(neighbours);
            if (n < 3) throw new InvalidInputException($"--points must be at least 3, not {n}");
            if (nb < 2 || nb >= n)
                throw new InvalidInputException(
                    $"--neighbours must be at least 2 and below the number of points, not {nb}");
            var spec = new SyntheticNetworkSpec(networkKind, n, parse.GetValue(seed)) { Neighbours = nb };
            var network = SyntheticNetworks.Create(spec);
            ProjectFileWriter.Write(network, path, string.Create(CultureInfo.InvariantCulture,
                $"Synthetic network written by: netadjust simulate --kind {k} --points {n} --seed {spec.Seed} " +
                    $"--neighbours {nb}"));
            console.Out.WriteLine(string.Create(CultureInfo.InvariantCulture,
                $"{path}: {network.Points.Count} points, {network.Observations.Count} observations (seed " +
                    $"{spec.Seed})."));
            return ExitCodes.Success;
        }));
        return cmd;
    }
}
