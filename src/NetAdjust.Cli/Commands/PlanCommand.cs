using System.CommandLine;
using System.Globalization;
using System.Text;
using NetAdjust.IO;
using NetAdjust.IO.Project;
using NetAdjust.IO.Results;
using NetAdjust.Procedures;
using NetAdjust.Standards;

namespace NetAdjust.Cli.Commands;

/// <summary>
/// <c>netadjust plan FILE</c>: design of a network before the field. The plan (observations without values) is
/// adjusted without measurements; the report gives the expected precision, reliability and the accuracy standards;
/// <c>--sets-up-to N</c> recommends a procedure, <c>--simulate OUT.yaml</c> draws a ready-to-adjust project.
/// </summary>
internal static class PlanCommand
{
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    /// <summary>The line that heads every plan report's warnings.</summary>
    internal const string PlanNote = "this is a plan: the observations have no measured values (each takes its " +
        "value at the design coordinates), so residuals are zero and the global test says nothing; the standard " +
        "deviations, ellipses, redundancy numbers and MDBs are the ones expected";

    public static Command Create(CliConsole console)
    {
        var file = new Argument<string>("FILE") { Description = "The plan (YAML): a project whose observations " +
            "may leave out 'value' and 'dh', and whose points carry design coordinates." };
        var json = new Option<string?>("--json") { Description = "Write the result as JSON to this file." };
        var report = new Option<string?>("--report") { Description = "Write the text report to this file." };
        var html = new Option<string?>("--html") { Description = "Write the report as one HTML file." };
        var date = new Option<string?>("--date") { Description = "The run date shown (YYYY-MM-DD); default today." };
        var sets = new Option<int?>("--sets-up-to")
        {
            Description = "Recommend a procedure: try 1..N sets (with each total station of the project's " +
                "instruments) against the standard, and print the worst ratio per number of sets.",
            HelpName = "N",
        };
        var standard = new Option<string?>("--standard")
        {
            Description = "The standard for --sets-up-to: a name among the project's standards or the built-in " +
                "ones; default the project's first standard.",
            HelpName = "NAME",
        };
        var simulate = new Option<string?>("--simulate")
        {
            Description = "Draw observations from the plan's stochastic model (its design coordinates as the " +
                "truth) and write them as a project file (and its CSV beside it), ready to adjust.",
            HelpName = "OUT.yaml",
        };
        var seed = new Option<int>("--seed") { Description = "Random seed of --simulate (default 1).",
            DefaultValueFactory = _ => 1 };
        var cmd = new Command("plan", "Design a network before the field: adjust a plan without measurements and " +
            "report the expected precision, reliability and accuracy standards.")
        {
            file, json, report, html, date, sets, standard, simulate, seed,
        };
        cmd.SetAction(parse => CommandRunner.Guard(console, () =>
        {
            string path = parse.GetValue(file)!;
            string? jsonPath = parse.GetValue(json), reportPath = parse.GetValue(report),
                htmlPath = parse.GetValue(html), simPath = parse.GetValue(simulate);
            var runDate = AdjustCommand.ParseDate(parse.GetValue(date));
            var project = ProjectReader.ReadPlan(path);
            SafeFileWriter.CheckPlan(new[] { jsonPath, reportPath, htmlPath, simPath }.OfType<string>(),
                project.InputFiles);
            int? maxSets = parse.GetValue(sets);
            if (maxSets is < 1 or > 100)
                throw new InvalidInputException($"--sets-up-to must be from 1 to 100, not {maxSets}");
            AccuracyStandard? chosen = null;
            if (maxSets is not null || parse.GetValue(standard) is not null)
                chosen = Choose(project, parse.GetValue(standard));

            var result = NetworkDesign.Analyse(project.Network, project.Options);
            var context = new ReportContext(path, runDate, project.Units)
            {
                Crs = project.Crs, Particulars = project.Particulars, Warnings = [PlanNote, .. project.Warnings],
            };
            if (project.Standards.Count > 0)
                context = context with { Standards = StandardsCheck.Apply(result, project.Standards) };
            var model = ResultReport.Build(result, context);
            var text = new StringBuilder(TextReportWriter.Write(model));
            if (maxSets is int n)
                text.Append('\n').Append(RecommendationText(ProcedureAdvisor.Recommend(project.Network,
                    project.Options, chosen!, n, project.Instruments)));
            var files = new List<(string, string)>();
            if (jsonPath is not null) files.Add((jsonPath, JsonResultWriter.Write(model)));
            if (htmlPath is not null) files.Add((htmlPath, HtmlReportWriter.Write(model)));
            if (reportPath is not null) files.Add((reportPath, text.ToString()));
            if (simPath is not null)
            {
                var drawn = NetworkDesign.Simulate(project.Network, parse.GetValue(seed), project.Options);
                string dir = Path.GetDirectoryName(Path.GetFullPath(simPath))!;
                string csvName = Path.GetFileNameWithoutExtension(simPath) + "-observations.csv";
                var (yaml, csv) = ProjectFileWriter.Format(drawn, csvName, string.Create(Inv,
                    $"Observations drawn from the plan {Path.GetFileName(path)} by: netadjust plan --simulate " +
                    $"--seed {parse.GetValue(seed)}"));
                files.Add((Path.Combine(dir, csvName), csv));
                files.Add((simPath, yaml));
            }
            SafeFileWriter.WriteAll(files);
            if (reportPath is null) console.Out.Write(text.ToString());
            return ExitCodes.Success;
        }));
        return cmd;
    }

    private static AccuracyStandard Choose(SurveyProject project, string? name)
    {
        if (name is null)
            return project.Standards.Count > 0 ? project.Standards[0]
                : throw new InvalidInputException("--sets-up-to needs a standard: list one under 'standards' in " +
                    "the plan or name one with --standard");
        return project.Standards.FirstOrDefault(s => s.Name == name) ?? AccuracyStandards.Find(name)
            ?? throw new InvalidInputException($"--standard: '{name}' is neither among the plan's standards nor " +
                $"a built-in one ({string.Join(", ", AccuracyStandards.BuiltIn.Select(s => s.Name))})");
    }

    /// <summary>The recommendation as a text table: worst ratio per number of sets, per instrument.</summary>
    internal static string RecommendationText(ProcedureRecommendation r)
    {
        var sb = new StringBuilder();
        sb.Append($"PROCEDURE RECOMMENDATION (standard {r.Standard.Name}; worst ratio value/allowance, <= 1 meets " +
            "it)\n");
        sb.Append("  Sets").Append(string.Concat(r.Instruments.Select(i => " " + Clip(i.Instrument, 14).PadLeft(14))))
            .Append('\n');
        int rows = r.Instruments.Max(i => i.Trials.Count);
        for (int k = 0; k < rows; k++)
        {
            sb.Append(string.Create(Inv, $"  {k + 1,4}"));
            foreach (var i in r.Instruments)
            {
                var t = i.Trials[k];
                string cell = double.IsFinite(t.WorstRatio) ? t.WorstRatio.ToString("F3", Inv) : "-";
                sb.Append(' ').Append(cell.PadLeft(14));
            }
            sb.Append('\n');
        }
        foreach (var i in r.Instruments)
            sb.Append($"  {i.Instrument}: ").Append(i.SmallestSets is int s
                ? string.Create(Inv, $"meets it with {s} set(s)") : "does not meet it with the sets tried")
                .Append('\n');
        sb.Append(r.Recommended is InstrumentTrials best
            ? string.Create(Inv, $"  Recommended: {best.Instrument} with {best.SmallestSets} set(s).\n")
            : "  Recommended: none of the instruments meets the standard with the sets tried.\n");
        sb.Append("  ").Append(StandardsReport.Caution).Append('\n');
        return sb.ToString();
    }

    private static string Clip(string s, int w) => s.Length <= w ? s : s[..(w - 1)] + "~";
}
