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
    /// or from a text); every error names <paramref name="file"/>, the line and the item. A large file whose lines can
    /// be split (<see cref="CsvLines.SplitOff"/>) is read in two halves on two cores, with the same rows in the same
    /// order and the same first problem of the file as read in one.</summary>
    public static List<Observation> Read(CsvLines lines, string file, LengthPattern lengths, AnglePattern angles,
        ProjectUnits units,
        IReadOnlyDictionary<ObservationKind, double> defaults, LevelBudget? levelBudget = null,
        CsvSpecifications? specs = null, IReadOnlyCollection<string>? pointIds = null)
    {
        // a row per line at most (the lines of the whole file, before a split): the list is not grown row by row
        var reader = new RowReader(new Settings(file, lengths, angles, units, defaults, levelBudget, specs),
            new CsvRow(pointIds), lines.EstimateLines());
        using var second = lines.SplitOff();
        if (second is null) reader.Read(lines);
        else if (!reader.ReadHeader(lines)) reader.Read(second); // no header in the first half: the rest after it
        else
        {
            // the second half on another core, with the header of the first and its own row, caches and lists
            var other = reader.Twin();
            var task = Task.Factory.StartNew(() => other.Read(second), CancellationToken.None,
                TaskCreationOptions.LongRunning, TaskScheduler.Default);
            try { reader.Read(lines); }
            catch
            {
                // the first half's problem comes first in the file: the second half stops and its own is dropped
                other.Stop();
                try { task.Wait(); }
                catch (AggregateException) { }
                throw;
            }
            task.GetAwaiter().GetResult();
            reader.Append(other);
        }
        return reader.Finish();
    }

    /// <summary>What every row of a file is read with.</summary>
    private sealed record Settings(string File, LengthPattern Lengths, AnglePattern Angles, ProjectUnits Units,
        IReadOnlyDictionary<ObservationKind, double> Defaults, LevelBudget? LevelBudget, CsvSpecifications? Specs);

    /// <summary>Reads the rows of one file, or of one half of it: the header's columns, the rows read so far and the
    /// caches of the rows before (kind, set id, standard deviation, point ids).</summary>
    private sealed partial class RowReader
    {
        private readonly Settings _s;
        private readonly CsvRow row;
        private List<Observation>? _rows;
        private readonly int _capacity;
        private readonly List<(SlopeDistanceObservation Slope, int Line, string Item)> _slopes = [];
        private Dictionary<string, int>? col;
        private int cKind = -1, cAt = -1, cFrom = -1, cTo = -1, cValue = -1, cSd = -1, cSet = -1;
        private int[] optional = [];
        private readonly Func<string, string> get;
        private readonly SdCache sdCache = new();
        private string? lastSetAt, lastSet, lastSetId;
        private ObservationKind lastKind;
        private string? lastKindName;
        private volatile bool _stopped;

        /// <param name="settings">What the rows are read with.</param>
        /// <param name="csvRow">The row split from line to line (its shared point ids).</param>
        /// <param name="capacity">The rows expected (0: as the lines read estimate).</param>
        public RowReader(Settings settings, CsvRow csvRow, int capacity)
        {
            (_s, row, _capacity) = (settings, csvRow, capacity);
            if (capacity > 0) _rows = new List<Observation>(capacity);
            get = Get;
        }

        /// <summary>A reader of the same file's other half: the header's columns, its own row and caches.</summary>
        public RowReader Twin() => new(_s, row.Twin(), 0)
            { col = col, cKind = cKind, cAt = cAt, cFrom = cFrom, cTo = cTo, cValue = cValue, cSd = cSd, cSet = cSet,
                optional = optional, _baselinePlaces = _baselinePlaces };

        /// <summary>Stops <see cref="Read"/> at its next line (its rows are then not used).</summary>
        public void Stop() => _stopped = true;

        private string Get(string name) => col!.TryGetValue(name, out int k) ? row.Field(k) : "";

        /// <summary>Reads lines up to the header; false when they end before it.</summary>
        public bool ReadHeader(CsvLines lines)
        {
            while (col is null)
            {
                if (!lines.Next()) return false;
                Line(lines);
            }
            return true;
        }

        /// <summary>Reads the rest of the lines (the header first when it has not been read).</summary>
        public void Read(CsvLines lines)
        {
            _rows ??= new List<Observation>(lines.EstimateLines());
            while (!_stopped && lines.Next()) Line(lines); // lines end at CR LF, CR or LF alike
        }

        /// <summary>Adds the rows of the half after this one.</summary>
        public void Append(RowReader after)
        {
            _rows!.AddRange(after._rows!);
            _slopes.AddRange(after._slopes);
        }

        /// <summary>The rows, once the slope distances are checked against the zenith angles of the whole file.
        /// </summary>
        public List<Observation> Finish()
        {
            _rows ??= [];
            CheckSlopesHaveZeniths(_rows, _slopes, _s.Specs, _s.File);
            return _rows;
        }

        private void Line(CsvLines lines)
        {
            int lineNo = lines.LineNumber;
            var line = lines.Buffer.AsSpan(lines.LineStart, lines.LineEnd - lines.LineStart);
            if (line.Trim().Length == 0 || line.TrimStart().StartsWith('#')) return;
            string file = _s.File;
            row.Split(lines.Buffer, lines.LineStart, lines.LineEnd, file, lineNo);
            if (col is null) Header(lineNo);
            else Row(lineNo);
        }

        private void Header(int lineNo)
        {
            string file = _s.File;
            string[] f = row.All();
            var columns = new Dictionary<string, int>(StringComparer.Ordinal);
            for (int k = 0; k < f.Length; k++)
            {
                if (!Columns.Contains(f[k]))
                    throw new ProjectFileException(file, lineNo, "header",
                        $"unknown column '{f[k]}' (expected some of: {string.Join(", ", Columns)})");
                if (!columns.TryAdd(f[k], k))
                    throw new ProjectFileException(file, lineNo, "header", $"column '{f[k]}' appears twice");
            }
            foreach (var need in new[] { "kind", "value" })
                if (!columns.ContainsKey(need) && !(need == "value" && columns.ContainsKey("dx")))
                    throw new ProjectFileException(file, lineNo, "header", $"the header has no '{need}' column");
            int C(string name) => columns.GetValueOrDefault(name, -1);
            (cKind, cAt, cFrom, cTo, cValue, cSd, cSet) =
                (C("kind"), C("at"), C("from"), C("to"), C("value"), C("sd"), C("set"));
            optional = columns.Where(c => !BasicColumns.Contains(c.Key)).Select(c => c.Value).ToArray();
            col = columns;
        }

        private void Row(int lineNo)
        {
            var (file, lengths, angles, units, defaults, levelBudget, specs) = _s;
            var rows = _rows!;
            if (row.Count != col!.Count)
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
                BaselineRow(Need("from", from), Need("to", to), file, lineNo, rows);
                return;
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
            if (o is SlopeDistanceObservation sdo) _slopes.Add((sdo, lineNo, Item()));
            // marks: none in a plain row (ObservationMarks.Apply returns the row as it is for empty marks)
            if (!plain) o = ObservationMarks.Apply(o, Get("exclude"), Get("sd_factor"), file, lineNo, Item());
            rows.Add(o);
        }
    }

    /// <summary>Reads a length of a row's field (slope distances, heights); the error names the row.</summary>
    private static Func<string, Length> LengthReader(LengthPattern lengths, string file, int line, string item) =>
        v =>
        {
            var r = lengths.Parse(v);
            return r.Success ? r.Value : throw new ProjectFileException(file, line, item, r.Error!);
        };
}
