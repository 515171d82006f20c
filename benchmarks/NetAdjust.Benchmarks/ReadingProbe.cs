using System.Diagnostics;
using System.Globalization;
using NetAdjust.IO.Project;
using NetAdjust.Simulation;

namespace NetAdjust.Benchmarks;

/// <summary>
/// Reading speed, in process: <c>-- reading [POINTS] [RUNS]</c> writes a simulated plane network (as <c>netadjust
/// simulate</c> does: project YAML + observation CSV) to a temporary folder, then reads it with the project reader
/// RUNS times (default 5, after one warm-up read) and prints the best and median time and the observation rows per
/// second, and the best process CPU time of a run (user + system, all threads: on a loaded machine the figure to
/// compare). The rows are the CSV's observation lines; the YAML's points are read in the same call.
/// <c>-- reading FILE.yaml [RUNS]</c> reads a given project instead (see <see cref="ReadFile"/>).
/// </summary>
internal static class ReadingProbe
{
    public static void Run(string[] args)
    {
        if (args.Length > 1 && args[1].EndsWith(".yaml", StringComparison.Ordinal)) { ReadFile(args); return; }
        var inv = CultureInfo.InvariantCulture;
        int points = args.Length > 1 ? int.Parse(args[1], inv) : 100_000;
        int runs = args.Length > 2 ? int.Parse(args[2], inv) : 5;
        string dir = Directory.CreateTempSubdirectory("netadjust-reading-").FullName;
        try
        {
            var network = SyntheticNetworks.Create(new SyntheticNetworkSpec(SyntheticNetworkKind.Plane, points));
            string path = Path.Combine(dir, "net.yaml");
            ProjectFileWriter.Write(network, path, "reading probe");
            long bytes = Directory.GetFiles(dir).Sum(f => new FileInfo(f).Length);
            int rows = network.Observations.Count;
            Console.WriteLine(string.Create(inv,
                $"plane network: {points} points, {rows} observation rows, {bytes / 1e6:F1} MB on disk"));
            ProjectReader.Read(path); // warm-up: JIT and file cache
            var times = new List<double>();
            var cpu = new List<double>();
            var pause = new List<double>();
            string gcs = "";
            long projectBytes = 0, csvBytes = 0;
            for (int r = 0; r < runs; r++)
            {
                GC.Collect();
                var cpu0 = Process.GetCurrentProcess().TotalProcessorTime;
                var pause0 = GC.GetTotalPauseDuration();
                int g0 = GC.CollectionCount(0), g1 = GC.CollectionCount(1), g2 = GC.CollectionCount(2);
                long bytes0 = GC.GetTotalAllocatedBytes(precise: true);
                var clock = Stopwatch.StartNew();
                var project = ProjectReader.Read(path);
                times.Add(clock.Elapsed.TotalSeconds);
                projectBytes = GC.GetTotalAllocatedBytes(precise: true) - bytes0;
                cpu.Add((Process.GetCurrentProcess().TotalProcessorTime - cpu0).TotalSeconds);
                pause.Add((GC.GetTotalPauseDuration() - pause0).TotalSeconds);
                gcs = $"{GC.CollectionCount(0) - g0}/{GC.CollectionCount(1) - g1}/{GC.CollectionCount(2) - g2}";
                if (project.Network.Observations.Count != rows) throw new InvalidOperationException("rows lost");
            }
            Report("project reader (YAML + CSV)", times, cpu, rows);
            pause.Sort();
            Console.WriteLine(string.Create(inv,
                $"  of which collector pauses: median {pause[pause.Count / 2]:F3} s; " +
                $"collections (gen 0/1/2) in the last run: {gcs}; " +
                $"allocated {(double)projectBytes / rows:F0} bytes a row"));

            // The CSV observation reader alone, on the text of the file (the part that grows with the rows).
            string csvPath = Directory.GetFiles(dir, "*.csv").Single();
            string csv = File.ReadAllText(csvPath);
            var units = new ProjectUnits(NetAdjust.Units.LengthUnit.Metre, NetAdjust.Units.AngleFormat.Degrees,
                AngleSdUnit.Arcsecond);
            var defaults = new Dictionary<NetAdjust.Network.ObservationKind, double>();
            List<NetAdjust.Network.Observation> ReadCsv() => CsvObservationReader.Read(csv, Path.GetFileName(csvPath),
                new NetAdjust.Units.LengthPattern(units.Length, 4), new NetAdjust.Units.AnglePattern(units.Angle, 4),
                units, defaults);
            ReadCsv();
            times.Clear();
            cpu.Clear();
            for (int r = 0; r < runs; r++)
            {
                GC.Collect();
                var cpu0 = Process.GetCurrentProcess().TotalProcessorTime;
                long bytes0 = GC.GetTotalAllocatedBytes(precise: true);
                var clock = Stopwatch.StartNew();
                if (ReadCsv().Count != rows) throw new InvalidOperationException("rows lost");
                times.Add(clock.Elapsed.TotalSeconds);
                cpu.Add((Process.GetCurrentProcess().TotalProcessorTime - cpu0).TotalSeconds);
                csvBytes = GC.GetTotalAllocatedBytes(precise: true) - bytes0;
            }
            Report("CSV observation reader alone", times, cpu, rows);
            Console.WriteLine(string.Create(inv,
                $"  allocated in the last run: {(double)csvBytes / rows:F0} bytes a row"));
        }
        finally { Directory.Delete(dir, recursive: true); }
    }

    /// <summary><c>-- reading FILE.yaml [RUNS]</c>: reads a project file RUNS times (default 1, no warm-up, so
    /// that a single read of a large project shows its cold cost and its peak memory) and prints each read's time,
    /// its process CPU time, the collector's pauses and the bytes allocated, and the process's peak working set so
    /// far.</summary>
    private static void ReadFile(string[] args)
    {
        var inv = CultureInfo.InvariantCulture;
        int runs = args.Length > 2 ? int.Parse(args[2], inv) : 1;
        for (int r = 0; r < runs; r++)
        {
            GC.Collect();
            var cpu0 = Process.GetCurrentProcess().TotalProcessorTime;
            var pause0 = GC.GetTotalPauseDuration();
            long bytes0 = GC.GetTotalAllocatedBytes();
            int[] gcs0 = [GC.CollectionCount(0), GC.CollectionCount(1), GC.CollectionCount(2)];
            var clock = Stopwatch.StartNew();
            var project = ProjectReader.Read(args[1]);
            double wall = clock.Elapsed.TotalSeconds;
            double pause = (GC.GetTotalPauseDuration() - pause0).TotalSeconds;
            double allocated = (GC.GetTotalAllocatedBytes() - bytes0) / 1e9;
            int[] gcs = [GC.CollectionCount(0) - gcs0[0], GC.CollectionCount(1) - gcs0[1],
                GC.CollectionCount(2) - gcs0[2]];
            double cpu = (Process.GetCurrentProcess().TotalProcessorTime - cpu0).TotalSeconds;
            int rows = project.Network.Observations.Count;
            using var self = Process.GetCurrentProcess();
            Console.WriteLine(string.Create(inv,
                $"{Path.GetFileName(args[1])}: {rows} observations read in {wall:F3} s ({rows / wall:N0} rows/s), " +
                $"CPU {cpu:F3} s; peak working set {self.PeakWorkingSet64 / 1e9:F2} GB; " +
                $"collector paused {pause:F3} s ({gcs[0]}/{gcs[1]}/{gcs[2]} collections of generations 0/1/2), " +
                $"{allocated:F2} GB allocated; load average {LoadAverage()}"));
            GC.KeepAlive(project);
        }
    }

    private static void Report(string what, List<double> times, List<double> cpu, int rows)
    {
        times.Sort();
        double best = times[0], median = times[times.Count / 2], bestCpu = cpu.Min();
        Console.WriteLine(string.Create(CultureInfo.InvariantCulture,
            $"{what}: best {best:F3} s ({rows / best:N0} rows/s), median {median:F3} s " +
            $"({rows / median:N0} rows/s) over {times.Count} runs; best CPU {bestCpu:F3} s " +
            $"({rows / bestCpu:N0} rows/s of CPU); load average {LoadAverage()}"));
    }

    /// <summary>The 1-minute load average of the machine (Linux), or "n/a".</summary>
    internal static string LoadAverage()
    {
        try { return File.ReadAllText("/proc/loadavg").Split(' ')[0]; }
        catch (IOException) { return "n/a"; }
        catch (UnauthorizedAccessException) { return "n/a"; }
    }
}
