using System.CommandLine;
using System.Globalization;
using NetAdjust.Adjustment;
using NetAdjust.IO.Project;
using NetAdjust.IO.Results;
using NetAdjust.IO;
using NetAdjust.Procedures;

namespace NetAdjust.Cli.Commands;

/// <summary><c>netadjust adjust FILE [--json PATH] [--report PATH] [--date YYYY-MM-DD]</c>.</summary>
internal static class AdjustCommand
{
    public static Command Create(CliConsole console)
    {
        var file = new Argument<string>("FILE") { Description = "The project file (YAML)." };
        var json = new Option<string?>("--json") { Description = "Write the result as JSON to this path.", HelpName =
            "PATH" };
        var report = new Option<string?>("--report") { Description =
            "Write the text report to this path instead of standard output.", HelpName = "PATH" };
        var date = new Option<string?>("--date")
        {
            Description =
                "The run date stated in the outputs (YYYY-MM-DD); default: today (UTC). Fix it for byte-identical " +
                "reports.",
            HelpName = "YYYY-MM-DD",
        };
        var sequence = new Option<bool>("--sequence")
        {
            Description =
                "Adjust twice: minimally constrained (the observations alone), then with all control; test whether " +
                "the control fits.",
        };
        var solution = new Option<string?>("--exchange-solution")
        {
            Description = "With --sequence: the solution the HTML report, plot, CSV, LandXML and GeoJSON hold: " +
                          "constrained (default) or minimal (the minimally-constrained one). Each says which it holds.",
            HelpName = "constrained|minimal",
        };
        solution.AcceptOnlyFromAmong("constrained", "minimal");
        var budgets = new Option<bool>("--budgets") { Description =
            "List each observation's error budget in the text report (the summary per group is always shown)." };
        var quiet = new Option<bool>("--quiet") { Description =
            "Print no progress on standard error (progress is shown only for runs longer than a second)." };
        var stats = new StatisticsCliOptions();
        var diagnosis = new DiagnosisCliOptions();
        var exchange = ExchangeOutputs.Create();
        var cmd = new Command("adjust",
            "Adjust a project by least squares and report coordinates, residuals and the global test.")
        {
            file, json, report, date, budgets, sequence, solution, quiet,
        };
        stats.AddTo(cmd);
        diagnosis.AddTo(cmd);
        exchange.AddTo(cmd);
        cmd.SetAction(parse => CommandRunner.Guard(console, () =>
        {
            string path = parse.GetValue(file)!;
            if (parse.GetValue(solution) is not null && !parse.GetValue(sequence))
                throw new InvalidInputException("--exchange-solution applies only with --sequence");
            string? jsonPath = parse.GetValue(json), reportPath = parse.GetValue(report);
            var runDate = ParseDate(parse.GetValue(date));
            var project = ProjectReader.Read(path);
            SafeFileWriter.CheckPlan(new[] { jsonPath, reportPath }.OfType<string>().Concat(exchange.Paths(parse)),
                project.InputFiles);

            if (!parse.GetValue(quiet))
                project = project with { Options = project.Options with { Progress =
                    new ProgressPrinter(console.Error) } };
            foreach (var w in project.Warnings) console.Error.WriteLine($"warning: {w}");
            // Grid and ground (docs/methods.md): the observations are reduced to the grid before the adjustment. A
            // network the grid leaves as it is (GNSS baselines, height differences) takes its factors at the positions
            // of its ordinary adjustment once it is made: the preliminary adjustment would be that adjustment again.
            var factorsAfter = project.Grid is { } system && !parse.GetValue(sequence) && stats.AdjustsOnce(parse) &&
                GridReduction.LeavesAsIs(project.Network, system) ? system : null;
            var reduction = project.Grid is { } grid && factorsAfter is null
                ? GridReduction.Reduce(project.Network, grid, project.Options) : null;
            if (reduction is not null) project = project with { Network = reduction.Network };
            // The misclosure check needs only the network: it runs beside the adjustment (on another core) and is
            // joined before anything reads it; its result does not depend on the order.
            var (network, checks) = (project.Network, project.Checks);
            var misclosureCheck = Task.Run(() => NetAdjust.Misclosures.MisclosureCheck.Run(network, checks));
            NetAdjust.Misclosures.MisclosureReport Misclosures() => misclosureCheck.GetAwaiter().GetResult();
            var context0 = new ReportContext(path, runDate, project.Units)
            {
                ObservationBudgets = parse.GetValue(budgets), Crs = project.Crs, Grid = reduction,
                GnssFrame = project.GnssFrame,
                Warnings = project.Warnings,
                Particulars = project.Particulars, Rounds = project.Rounds,
                PlaneHeight = project.Network.Observations.Any(o => o is NetAdjust.Network.ZenithObservation
                        or NetAdjust.Network.SlopeDistanceObservation)
                    ? project.PlaneHeight : null,
                PlaneHeightBasis = project.PlaneHeightBasis,
            };
            Action<TextWriter> text;
            AdjustmentResult result;
            ReportContext context;
            ResultReport? model = null;
            // all outputs or none: a failed write must not leave the others replaced; each is written as it is
            // rendered, straight to its temporary file
            var files = new List<(string, Action<Stream>)>();
            if (parse.GetValue(sequence))
            {
                // The sequence runs two plain adjustments; the blunder hunt, robust and component options do not apply
                // to it.
                var clash = parse.Tokens.Select(t => t.Value).FirstOrDefault(t =>
                    t is "--snoop" or "--robust" or "--components" || DiagnosisCliOptions.Names.Contains(t));
                if (clash is not null)
                    throw new InvalidInputException($"--sequence cannot be combined with {clash}: run them separately");
                var seq = AdjustmentSequence.Run(project.Network, project.Options);
                (result, context) = (seq.Constrained, context0 with { Misclosures = Misclosures() });
                text = w => SequenceReportWriter.Write(w, seq, context);
                model = ResultReport.Build(seq, context, minimal: parse.GetValue(solution) == "minimal");
                if (jsonPath is not null) files.Add((jsonPath, s => SequenceJsonWriter.Write(s, seq, context)));
            }
            else
            {
                (result, context) = stats.Run(parse, project, context0);
                if (factorsAfter is not null)
                    context = context with { Grid = GridReduction.ReduceAt(project.Network, factorsAfter, result) };
                context = context with { Misclosures = Misclosures() };
                context = diagnosis.Run(parse, project, result, context);
                if (project.Standards.Count > 0)
                    context = context with { Standards = NetAdjust.Standards.StandardsCheck.Apply(result,
                        project.Standards, context.Misclosures) };
                Progress(project, "preparing the report");
                var single = model = ResultReport.Build(result, context);
                text = w => TextReportWriter.Write(w, single);
                if (jsonPath is not null) files.Add((jsonPath, s => JsonResultWriter.Write(s, single)));
            }
            // One report model for every output of a result (for the sequence: the chosen solution's).
            files.AddRange(exchange.Render(parse, model ?? ResultReport.Build(result, context)));
            if (reportPath is not null)
                files.Add((reportPath, s => { using var w = ExchangeOutputs.Utf8(s); text(w); }));
            // The writers only read the report model, so they render side by side, one file per core; the progress
            // names them all first, in the files' order, whatever the thread schedule.
            foreach (var (filePath, _) in files) Progress(project, "writing " + filePath);
            SafeFileWriter.WriteAll(files, Environment.ProcessorCount);
            if (reportPath is null)
            {
                Progress(project, "writing the report to standard output");
                text(console.Out);
                console.Out.Flush();
            }
            return ExitCodes.Success;
        }));
        return cmd;
    }

    /// <summary>Reports a phase of the run to the progress printer, when progress is shown.</summary>
    private static void Progress(SurveyProject project, string phase) =>
        project.Options.Progress?.Report(new AdjustmentProgress(phase, null));

    internal static DateOnly ParseDate(string? text)
    {
        if (text is null) return DateOnly.FromDateTime(DateTime.UtcNow);
        return DateOnly.TryParseExact(text, "yyyy-MM-dd", CultureInfo.InvariantCulture, DateTimeStyles.None, out var d)
            ? d : throw new InvalidInputException($"--date '{text}' is not a date in the form YYYY-MM-DD");
    }
}
