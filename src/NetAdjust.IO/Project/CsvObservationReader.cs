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
            .. TotalStationColumns, .. BaselineColumns];

    /// <summary>The columns a plain row fills: the others (marks, level and instrument fields) are empty in it.
    /// </summary>
    private static readonly string[] BasicColumns = ["kind", "at", "from", "to", "value", "sd", "length", "set"];

    private static readonly Dictionary<string, ObservationKind> KindByName =
        ObservationKinds.All.ToDictionary(k => k.Name(), StringComparer.Ordinal);

    private static readonly Dictionary<string, ObservationKind>.AlternateLookup<ReadOnlySpan<char>> KindOfChars =
        KindByName.GetAlternateLookup<ReadOnlySpan<char>>();

    /// <summary>Weighting of a height difference from a named level: (level id, section length, setups, runs) →
    /// weighting; throws <see cref="InvalidInputException"/>.</summary>
    internal delegate ObservationWeighting LevelBudget(string level, Length? length, int? setups, int? runs);

    /// <summary>Reads the rows of a CSV text in memory (see the overload for <see cref="CsvLines"/>).</summary>
    public static List<Observation> Read(string text, string file, LengthPattern lengths, AnglePattern angles,
        ProjectUnits units,
        IReadOnlyDictionary<ObservationKind, double> defaults, LevelBudget? levelBudget = null,
        CsvSpecifications? specs = null, IReadOnlyCollection<string>? pointIds = null)
    {
        using var lines = CsvLines.OfText(text);
        return Read(lines, file, lengths, angles, units, defaults, levelBudget, specs, pointIds);
    }

    /// <summary>Reads the rows of a CSV file line by line (<paramref name="lines"/>: from its bytes a piece at a time,
    /// or from a text); every error names <paramref name="file"/>, the line and the item.</summary>
    public static List<Observation> Read(CsvLines lines, string file, LengthPattern lengths, AnglePattern angles,
        ProjectUnits units,
        IReadOnlyDictionary<ObservationKind, double> defaults, LevelBudget? levelBudget = null,
        CsvSpecifications? specs = null, IReadOnlyCollection<string>? pointIds = null)
    {
        // a row per line at most: the list is not grown row by row (about once for a file read in pieces)
        var result = new List<Observation>(lines.EstimateLines());
        var slopes = new List<(SlopeDistanceObservation Slope, int Line, string Item)>();
        // The row's fields as ranges of the line's buffer; each becomes a string only when asked (CsvRow): a row of
        // the usual kinds with no marks or instrument fields makes strings only for its point ids (shared) and its
        // source.
        var row = new CsvRow(pointIds);
        Dictionary<string, int>? col = null;
        int cKind = -1, cAt = -1, cFrom = -1, cTo = -1, cValue = -1, cSd = -1, cSet = -1;
        int[] optional = [];
        string Get(string name) => col!.TryGetValue(name, out int k) ? row.Field(k) : "";
        Func<string, string> get = Get;
        var sdCache = new SdCache();
        string? lastSetAt = null, lastSet = null, lastSetId = null;
        ObservationKind lastKind = default;
        string? lastKindName = null;
        int lineNo;
        while (lines.Next()) // lines end at CR LF, CR or LF alike
        {
            lineNo = lines.LineNumber;
            var line = lines.Buffer.AsSpan(lines.LineStart, lines.LineEnd - lines.LineStart);
            if (line.Trim().Length == 0 || line.TrimStart().StartsWith('#')) continue;
            row.Split(lines.Buffer, lines.LineStart, lines.LineEnd, file, lineNo);
            if (col is null)
            {
                string[] f = row.All();
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
                    if (!col.ContainsKey(need) && !(need == "value" && col.ContainsKey("dx")))
                        throw new ProjectFileException(file, lineNo, "header", $"the header has no '{need}' column");
                int C(string name) => col.GetValueOrDefault(name, -1);
                (cKind, cAt, cFrom, cTo, cValue, cSd, cSet) =
                    (C("kind"), C("at"), C("from"), C("to"), C("value"), C("sd"), C("set"));
                optional = col.Where(c => !BasicColumns.Contains(c.Key)).Select(c => c.Value).ToArray();
                continue;
            }
            if (row.Count != col.Count)
                throw new ProjectFileException(file, lineNo, "",
                    $"expected {col.Count} fields as in the header, found {row.Count}");
            // the kind of the row before, or looked up by name
            var kind = (lastKindName is not null && row.Chars(cKind).SequenceEqual(lastKindName) ? lastKind
                : KindOfChars.TryGetValue(row.Chars(cKind), out var named) ? named : (ObservationKind?)null)
                ?? throw new ProjectFileException(file, lineNo, row.Field(cKind),
                    $"unknown observation kind (expected one of: " +
                    $"{string.Join(", ", ObservationKinds.All.Select(k => k.Name()))})");
            (lastKind, lastKindName) = (kind, kind.Name());
            string at = row.Id(cAt), from = row.Id(cFrom), to = row.Id(cTo);
            string Need(string name, string v) =>
                v.Length > 0 ? v : throw new ProjectFileException(file, lineNo, row.Field(cKind),
                $"the '{name}' field is empty");
            // the item named in messages, made only for a message or a row that needs it
            string? itemText = null;
            string Item() => itemText ??= kind switch
            {
                ObservationKind.Angle => $"angle at {at} from {from} to {to}",
                ObservationKind.Direction => $"direction {at}→{to}",
                _ => $"{kind.Name().Replace('_', ' ')} {from}→{to}",
            };
            if (kind == ObservationKind.Baseline)
            {
                result.AddRange(BaselineRow(Need("from", from), Need("to", to), get, file, lineNo, Item()));
                continue;
            }
            // the columns beyond kind, points, value, sd, length and set: all empty in a plain row
            bool plain = true;
            foreach (int k in optional) plain &= row.IsEmpty(k);
            if (!plain) CheckNoBaselineFields(get, file, lineNo, Item());
            double sd;
            ObservationWeighting? budget = null;
            string levelText = plain ? "" : Get("level");
            if (!plain && kind != ObservationKind.HeightDifference &&
                (levelText.Length > 0 || Get("setups").Length > 0 || Get("runs").Length > 0))
                throw new ProjectFileException(file, lineNo, Item(),
                    "the 'level', 'setups' and 'runs' fields are for height differences only");
            if (row.IsEmpty(cSd) && levelText.Length > 0)
            {
                string item = Item();
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
            else if (row.IsEmpty(cSd) && !plain && Get("instrument").Length > 0)
            {
                budget = InstrumentWeighting(kind, get, specs, file, lineNo, Item());
                sd = double.NaN; // derived from the instrument by the stochastic model
            }
            else if (!row.IsEmpty(cSd))
            {
                sd = sdCache.Parse(row, cSd, kind, units, out string? err);
                if (err is not null) throw new ProjectFileException(file, lineNo, Item(), err);
            }
            else if (!defaults.TryGetValue(kind, out sd))
                throw new ProjectFileException(file, lineNo, Item(),
                    $"no standard deviation: fill the 'sd' column or give default_sd.{kind.Name()} in the project " +
                    $"file");
            Angle A()
            {
                if (row.TryNumber(cValue, out double v))
                    switch (angles.Style) // a plain number: as AnglePattern.Parse reads it
                    {
                        case AngleFormat.Degrees: return Angle.FromDegrees(v);
                        case AngleFormat.Gons: return Angle.FromGons(v);
                    }
                var r = angles.Parse(row.Field(cValue));
                return r.Success ? r.Value : throw new ProjectFileException(file, lineNo, Item(), r.Error!);
            }
            Length L(string v) { var r =
                lengths.Parse(v); return r.Success ? r.Value : throw new ProjectFileException(file, lineNo, Item(),
                r.Error!); }
            Length LValue()
            {
                if (row.IsEmpty(cValue)) _ = Need("value", "");
                return row.TryNumber(cValue, out double v) ? Length.From(v, lengths.Unit) // as Parse reads it
                    : L(row.Field(cValue));
            }
            string SetId()
            {
                // the directions of a set follow one another: their set id is made once
                bool same = ReferenceEquals(at, lastSetAt) && (row.IsEmpty(cSet) ? lastSet == "1"
                    : row.FieldEquals(cSet, lastSet));
                if (!same)
                {
                    string set = row.IsEmpty(cSet) ? "1" : row.Field(cSet);
                    (lastSetAt, lastSet, lastSetId) = (at, set, $"{at}/{file}#{set}");
                }
                return lastSetId!;
            }
            // the row's place, file:line, kept as the two (its text is made when asked)
            var source = SourceText.At(file, lineNo);
            // the value's text as booked (for the blunder diagnosis): a plain decimal kept as its digits
            var booked = BookedValueText.Of(row.Chars(cValue));
            if (!plain) CheckTotalStationFields(kind, get, file, lineNo, Item());
            Observation o;
            try
            {
                o = kind switch
                {
                    ObservationKind.Distance =>
                        new DistanceObservation(Need("from", from), Need("to", to), LValue())
                        { StandardDeviation = sd, SourcePlace = source, Weighting = budget, BookedForm = booked },
                    ObservationKind.Azimuth =>
                        new AzimuthObservation(Need("from", from), Need("to", to), A()) { StandardDeviation = sd,
                        SourcePlace = source, Weighting = budget, BookedForm = booked },
                    ObservationKind.Angle =>
                        new AngleObservation(Need("at", at), Need("from", from), Need("to", to),
                        A()) { StandardDeviation = sd, SourcePlace = source, Weighting = budget, BookedForm = booked },
                    ObservationKind.Direction => new DirectionObservation(Need("at", at), Need("to", to), A(),
                        SetId())
                    { StandardDeviation = sd, SourcePlace = source, Weighting = budget, BookedForm = booked },
                    ObservationKind.HeightDifference => new HeightDifferenceObservation(Need("from", from),
                        Need("to", to), LValue(),
                        Get("length").Length > 0 ? L(Get("length")) : null)
                    { StandardDeviation = sd, SourcePlace = source, Weighting = budget, BookedForm = booked },
                    ObservationKind.SlopeDistance or ObservationKind.Zenith =>
                        Trigonometric(kind, Need("from", from), Need("to", to), row.Field(cValue), get,
                            LengthReader(lengths, file, lineNo, Item()), angles, specs, file, lineNo, Item())
                            is var t ? t with
                            { StandardDeviation = sd, SourcePlace = source, Weighting = budget ?? t.Weighting,
                                BookedForm = booked } : t,
                    _ => throw new ProjectFileException(file, lineNo, Item(), $"a {kind.Name().Replace('_', ' ')} " +
                        "is not read from CSV: write it in the project file"),
                };
            }
            catch (ArgumentException e)
            {
                throw new ProjectFileException(file, lineNo, Item(), ProjectReader.GuardProblem(e));
            }
            if (o is SlopeDistanceObservation sdo) slopes.Add((sdo, lineNo, Item()));
            // marks: none in a plain row (ObservationMarks.Apply returns the row as it is for empty marks)
            if (!plain) o = ObservationMarks.Apply(o, Get("exclude"), Get("sd_factor"), file, lineNo, Item());
            result.Add(o);
        }
        CheckSlopesHaveZeniths(result, slopes, specs, file);
        return result;
    }

    /// <summary>Reads a length of a row's field (slope distances, heights); the error names the row.</summary>
    private static Func<string, Length> LengthReader(LengthPattern lengths, string file, int line, string item) =>
        v =>
        {
            var r = lengths.Parse(v);
            return r.Success ? r.Value : throw new ProjectFileException(file, line, item, r.Error!);
        };
}
