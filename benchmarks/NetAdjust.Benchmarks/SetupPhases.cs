using System.Collections;
using System.Diagnostics;
using System.Globalization;
using System.Reflection;
using System.Text;
using NetAdjust.Adjustment;
using NetAdjust.Adjustment.Approximation;
using NetAdjust.Adjustment.Datum;
using NetAdjust.Geometry;
using NetAdjust.IO.Project;
using NetAdjust.Misclosures;

namespace NetAdjust.Benchmarks;

/// <summary>
/// The work before the first Gauss-Newton iteration, timed in process: <c>-- setup FILE [RUNS] [DUMP]</c> reads the
/// project once, then per run times the checks before the adjustment (<see cref="MisclosureCheck.Run"/>) and the
/// datum plan with its approximate coordinates and coordinate checks (<c>DatumPlan.Create</c>,
/// <c>CoordinateCheck.CheckTolerance</c>), printing wall and CPU time (user + system, whole process) of each; the
/// first run is cold (JIT included). With DUMP, writes what they computed (every double as its bits) to that file,
/// so that two builds can be compared with <c>cmp</c>.
/// </summary>
internal static class SetupPhases
{
    public static void Run(string[] args)
    {
        var inv = CultureInfo.InvariantCulture;
        string path = args.Length > 1 ? args[1] : throw new ArgumentException("usage: setup FILE [RUNS] [DUMP]");
        int runs = args.Length > 2 ? int.Parse(args[2], inv) : 1;
        string? dump = args.Length > 3 ? args[3] : null;
        var project = ProjectReader.Read(path);
        var options = project.Options ?? AdjustmentOptions.Default;
        MisclosureReport? report = null;
        DatumPlan? plan = null;
        for (int run = 0; run < runs; run++)
        {
            var cpu0 = Process.GetCurrentProcess().TotalProcessorTime;
            var wall = Stopwatch.StartNew();
            report = MisclosureCheck.Run(project.Network, project.Checks);
            var cpu1 = Process.GetCurrentProcess().TotalProcessorTime;
            double w1 = wall.Elapsed.TotalSeconds;
            plan = DatumPlan.Create(project.Network, options.Datum);
            CoordinateCheck.CheckTolerance(plan.State, project.Network, options.LengthTolerance);
            var cpu2 = Process.GetCurrentProcess().TotalProcessorTime;
            double w2 = wall.Elapsed.TotalSeconds;
            Console.WriteLine(string.Create(inv, $"run {run + 1} ({(run == 0 ? "cold" : "warm")}): load average " +
                $"{ReadingProbe.LoadAverage()}; misclosures wall {w1,7:F3} s CPU {(cpu1 - cpu0).TotalSeconds,7:F3} s;" +
                $" datum plan wall {w2 - w1,7:F3} s CPU {(cpu2 - cpu1).TotalSeconds,7:F3} s"));
        }
        if (dump is null || report is null || plan is null) return;
        var sb = new StringBuilder();
        Dump(sb, "misclosures", report, 0);
        var state = plan.State;
        foreach (var p in project.Network.Points)
            foreach (var par in new[] { Parameter.E, Parameter.N, Parameter.H })
                if (state.TryGet(p.Id, par, out double v))
                    sb.Append(inv, $"{p.Id} {par} {BitConverter.DoubleToInt64Bits(v):X16}\n");
        foreach (var u in plan.Index.Unknowns)
            sb.Append(inv, $"unknown {u.Owner} {u.Parameter} {BitConverter.DoubleToInt64Bits(state.Get(u)):X16}\n");
        sb.Append(inv, $"conditions {plan.ConditionCount}; {plan.Describe()}\n");
        File.WriteAllText(dump, sb.ToString());
    }

    private static void Dump(StringBuilder sb, string name, object? value, int depth)
    {
        sb.Append(' ', 2 * depth).Append(name).Append(": ");
        switch (value)
        {
            case null: sb.Append("null\n"); return;
            case double d: sb.Append(BitConverter.DoubleToInt64Bits(d).ToString("X16", CultureInfo.InvariantCulture))
                .Append('\n'); return;
            case string s: sb.Append(s).Append('\n'); return;
            case IFormattable f when value.GetType().IsPrimitive || value.GetType().IsEnum:
                sb.Append(f.ToString(null, CultureInfo.InvariantCulture)).Append('\n'); return;
            case bool b: sb.Append(b).Append('\n'); return;
            case IEnumerable e:
                sb.Append('\n');
                int k = 0;
                foreach (var item in e) Dump(sb, $"[{k++}]", item, depth + 1);
                return;
        }
        sb.Append(value.GetType().Name).Append('\n');
        foreach (var field in value.GetType().GetFields(BindingFlags.Instance | BindingFlags.Public |
            BindingFlags.NonPublic).OrderBy(f => f.Name, StringComparer.Ordinal))
            Dump(sb, field.Name, field.GetValue(value), depth + 1);
    }
}
