using System.Diagnostics;
using System.Globalization;
using NetAdjust.Adjustment;
using NetAdjust.IO.Project;
using NetAdjust.IO.Results;
using NetAdjust.Statistics;

namespace NetAdjust.Benchmarks;

/// <summary>
/// The phases of <c>netadjust adjust FILE --json OUT --report OUT.txt</c> (default statistics), timed in process:
/// <c>-- command FILE [RUNS]</c> runs the same library calls as the command, in its order (read, misclosures,
/// adjustment, statistics analysis, report model, JSON and text report side by side; the outputs go to a null
/// stream), and prints the wall and CPU time (user + system, of the whole process) of each phase, for the first run
/// (cold: JIT included) and for each further run (warm).
/// </summary>
internal static class CommandPhases
{
    public static void Run(string[] args)
    {
        var inv = CultureInfo.InvariantCulture;
        string path = args.Length > 1 ? args[1] : throw new ArgumentException("usage: command FILE [RUNS]");
        int runs = args.Length > 2 ? int.Parse(args[2], inv) : 1;
        for (int run = 0; run < runs; run++)
        {
            var clock = new PhaseClock();
            var project = ProjectReader.Read(path);
            clock.Lap("read");
            var context = Context(path, project);
            clock.Lap("misclosures");
            var result = Adjuster.Adjust(project.Network, project.Options);
            clock.Lap("adjustment");
            _ = result.Analysis;
            clock.Lap("statistics analysis");
            var model = ResultReport.Build(result, context);
            clock.Lap("report model");
            // the command renders its files side by side, one per core
            Parallel.Invoke(new ParallelOptions { MaxDegreeOfParallelism = Environment.ProcessorCount },
                () => JsonResultWriter.Write(Stream.Null, model),
                () => { using var w = new StreamWriter(Stream.Null); TextReportWriter.Write(w, model); });
            clock.Lap("JSON and text report");
            Console.WriteLine(string.Create(inv, $"run {run + 1} ({(run == 0 ? "cold" : "warm")}): " +
                $"{project.Network.Points.Count} points, {project.Network.Observations.Count} observations; " +
                $"load average {ReadingProbe.LoadAverage()}; peak working set " +
                $"{Process.GetCurrentProcess().PeakWorkingSet64 / 1048576} MiB"));
            clock.Print();
        }
    }

    /// <summary>
    /// The writers one at a time: <c>-- writers FILE [RUNS]</c> reads and adjusts the project once, then builds the
    /// report model and renders the JSON and the text report, each alone, to a null stream, and the JSON to a file,
    /// and prints the wall and CPU time (user + system, of the whole process) of each, for every run (the first
    /// includes the JIT).
    /// </summary>
    public static void Writers(string[] args)
    {
        var inv = CultureInfo.InvariantCulture;
        string path = args.Length > 1 ? args[1] : throw new ArgumentException("usage: writers FILE [RUNS]");
        int runs = args.Length > 2 ? int.Parse(args[2], inv) : 3;
        var project = ProjectReader.Read(path);
        var context = Context(path, project);
        var result = Adjuster.Adjust(project.Network, project.Options);
        _ = result.Analysis;
        for (int run = 0; run < runs; run++)
        {
            var clock = new PhaseClock();
            var model = ResultReport.Build(result, context);
            clock.Lap("report model");
            JsonResultWriter.Write(Stream.Null, model);
            clock.Lap("JSON");
            using (var w = new StreamWriter(Stream.Null)) TextReportWriter.Write(w, model);
            clock.Lap("text report");
            string json = Path.Combine(Path.GetTempPath(), "writers-probe.json");
            using (var f = new FileStream(json, FileMode.Create, FileAccess.Write, FileShare.None, 1 << 16))
                JsonResultWriter.Write(f, model);
            clock.Lap("JSON to a file");
            File.Delete(json);
            Console.WriteLine(string.Create(inv, $"run {run + 1}: load average {ReadingProbe.LoadAverage()}; " +
                $"peak working set {Process.GetCurrentProcess().PeakWorkingSet64 / 1048576} MiB"));
            clock.Print();
        }
    }

    /// <summary>The report context of the command's run: the run date of the benchmarks, the misclosures checked.
    /// </summary>
    private static ReportContext Context(string path, SurveyProject project) =>
        new(path, new DateOnly(2026, 12, 1), project.Units)
        {
            Misclosures = NetAdjust.Misclosures.MisclosureCheck.Run(project.Network, project.Checks),
        };
}
