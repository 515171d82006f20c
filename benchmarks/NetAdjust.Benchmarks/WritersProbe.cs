using System.Diagnostics;
using System.Globalization;
using NetAdjust.Adjustment;
using NetAdjust.IO.Project;
using NetAdjust.IO.Results;
using NetAdjust.Statistics;

namespace NetAdjust.Benchmarks;

/// <summary>
/// The writers of <c>netadjust adjust</c> one at a time, in process: <c>-- writers FILE [RUNS]</c> reads and adjusts
/// the project once, then builds the report model and renders the JSON and the text report, each alone, to a null
/// stream, and prints the wall and CPU time (user + system, of the whole process) of each, for every run (the first
/// includes the JIT).
/// </summary>
internal static class WritersProbe
{
    public static void Run(string[] args)
    {
        var inv = CultureInfo.InvariantCulture;
        string path = args.Length > 1 ? args[1] : throw new ArgumentException("usage: writers FILE [RUNS]");
        int runs = args.Length > 2 ? int.Parse(args[2], inv) : 3;
        var project = ProjectReader.Read(path);
        var context = new ReportContext(path, new DateOnly(2026, 12, 1), project.Units)
        {
            Misclosures = NetAdjust.Misclosures.MisclosureCheck.Run(project.Network, project.Checks),
        };
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
}
