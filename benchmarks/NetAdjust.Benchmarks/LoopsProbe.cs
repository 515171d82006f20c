using System.Diagnostics;
using System.Globalization;
using NetAdjust.IO.Project;
using NetAdjust.Misclosures;

namespace NetAdjust.Benchmarks;

/// <summary>
/// The GNSS baseline loops of a project, timed in process: <c>-- loops FILE [RUNS]</c> reads the project once, then
/// per run times <see cref="BaselineLoops.Check"/> (wall and CPU time of the whole process; the first run is cold)
/// and prints how many loops were found and how many baselines they hold: a count per loop size and the longest.
/// </summary>
internal static class LoopsProbe
{
    public static void Run(string[] args)
    {
        var inv = CultureInfo.InvariantCulture;
        string path = args.Length > 1 ? args[1] : throw new ArgumentException("usage: loops FILE [RUNS]");
        int runs = args.Length > 2 ? int.Parse(args[2], inv) : 1;
        var project = ProjectReader.Read(path);
        for (int run = 0; run < runs; run++)
        {
            (BaselineLoops.Reductions, BaselineLoops.CoordinatesRead) = (0, 0);
            var cpu0 = Process.GetCurrentProcess().TotalProcessorTime;
            var wall = Stopwatch.StartNew();
            var loops = BaselineLoops.Check(project.Network, 0.95);
            wall.Stop();
            var cpu = Process.GetCurrentProcess().TotalProcessorTime - cpu0;
            var sizes = loops.Select(l => l.Baselines.Count).ToList();
            int[] upTo = [2, 3, 4, 5, 6, 7, 8, 16, 64, int.MaxValue];
            var counts = upTo.Select((u, k) => sizes.Count(s => s <= u && (k == 0 || s > upTo[k - 1]))).ToList();
            string Label(int k) => k == 0 ? "2" : upTo[k] == int.MaxValue ? $">{upTo[k - 1]}"
                : upTo[k] == upTo[k - 1] + 1 ? upTo[k].ToString(inv) : $"{upTo[k - 1] + 1}-{upTo[k]}";
            Console.WriteLine(string.Create(inv, $"run {run + 1}: load average {ReadingProbe.LoadAverage()}; " +
                $"loops wall {wall.Elapsed.TotalSeconds:F3} s CPU {cpu.TotalSeconds:F3} s; {loops.Count} loops, " +
                $"{sizes.Sum()} baselines in all, longest {(sizes.Count > 0 ? sizes.Max() : 0)}; independence test: " +
                $"{BaselineLoops.Reductions} reductions reading {BaselineLoops.CoordinatesRead} coordinates"));
            Console.WriteLine("  baselines per loop: " + string.Join(", ",
                counts.Select((c, k) => string.Create(inv, $"{Label(k)}: {c}"))));
        }
    }
}
