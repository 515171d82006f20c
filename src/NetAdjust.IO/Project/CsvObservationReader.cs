using NetAdjust.Network;
using NetAdjust.Units;

namespace NetAdjust.IO.Project;

/// <summary>
/// Reads bulk observations from a CSV file named in a project. The first non-comment line is a header naming
/// the columns (any order): <c>kind</c> and <c>value</c> are required; <c>at</c>, <c>from</c>, <c>to</c>,
/// <c>sd</c>, <c>length</c>, <c>set</c> as the kinds need them. Lines starting with <c>#</c> and blank lines
/// are skipped. Fields are separated by commas and are not quoted (ids cannot hold commas). Slope distances and
/// zenith angles, and weighting from an instrument, are in CsvObservationReader.Trigonometric.cs.
/// </summary>
internal static partial class CsvObservationReader
{
    private static readonly string[] Columns =
        ["kind", "at", "from", "to", "value", "sd", "length", "set", "level", "setups", "runs", "exclude", "sd_factor",
            .. TotalStationColumns];

    private static readonly Dictionary<string, ObservationKind> KindByName =
        ObservationKinds.All.ToDictionary(k => k.Name(), StringComparer.Ordinal);

    /// <summary>Weighting of a height difference from a named level: (level id, section length, setups, runs) →
    /// weighting; throws <see cref="InvalidInputException"/>.</summary>
    internal delegate ObservationWeighting LevelBudget(string level, Length? length, int? setups, int? runs);

    public static List<Observation> Read(string text, string file, LengthPattern lengths, AnglePattern angles,
        ProjectUnits units,
        IReadOnlyDictionary<ObservationKind, double> defaults, LevelBudget? levelBudget = null,
        CsvSpecifications? specs = null)
    {
        var result = new List<Observation>();
        var slopes = new List<(SlopeDistanceObservation Slope, int Line, string Item)>();
        string[] lines = text.Split(["\r\n", "\r", "\n"], StringSplitOptions.None); // CR, LF and CRLF alike
        Dictionary<string, int>? col = null;
        for (int i = 0; i < lines.Length; i++)
        {
            int lineNo = i + 1;
            string line = lines[i].TrimEnd('\r');
            if (line.Trim().Length == 0 || line.TrimStart().StartsWith('#')) continue;
            string[] f = CsvLimits.Fields(line, file, lineNo);
            if (col is null)
            {
                col = new Dictionary<string, int>(StringComparer.Ordinal);
                for (int k = 0; k < f.Length; k++)
                {
                    if (!Columns.Contains(f[k]))
                        throw new ProjectFileException(file, lineNo, "header",
                            $"unknown column '{f[k]}' (expected some of: {string.Join(", ", Columns)})");
                    if (!col.TryAdd(f[k], k))
                        throw new ProjectFileException(file, lineNo, "header", $"column '{f[k]}' appears twice");
                }
                foreach (var need in new[] { "kind", "value" })
                    if (!col.ContainsKey(need))
                        throw new ProjectFileException(file, lineNo, "header", $"the header has no '{need}' column");
                continue;
            }
            if (f.Length != col.Count)
                throw new ProjectFileException(file, lineNo, "",
                    $"expected {col.Count} fields as in the header, found {f.Length}");
            string Get(string name) => col.TryGetValue(name, out int k) ? f[k] : "";
            string kindText = Get("kind");
            var kind = (KindByName.TryGetValue(kindText, out var named) ? named : (ObservationKind?)null)
                ?? throw new ProjectFileException(file, lineNo, kindText,
                    $"unknown observation kind (expected one of: " +
                    $"{string.Join(", ", ObservationKinds.All.Select(k => k.Name()))})");
            string at = Get("at"), from = Get("from"), to = Get("to"), value = Get("value");
            string Need(string name, string v) =>
                v.Length > 0 ? v : throw new ProjectFileException(file, lineNo, kindText,
                $"the '{name}' field is empty");
            string item = kind switch
            {
                ObservationKind.Angle => $"angle at {at} from {from} to {to}",
                ObservationKind.Direction => $"direction {at}→{to}",
                _ => $"{kind.Name().Replace('_', ' ')} {from}→{to}",
            };
            double sd;
            string sdText = Get("sd");
            ObservationWeighting? budget = null;
            string levelText = Get("level");
            if (kind != ObservationKind.HeightDifference &&
                (levelText.Length > 0 || Get("setups").Length > 0 || Get("runs").Length > 0))
                throw new ProjectFileException(file, lineNo, item,
                    "the 'level', 'setups' and 'runs' fields are for height differences only");
            if (sdText.Length == 0 && levelText.Length > 0)
            {
                int? Count(string name, int max)
                {
                    string t = Get(name);
                    if (t.Length == 0) return null;
                    return int.TryParse(t, System.Globalization.NumberStyles.None,
                        System.Globalization.CultureInfo.InvariantCulture, out int n) && n >= 1 && n <= max
                        ? n : throw new ProjectFileException(file, lineNo, item,
                            $"'{name}' must be a whole number from 1 to {max}");
                }
                Length? len = null;
                if (Get("length").Length > 0)
                {
                    var lr = lengths.Parse(Get("length"));
                    len = lr.Success ? lr.Value : throw new ProjectFileException(file, lineNo, item, lr.Error!);
                }
                try { budget = (levelBudget ??
                    throw new InvalidInputException($"level '{levelText}' is not defined under 'levels'"))(levelText,
                    len, Count("setups", 100000), Count("runs", 100)); }
                catch (InvalidInputException e)
                    when (e is not ProjectFileException) { throw new ProjectFileException(file, lineNo, item,
                        e.Message); }
                sd = double.NaN; // derived from the level by the stochastic model
            }
            else if (sdText.Length == 0 && Get("instrument").Length > 0)
            {
                budget = InstrumentWeighting(kind, Get, specs, file, lineNo, item);
                sd = double.NaN; // derived from the instrument by the stochastic model
            }
            else if (sdText.Length > 0)
            {
                sd = ProjectReader.ParseSd(sdText, kind, units, out string? err);
                if (err is not null) throw new ProjectFileException(file, lineNo, item, err);
            }
            else if (!defaults.TryGetValue(kind, out sd))
                throw new ProjectFileException(file, lineNo, item,
                    $"no standard deviation: fill the 'sd' column or give default_sd.{kind.Name()} in the project " +
                    $"file");
            Angle A() { var r = angles.Parse(value); return r.Success ? r.Value : throw new ProjectFileException(file,
                lineNo, item, r.Error!); }
            Length L(string v) { var r =
                lengths.Parse(v); return r.Success ? r.Value : throw new ProjectFileException(file, lineNo, item,
                r.Error!); }
            string source = $"{file}:{lineNo}";
            CheckTotalStationFields(kind, Get, file, lineNo, item);
            Observation o = ProjectReader.GuardedRow(file, lineNo, item, () => kind switch
            {
                ObservationKind.Distance =>
                    new DistanceObservation(Need("from", from), Need("to", to),
                    L(Need("value", value))) { StandardDeviation = sd, Source = source },
                ObservationKind.Azimuth =>
                    new AzimuthObservation(Need("from", from), Need("to", to), A()) { StandardDeviation = sd,
                    Source = source },
                ObservationKind.Angle =>
                    new AngleObservation(Need("at", at), Need("from", from), Need("to", to),
                    A()) { StandardDeviation = sd, Source = source },
                ObservationKind.Direction => new DirectionObservation(Need("at", at), Need("to", to), A(),
                    $"{Need("at", at)}/{file}#{(Get("set").Length > 0 ? Get("set") : "1")}") { StandardDeviation = sd,
                        Source = source },
                ObservationKind.HeightDifference => new HeightDifferenceObservation(Need("from", from), Need("to", to),
                    L(Need("value", value)), Get("length").Length > 0 ? L(Get("length")) : null)
                { StandardDeviation = sd, Source = source },
                ObservationKind.SlopeDistance or ObservationKind.Zenith =>
                    Trigonometric(kind, Need("from", from), Need("to", to), value, Get, L, angles, specs, file, lineNo,
                        item) with { StandardDeviation = sd, Source = source },
                _ => throw new ProjectFileException(file, lineNo, item, $"a {kind.Name().Replace('_', ' ')} is not " +
                    "read from CSV: write it in the project file"),
            });
            if (o is SlopeDistanceObservation sdo) slopes.Add((sdo, lineNo, item));
            result.Add(ObservationMarks.Apply(o with { Weighting = budget ?? o.Weighting, BookedText = value },
                Get("exclude"), Get("sd_factor"), file, lineNo, item));
        }
        CheckSlopesHaveZeniths(result, slopes, specs, file);
        return result;
    }
}
