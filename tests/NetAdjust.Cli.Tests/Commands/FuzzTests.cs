using System.Diagnostics;
using System.Globalization;
using System.Security.Cryptography;
using System.Text.RegularExpressions;
using FsCheck;
using FsCheck.Fluent;

namespace NetAdjust.Cli.Tests.Commands;

/// <summary>
/// Property-based fuzzing of the whole command on mutated demo files (lines deleted, duplicated, swapped or inserted,
/// characters flipped, numbers made extreme, ids changed): every run ends with a documented exit code other than 70,
/// prints no stack trace, names file and line for invalid input, finishes within a time limit and leaves the input
/// unchanged. The normal suite runs <see cref="DefaultCases"/> cases; set NETADJUST_FUZZ_CASES for a longer run
/// (DEVELOPERS.md).
/// </summary>
public sealed class FuzzTests : IDisposable
{
    private const int DefaultCases = 300;

    /// <summary>Generous: a demo adjusts in well under a second; a hang shows as tens of seconds.</summary>
    private static readonly TimeSpan TimeLimit = TimeSpan.FromSeconds(30);

    private static readonly string[] Projects = ["brackenmoor.yaml", "brackenmoor-auto.yaml",
        "harrowfield-blunder.yaml", "harrowgate-control.yaml", "corvan-fell-3d.yaml", "skelmoor-gnss.yaml"];

    private static readonly string[] Extremes =
        ["1e308", "-1e308", "1e-300", "0", "-0", "NaN", ".inf", "1e999", "99999999999", "-1", "0.0000001", "1e30",
            "7-99-99", ""];

    private static readonly string[] Ids = ["ZZ99", "bk01", "", "S1 S2", "BK01", "S1", "BMK1", "T1", "\u0391\u0392",
        "#", "x: y"];

    private static readonly string[] Lines =
        ["---", ":", "&a [*a]", "points: []", "  - {id: X}", "    exclude: true", "files: [brackenmoor.yaml]",
         "datum: {mode: free}", "datum: {mode: minimal, hold: S1}", "  - {to: S1, value: 0-00-00, exclude: true}",
         "adjustment: {tolerance: 1e-12}", "\t"];

    private static readonly char[] Chars =
        [':', '{', '}', '[', ']', '-', '#', '\t', '"', '\'', ',', ' ', 'x', '0', '9', '.', '*', '&', '!', '|', '>', '%',
            '@', '\u00e9', '\r', '\n', '\0'];

    private readonly string _tmp = Directory.CreateTempSubdirectory("netadjust-fuzz-").FullName;

    public void Dispose() => Directory.Delete(_tmp, recursive: true);

    /// <summary>One mutation: what to do and three free numbers that pick lines, positions and replacements.</summary>
    public sealed record Op(int Kind, int A, int B, int C);

    /// <summary>A fuzz case: which project, whether its CSV or the project file is mutated, the mutations, the
    /// extra option.</summary>
    public sealed record Case(int Project, bool Csv, Op[] Ops, int Extra);

    private static Gen<Case> Cases =>
        from project in Gen.Choose(0, Projects.Length - 1)
        from csv in Gen.Frequency((1, Gen.Constant(true)), (4, Gen.Constant(false)))
        from ops in Gen.ArrayOf(from k in Gen.Choose(0, 6) from a in Gen.Choose(0, 100_000)
                                from b in Gen.Choose(0, 100_000)
                                from c in Gen.Choose(0, 100_000) select new Op(k, a, b, c))
                       .Where(a => a.Length is >= 1 and <= 3)
        from extra in Gen.Choose(0, 9)
        select new Case(project, csv, ops, extra);

    [Fact]
    public void MutatedDemoFilesAreRefusedCleanlyOrAdjusted()
    {
        int n = int.TryParse(Environment.GetEnvironmentVariable("NETADJUST_FUZZ_CASES"), NumberStyles.None,
            CultureInfo.InvariantCulture, out int v)
            ? v : DefaultCases;
        Prop.ForAll(Arb.From(Cases), c => Holds(c)).Check(Config.QuickThrowOnFailure.WithMaxTest(n));
    }

    private bool Holds(Case c)
    {
        string dir = Path.Combine(_tmp, Guid.NewGuid().ToString("N")[..8]);
        string outDir = Path.Combine(dir, "out");
        Directory.CreateDirectory(outDir);
        string data = Path.Combine(CliHarness.RepoRoot, "data");
        foreach (var f in Projects.Append("brackenmoor-levels.csv")) File.Copy(Path.Combine(data, f),
            Path.Combine(dir, f));
        string project = Path.Combine(dir, Projects[c.Project]);
        string target = c.Csv ? Path.Combine(dir, "brackenmoor-levels.csv") : project;
        string text = File.ReadAllText(target);
        foreach (var op in c.Ops) text = Apply(text, op);
        File.WriteAllText(target, text);
        var before = Snapshot(dir);

        string[] extra = c.Extra switch
        {
            0 => ["--snoop"], 1 => ["--sequence"], 2 => ["--components"], 4 => ["--robust", "huber"],
            5 => ["--snoop", "--diagnose"], _ => [],
        };
        var watch = Stopwatch.StartNew();
        var (code, _, err) = CliHarness.Run(
            [c.Extra == 3 ? "check" : "adjust", project, .. c.Extra == 3 ? [] : (string[])["--quiet", "--date",
                "2026-12-01",
                "--json", Path.Combine(outDir, "r.json"), "--csv", Path.Combine(outDir, "p.csv"), .. extra]]);
        watch.Stop();

        string why = "";
        if (code is not (0 or 1 or 2 or 3 or 4)) why = $"exit {code} is not documented";
        else if (err.Contains("   at ", StringComparison.Ordinal) || err.Contains("internal error",
            StringComparison.Ordinal)) why = "stack trace or internal error";
        else if (code == 2 && !Regex.IsMatch(err, @"[\w.-]+\.(yaml|csv):\d+")) why = "exit 2 without file and line";
        else if (watch.Elapsed > TimeLimit) why = $"took {watch.Elapsed.TotalSeconds:F1} s";
        else if (!before.SequenceEqual(Snapshot(dir))) why = "an input file changed";
        if (why.Length > 0)
        {
            string keep = Path.Combine(Path.GetTempPath(), "netadjust-fuzz-failure-" + Path.GetFileName(target));
            File.WriteAllText(keep, text);
            throw new InvalidOperationException($"{why} (mutated {Path.GetFileName(target)} kept at {keep}; exit " +
                $"{code}): {err}");
        }
        Directory.Delete(dir, recursive: true);
        return true;
    }

    private static string Apply(string text, Op op)
    {
        var lines = text.Split('\n').ToList();
        int n = lines.Count;
        switch (op.Kind)
        {
            case 0: lines.RemoveAt(op.A % n); break;
            case 1: lines.Insert(op.A % n, lines[op.A % n]); break;
            case 2: (lines[op.A % n], lines[op.B % n]) = (lines[op.B % n], lines[op.A % n]); break;
            case 3:
                if (text.Length == 0) return text;
                int at = op.A % text.Length;
                return text[..at] + Chars[op.B % Chars.Length] + text[(at + 1)..];
            case 4:
                var numbers = Regex.Matches(text, @"-?\d+(\.\d+)?");
                if (numbers.Count == 0) return text;
                var m = numbers[op.A % numbers.Count];
                return text[..m.Index] + Extremes[op.B % Extremes.Length] + text[(m.Index + m.Length)..];
            case 5:
                var ids = Regex.Matches(text, @"\b(BK\d\d|BMK\d|HV\d\d|S\d|T\d|[A-Z]{2}\d\d)\b");
                if (ids.Count == 0) return text;
                var id = ids[op.A % ids.Count];
                return text[..id.Index] + Ids[op.B % Ids.Length] + text[(id.Index + id.Length)..];
            default: lines.Insert(op.A % (n + 1), Lines[op.B % Lines.Length]); break;
        }
        return string.Join('\n', lines);
    }

    /// <summary>Name and SHA-256 of every file under <paramref name="folder"/> except outputs, in name order.</summary>
    internal static List<string> Snapshot(string folder) =>
        Directory.GetFiles(folder).Order(StringComparer.Ordinal)
            .Select(f => Path.GetFileName(f) + " "
                + Convert.ToHexString(SHA256.HashData(File.ReadAllBytes(f)))).ToList();
}
