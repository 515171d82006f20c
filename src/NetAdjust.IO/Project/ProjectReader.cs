using System.Globalization;
using NetAdjust.Adjustment;
using NetAdjust.IO.Text;
using NetAdjust.Network;
using NetAdjust.Observations;
using NetAdjust.Units;
using YamlDotNet.Core;
using YamlDotNet.RepresentationModel;

namespace NetAdjust.IO.Project;

/// <summary>
/// Reads a NetAdjust project file (YAML, format described in docs/input-format.md) and the CSV observation
/// files it names. Every error names the file, the line and the item concerned.
/// </summary>
public static partial class ProjectReader
{
    private static readonly string[] TopKeys =
        ["project", "units", "adjustment", "default_sd", "points", "setups", "levelling", "files", "instruments",
        "targets", "levels", "statistics", "crs", "datum", "grid",
        "survey", "refraction_groups", "reduction", "checks", "standards", "gnss", "diagnosis"];

    /// <summary>Reads a project file from disk.</summary>
    /// <param name="path">Path of the YAML project file.</param>
    /// <returns>The project.</returns>
    /// <exception cref="ProjectFileException">When a file is missing or invalid.</exception>
    /// <exception cref="InvalidInputException">When the network as a whole is inconsistent.</exception>
    public static SurveyProject Read(string path) => Read(path, InputFileResolver.FileSystem);

    /// <summary>Reads a project file and its CSV files through <paramref name="resolver"/> (the only way files
    /// are opened).</summary>
    /// <param name="path">Path of the YAML project file.</param>
    /// <param name="resolver">Finds and opens the files, e.g. <see cref="InputFileResolver.ConfinedTo"/>.</param>
    /// <returns>The project.</returns>
    /// <exception cref="ProjectFileException">When a file is missing, not allowed or invalid.</exception>
    /// <exception cref="InvalidInputException">When the network as a whole is inconsistent.</exception>
    public static SurveyProject Read(string path, InputFileResolver resolver)
    {
        ArgumentNullException.ThrowIfNull(resolver);
        string full;
        try { full = resolver.Resolve(Directory.GetCurrentDirectory(), path); }
        catch (Exception e)
            when (e is IOException or UnauthorizedAccessException or ArgumentException or NotSupportedException)
        { throw new ProjectFileException(path, 0, "", $"the project file cannot be read ({FirstLine(e.Message)})"); }
        string text = ReadText(resolver, full, path, "the project file");
        return Parse(text, path, Path.GetDirectoryName(full)!, resolver);
    }

    private static SurveyProject Parse(string text, string displayName, string baseDirectory,
        InputFileResolver resolver, bool planned) =>
        Parse(text, displayName, baseDirectory, rel => resolver.Resolve(baseDirectory, rel),
            (full, rel) => OpenCsv(resolver, full, rel), planned);

    /// <summary>Parses project text; the CSV files it names are resolved and opened through <paramref
    /// name="resolver"/>.</summary>
    /// <param name="text">The YAML text.</param>
    /// <param name="displayName">The file name used in messages.</param>
    /// <param name="baseDirectory">The folder that relative CSV paths start from.</param>
    /// <param name="resolver">Finds and opens the CSV files.</param>
    public static SurveyProject Parse(string text, string displayName, string baseDirectory, InputFileResolver resolver)
    {
        ArgumentNullException.ThrowIfNull(resolver);
        return Parse(text, displayName, baseDirectory, rel => resolver.Resolve(baseDirectory, rel),
            (full, rel) => OpenCsv(resolver, full, rel));
    }

    private static string ReadText(InputFileResolver resolver, string full, string shown, string what)
    {
        byte[] bytes;
        try
        {
            using var stream = resolver.Open(full);
            bytes = InputText.ReadBounded(stream, shown, InputLimits.MaxFileBytes);
        }
        catch (Exception e) when (Unreadable(e, shown, what) is { } refusal) { throw refusal; }
        return InputText.Decode(bytes, shown);
    }

    /// <summary>Opens a CSV observation file to be read a piece at a time (its length checked against its limit).
    /// </summary>
    private static CsvLines OpenCsv(InputFileResolver resolver, string full, string shown)
    {
        try
        {
            return CsvLines.OfUtf8(resolver.Open(full), shown, InputLimits.MaxCsvFileBytes,
                reopen: () => resolver.Open(full));
        }
        catch (Exception e) when (Unreadable(e, shown, "the observation file") is { } refusal) { throw refusal; }
    }

    /// <summary>The refusal of a file that cannot be opened or read, naming it (line 0); null for another exception.
    /// </summary>
    private static ProjectFileException? Unreadable(Exception e, string shown, string what) => e switch
    {
        FileNotFoundException or DirectoryNotFoundException =>
            new ProjectFileException(shown, 0, "", $"{what} does not exist"),
        IOException or UnauthorizedAccessException or ArgumentException or NotSupportedException =>
            new ProjectFileException(shown, 0, "", $"{what} cannot be read ({FirstLine(e.Message)})"),
        _ => null,
    };

    /// <summary>Parses project text. CSV files it names are read through <paramref name="readFile"/>.</summary>
    /// <param name="text">The YAML text.</param>
    /// <param name="displayName">The file name used in messages.</param>
    /// <param name="baseDirectory">The folder that relative CSV paths start from.</param>
    /// <param name="readFile">Reads a file given its full path.</param>
    public static SurveyProject Parse(string text, string displayName, string baseDirectory, Func<string,
        string> readFile) =>
        Parse(text, displayName, baseDirectory, rel => Path.GetFullPath(Path.Combine(baseDirectory, rel)), (full, _)
            => CsvLines.OfText(readFile(full)));

    private static SurveyProject Parse(string text, string displayName, string baseDirectory, Func<string,
        string> resolve,
        Func<string, string, CsvLines> openCsv, bool planned = false)
    {
        var ctx = new Context(displayName) { Planned = planned };
        // a points list of one plain entry per line is read from its lines, the rest by the document model
        // (any doubt, and any error, goes to the document model reading the whole text, as without the lines)
        var pointLines = PointLines.Find(text);
        YamlMappingNode root;
        try { root = Load(pointLines?.Blanked ?? text, text, displayName); }
        catch (ProjectFileException) when (pointLines is not null) { (pointLines, root) = (null, Load(text, text,
            displayName)); }
        if (pointLines is not null && !HoldsEmptyPoints(ctx, root, pointLines.KeyLine))
            (pointLines, root) = (null, Load(text, text, displayName));
        ctx.CheckKeys(root, TopKeys, "the project");
        string name = ctx.OptionalString(root, "project") ?? Path.GetFileNameWithoutExtension(displayName);
        var units = ReadUnits(ctx, root);
        var lengths = new LengthPattern(units.Length, 4);
        var angles = new AnglePattern(units.Angle, 4);
        var options = ReadOptions(ctx, root, units);
        options = options with { Analysis = StatisticsSection.Read(root, displayName) };
        options = options with { Datum = ReadDatum(ctx, root) };
        var defaults = ReadDefaults(ctx, root, units);

        var points = pointLines?.Read(displayName, lengths);
        if (pointLines is not null && points is null) // an entry the lines do not take: the model names its problem
            root = Load(text, text, displayName);
        if (points is null)
        {
            points = [];
            if (ctx.Child(root, "points") is YamlNode pts)
                foreach (var node in ctx.Sequence(pts, "points"))
                    points.Add(Guarded(ctx, node, "a point", () => ReadPoint(ctx, node, lengths)));
        }
        InputChecks.Points(points, displayName);

        var specs = ReadSpecifications(ctx, root, units, points);
        specs.Refraction = ReadRefraction(ctx, root);
        ReadRefractionGroups(ctx, root, specs);
        specs.Reduction = ReadReductionSection(ctx, root, units);
        var observations = new List<Observation>();
        var setsPerStation = new Dictionary<string, int>(StringComparer.Ordinal);
        if (ctx.Child(root, "setups") is YamlNode setups)
            foreach (var node in ctx.Sequence(setups, "setups"))
                Guarded(ctx, node, "a setup", () =>
                    ReadSetup(ctx, node, lengths, angles, units, defaults, setsPerStation, observations, specs));
        if (ctx.Child(root, "levelling") is YamlNode lev)
            foreach (var node in ctx.Sequence(lev, "levelling"))
                observations.Add(Guarded(ctx, node, "a levelling section",
                    () => ReadLevelling(ctx, node, lengths, units, defaults, specs)));
        // the grid before the baselines: their components are made with it (and the frame), once
        var (crs, grid) = ReadGrid(ctx, root, lengths, points);
        var gnss = ReadGnss(ctx, root, observations, grid);

        var inputs = new List<string> { Path.GetFullPath(Path.Combine(baseDirectory, Path.GetFileName(displayName))) };
        var listedTwice = new List<string>();
        if (ctx.Child(root, "files") is YamlNode files)
        {
            string[] pointIds = [.. points.Select(p => p.Id)]; // the strings the files' point ids share
            foreach (var node in ctx.Sequence(files, "files"))
            {
                string rel = ctx.Scalar(node, "a CSV file path");
                string full;
                CsvLines csv;
                try { full = resolve(rel); csv = openCsv(full, rel); }
                catch (Exception e)
                    when (e is IOException or UnauthorizedAccessException or ArgumentException or NotSupportedException)
                { throw CannotRead(e); }
                catch (ProjectFileException e) when (e.Line == 0)
                { throw new ProjectFileException(displayName, Line(node), rel, e.Problem); }
                if (inputs.Contains(full)) listedTwice.Add(rel);
                inputs.Add(full);
                // read a piece at a time: a failure of the file on the way (or its growing past its limit) is the
                // file's, as when it is opened; an error of a row names its line
                using (csv)
                {
                    try
                    {
                        var rows = CsvObservationReader.Read(csv, rel, lengths, angles, units, defaults,
                            specs.WeightingOfLevel,
                            CsvSpecifications(specs) with { BaselineGrid = grid, BaselineFrame = gnss.Frame },
                            pointIds);
                        // the first file's list as it is (no copy of its millions of references), later ones added
                        if (observations.Count == 0) observations = rows;
                        else observations.AddRange(rows);
                    }
                    catch (Exception e) when (e is IOException or UnauthorizedAccessException) { throw CannotRead(e); }
                    catch (ProjectFileException e) when (e.Line == 0)
                    { throw new ProjectFileException(displayName, Line(node), rel, e.Problem); }
                }
                ProjectFileException CannotRead(Exception e) => new(displayName, Line(node), rel,
                    $"the observation file cannot be read ({FirstLine(e.Message)})");
            }
        }

        CheckDatumPoints(ctx, root, points);
        int kinds = InputChecks.Observations(observations, displayName);
        if (ctx.Child(root, "adjustment") is YamlMappingNode adj && ctx.Child(adj, "tolerance") is YamlNode tol)
            InputChecks.Tolerance(options.LengthTolerance, points, displayName, Line(tol));
        CheckGridHeights(ctx, root, grid, points, observations);
        FinishBaselines(ctx, gnss, grid, observations, InputChecks.Holds(kinds, ObservationKind.Baseline));
        var (planeHeight, planeBasis) = ReadPlaneHeight(ctx, root, units, points, grid);
        if (InputChecks.Holds(kinds, ObservationKind.SlopeDistance) || InputChecks.Holds(kinds, ObservationKind.Zenith))
            ApplyPlaneHeight(observations, planeHeight);
        var network = new SurveyNetwork(name, points, observations);
        if (planned) network = AtDesign(network);
        StatisticsSection.CheckPairs(root, displayName, network);
        var (checks, standards, pairs) = ReadChecksAndStandards(ctx, root, network);
        options = options with { Analysis = options.Analysis with { RelativePairs = pairs(options.Analysis) } };
        return new SurveyProject(network, units, options, inputs)
        {
            Crs = crs, Grid = grid, PlaneHeight = planeHeight, PlaneHeightBasis = planeBasis,
            Warnings = [.. ProjectWarnings.Find(network, listedTwice), .. RoundsWarnings(specs.Rounds, units)],
            Rounds = specs.Rounds,
            Particulars = ReadParticulars(ctx, root), Checks = checks, Standards = standards,
            Instruments = [.. specs.Instruments.Values],
            GnssFrame = gnss.FrameLabel, Diagnosis = ReadDiagnosis(ctx, root, lengths),
        };
    }

    /// <summary>Loads the project's YAML (<paramref name="yaml"/>: the project <paramref name="text"/> or its text with
    /// the point lines emptied) as one mapping; errors name the file and line.</summary>
    private static YamlMappingNode Load(string yaml, string text, string displayName)
    {
        try
        {
            // one pass: the guard checks each event before the document model takes it
            var stream = new YamlStream();
            stream.Load(new YamlGuard(yaml, displayName));
            if (stream.Documents.Count == 0 || stream.Documents[0].RootNode is not YamlMappingNode m)
                throw new ProjectFileException(displayName, 1, "",
                    "the project file must be a YAML mapping with keys such as 'points' and 'setups'");
            return m;
        }
        catch (YamlException e)
        {
            throw new ProjectFileException(displayName, (int)e.Start.Line, "",
                "this is not valid YAML: " + FirstLine(e.InnerException?.Message ?? e.Message));
        }
        catch (ArgumentException) // YamlDotNet's document model refuses some event orders the parser lets through
        {
            throw YamlGuard.Unreadable(displayName, text);
        }
        // YamlDotNet's scanner fails this way on an unclosed '{' or '[' before a new line
        catch (InvalidOperationException)
        {
            throw UnclosedBracket(displayName, text);
        }
    }

    /// <summary>True when the top-level key 'points' stands at <paramref name="line"/> with no value (the document
    /// model's view of the text whose point lines were emptied).</summary>
    private static bool HoldsEmptyPoints(Context ctx, YamlMappingNode root, int line)
    {
        foreach (var (k, v) in root.Children)
            if (k is YamlScalarNode { Value: "points" } key)
                return Line(key) == line && v is YamlScalarNode && ctx.Child(root, "points") is null;
        return false;
    }

    internal static int Line(YamlNode node) => (int)node.Start.Line;

    /// <summary>The keys of one observation of a kind in the project file (the kind's column metadata).</summary>
    private static string[] Keys(ObservationKind kind) => [.. ObservationKindRegistry.Of(kind).Columns.YamlKeys];

    private static string FirstLine(string s) => s.Split('\n')[0].Trim();

    private static ProjectUnits ReadUnits(Context ctx, YamlMappingNode root)
    {
        if (ctx.Child(root, "units") is not YamlNode node) return ProjectUnits.Default;
        var m = ctx.Mapping(node, "units");
        ctx.CheckKeys(m, ["length", "angle", "angle_sd"], "units");
        var length = ProjectUnits.Default.Length;
        if (ctx.Child(m, "length") is YamlNode ln)
        {
            length = ctx.Choice(ln, "units.length", OptionGrammars.LengthUnits);
        }
        var angle = ProjectUnits.Default.Angle;
        if (ctx.Child(m, "angle") is YamlNode an)
        {
            angle = ctx.Choice(an, "units.angle", OptionGrammars.AngleFormats);
        }
        var sd = angle == AngleFormat.Gons ? AngleSdUnit.Milligon : AngleSdUnit.Arcsecond;
        if (ctx.Child(m, "angle_sd") is YamlNode sn)
        {
            sd = ctx.Choice(sn, "units.angle_sd", OptionGrammars.AngleSdUnits);
        }
        return new ProjectUnits(length, angle, sd);
    }

    private static AdjustmentOptions ReadOptions(Context ctx, YamlMappingNode root, ProjectUnits units)
    {
        var o = AdjustmentOptions.Default;
        if (ctx.Child(root, "adjustment") is not YamlNode node) return o;
        var m = ctx.Mapping(node, "adjustment");
        ctx.CheckKeys(m, ["max_iterations", "tolerance", "alpha", "variance_factor", "centering",
            "refraction", "refraction_sd", "plane_height"], "adjustment");
        if (ctx.Child(m, "centering") is YamlNode cn)
        {
            o = o with { Centering = ctx.Choice(cn, "adjustment.centering", OptionGrammars.Centering) };
        }
        if (ctx.Child(m, "max_iterations") is YamlNode it)
        {
            double v = ctx.Number(it, "adjustment.max_iterations");
            if (v != Math.Floor(v) || v < 1 || v > 1000)
                throw ctx.Error(it, "adjustment.max_iterations", "must be a whole number from 1 to 1000");
            o = o with { MaxIterations = (int)v };
        }
        if (ctx.Child(m, "tolerance") is YamlNode tol)
        {
            double v = ctx.Number(tol, "adjustment.tolerance");
            if (!(v > 0)) throw ctx.Error(tol, "adjustment.tolerance", "must be positive");
            o = o with { LengthTolerance = Length.From(v, units.Length).Metres };
        }
        if (ctx.Child(m, "alpha") is YamlNode al)
        {
            double v = ctx.Number(al, "adjustment.alpha");
            if (!(v > 0 && v < 1))
                throw ctx.Error(al, "adjustment.alpha", "the significance level must be between 0 and 1 (e.g. 0.05)");
            o = o with { GlobalTestAlpha = v };
        }
        if (ctx.Child(m, "variance_factor") is YamlNode vf)
        {
            double v = ctx.Number(vf, "adjustment.variance_factor");
            if (!(v > 0))
                throw ctx.Error(vf, "adjustment.variance_factor", "the a-priori variance factor must be positive");
            o = o with { AprioriVarianceFactor = v };
        }
        return o;
    }

    private static Dictionary<ObservationKind,
        double> ReadDefaults(Context ctx, YamlMappingNode root, ProjectUnits units)
    {
        var d = new Dictionary<ObservationKind, double>();
        if (ctx.Child(root, "default_sd") is not YamlNode node) return d;
        var m = ctx.Mapping(node, "default_sd");
        ctx.CheckKeys(m, ObservationKinds.All.Select(k => k.Name()).ToArray(), "default_sd");
        foreach (var kind in ObservationKinds.All)
            if (ctx.Child(m, kind.Name()) is YamlNode v)
                d[kind] = ReadSd(ctx, v, kind, units, "default_sd." + kind.Name());
        return d;
    }

    /// <summary>Reads a standard deviation in the project's units: a length (unit suffix allowed) or an angle in
    /// angle_sd units.</summary>
    internal static double ParseSd(string text, ObservationKind kind, ProjectUnits units, out string? error)
    {
        error = null;
        if (kind.IsAngular())
        {
            if (!double.TryParse(text, NumberStyles.Float, CultureInfo.InvariantCulture, out double a) ||
                !double.IsFinite(a))
            { error = $"'{text}' is not a standard deviation in {units.AngleSd.Symbol()}"; return 0; }
            if (!(a > 0)) { error = "a standard deviation must be positive"; return 0; }
            return a * units.AngleSd.RadiansPerUnit();
        }
        var r = new LengthPattern(units.Length, 4).Parse(text);
        if (!r.Success) { error = r.Error; return 0; }
        if (!(r.Value.Metres > 0)) { error = "a standard deviation must be positive"; return 0; }
        return r.Value.Metres;
    }

    private static double ReadSd(Context ctx, YamlNode node, ObservationKind kind, ProjectUnits units, string item)
    {
        double v = ParseSd(ctx.Scalar(node, item), kind, units, out string? err);
        err ??= InputLimits.SdProblem(v, kind.IsAngular());
        return err is null ? v : throw ctx.Error(node, item, err);
    }

    private static Point ReadPoint(Context ctx, YamlNode node, LengthPattern lengths)
    {
        var m = ctx.Mapping(node, "a point");
        string id = RequiredId(ctx, m, "id", "a point");
        string item = "point " + id;
        ctx.CheckKeys(m, ["id", "e", "n", "h", "fix", "sd_e", "sd_n", "sd_h"], item);
        double? Len(string key)
        {
            if (ctx.Child(m, key) is not YamlNode v) return null;
            var r = lengths.Parse(ctx.Scalar(v, $"{item} {key}"));
            return r.Success ? r.Value.Metres : throw ctx.Error(v, item, $"{key}: {r.Error}");
        }
        var fix = Fixity.None;
        if (ctx.Child(m, "fix") is YamlNode f)
        {
            var r = OptionGrammars.HeldComponents(ctx.Scalar(f, item));
            fix = r.Success ? r.Value : throw ctx.Error(f, item, "fix: " + r.Error);
        }
        var p = new Point(id)
        {
            E = Len("e"), N = Len("n"), H = Len("h"), Fixed = fix,
            SdE = Len("sd_e"), SdN = Len("sd_n"), SdH = Len("sd_h"),
            Source = $"{ctx.File}:{Line(node)}",
        };
        return p;
    }

    private static void ReadSetup(Context ctx, YamlNode node, LengthPattern lengths, AnglePattern angles,
        ProjectUnits units,
        Dictionary<ObservationKind, double> defaults, Dictionary<string, int> setsPerStation,
            List<Observation> setupOutput, StochasticInputs specs)
    {
        var m = ctx.Mapping(node, "a setup");
        string at = RequiredId(ctx, m, "at", "a setup");
        string item = "setup at " + at;
        ctx.CheckKeys(m, ["at", "directions", "distances", "angles", "azimuths", "instrument", "target", "sets",
            "faces", "instrument_height", "slope_distances", "zeniths", "refraction_group", "rounds"], item);
        var spec = ReadSetupSpec(ctx, m, item, specs);
        var output = new List<Pending>();
        spec = ReadRounds(ctx, m, at, item, lengths, angles, spec, specs, setsPerStation, output);

        if (ctx.Child(m, "directions") is YamlNode dirs)
        {
            int k = setsPerStation.TryGetValue(at, out int c) ? c + 1 : 1;
            setsPerStation[at] = k;
            string setId = $"{at}/{k}";
            foreach (var dn in ctx.Sequence(dirs, item + " directions"))
            {
                var (to, value, sd, src, budget, target) =
                    ReadSighting(ctx, dn, ObservationKind.Direction, units, defaults, Keys(ObservationKind.Direction),
                    item, spec, specs);
                output.Add(new(new DirectionObservation(at, to,
                    ctx.ParseAngle(dn, angles, value, $"direction {at}→{to}"), setId)
                { StandardDeviation = sd, Source = src }, budget, target, dn, $"direction to {to} in the {item}"));
            }
        }
        if (ctx.Child(m, "distances") is YamlNode dists)
            foreach (var dn in ctx.Sequence(dists, item + " distances"))
            {
                var (to, value, sd, src, budget, target) =
                    ReadSighting(ctx, dn, ObservationKind.Distance, units, defaults, Keys(ObservationKind.Distance),
                    item, spec, specs);
                output.Add(new(new DistanceObservation(at, to, PositiveDistance(ctx, dn,
                    ctx.ParseLength(dn, lengths, value, $"distance {at}→{to}"), $"distance {at}→{to}"))
                { StandardDeviation = sd, Source = src },
                    budget, target, dn, $"distance to {to} in the {item}"));
            }
        if (ctx.Child(m, "azimuths") is YamlNode azs)
            foreach (var an in ctx.Sequence(azs, item + " azimuths"))
            {
                var (to, value, sd, src, budget, target) =
                    ReadSighting(ctx, an, ObservationKind.Azimuth, units, defaults, Keys(ObservationKind.Azimuth), item,
                    spec, specs);
                output.Add(new(new AzimuthObservation(at, to,
                    ctx.ParseAngle(an, angles, value, $"azimuth {at}→{to}")) { StandardDeviation = sd, Source = src },
                    budget, target, an, $"azimuth to {to} in the {item}"));
            }
        if (ctx.Child(m, "angles") is YamlNode angs)
            foreach (var an in ctx.Sequence(angs, item + " angles"))
            {
                var (to, value, sd, src, budget, target) =
                    ReadSighting(ctx, an, ObservationKind.Angle, units, defaults, Keys(ObservationKind.Angle), item,
                    spec, specs);
                string from = RequiredId(ctx, ctx.Mapping(an, item), "from", $"angle at {at}");
                output.Add(new(new AngleObservation(at, from, to,
                    ctx.ParseAngle(an, angles, value, $"angle at {at} from {from} to {to}")) { StandardDeviation = sd,
                    Source = src },
                    budget, target, an, $"angle from {from} to {to} in the {item}"));
            }
        ReadTrigonometric(ctx, m, at, item, lengths, angles, units, defaults, spec, specs, output);
        FinishSetup(ctx, at, spec, output, specs, setupOutput);
    }

    private static (string To, string Value, double Sd, string Source, bool NeedsBudget,
        TargetSpecification? Target) ReadSighting(
        Context ctx, YamlNode node, ObservationKind kind, ProjectUnits units, Dictionary<ObservationKind,
            double> defaults, string[] keys, string setupItem,
        SetupSpec spec, StochasticInputs specs)
    {
        var m = ctx.Mapping(node, $"a {kind.Name()} in the {setupItem}");
        string to = RequiredId(ctx, m, "to", $"a {kind.Name()} in the {setupItem}");
        string item = $"{kind.Name().Replace('_', ' ')} to {to} in the {setupItem}";
        ctx.CheckKeys(m, [.. keys, .. ObservationMarks.Keys], item);
        string value = ctx.Planned && ctx.Child(m, "value") is null ? PlannedValue(kind, units)
            : ctx.RequiredString(m, "value", item);
        var target = TargetOf(ctx, m, item, specs);
        if (target is not null && spec.Instrument is null)
            throw ctx.Error(m, item,
                "'target' is used to weight observations from an instrument specification: name the setup's " +
                "'instrument' too");
        // Precedence: explicit sd, then the setup's instrument specification (not for azimuths), then default_sd.
        bool fromSpec = spec.Instrument is not null && kind != ObservationKind.Azimuth && ctx.Child(m, "sd") is null;
        double sd = ctx.Child(m, "sd") is YamlNode s ? ReadSd(ctx, s, kind, units, item + " sd")
            : fromSpec ? double.NaN // derived from the specifications by the stochastic model
            : defaults.TryGetValue(kind, out double d) ? d
            : throw ctx.Error(node, item,
                $"no standard deviation: give 'sd' or a default under default_sd.{kind.Name()}");
        return (to, value, sd, $"{ctx.File}:{Line(node)}", fromSpec, target);
    }

    private static Observation ReadLevelling(Context ctx, YamlNode node, LengthPattern lengths, ProjectUnits units,
        Dictionary<ObservationKind, double> defaults,
        StochasticInputs specs)
    {
        var m = ctx.Mapping(node, "a levelling section");
        string from = RequiredId(ctx, m, "from", "a levelling section");
        string to = RequiredId(ctx, m, "to", "a levelling section");
        string item = $"height difference {from}→{to}";
        ctx.CheckKeys(m, [.. Keys(ObservationKind.HeightDifference), .. ObservationMarks.Keys], item);
        var dh = ctx.ParseLength(node, lengths, ctx.Planned && ctx.Child(m, "dh") is null
            ? PlannedValue(ObservationKind.HeightDifference, units) : ctx.RequiredString(m, "dh", item), item);
        Length? len = null;
        if (ctx.Child(m, "length") is YamlNode ln)
        {
            var l = ctx.ParseLength(ln, lengths, ctx.Scalar(ln, item), item + " length");
            if (!(l.Metres > 0)) throw ctx.Error(ln, item, "the section length must be positive");
            len = l;
        }
        var weighting = LevellingWeighting(ctx, m, item, len, specs);
        double sd = ctx.Child(m, "sd") is YamlNode s ? ReadSd(ctx, s, ObservationKind.HeightDifference, units, item +
            " sd")
            : weighting is not null ? double.NaN // derived from the level by the stochastic model
            : defaults.TryGetValue(ObservationKind.HeightDifference, out double d) ? d
            : throw ctx.Error(node, item,
                "no standard deviation: give 'sd' or a default under default_sd.height_difference");
        var o = new HeightDifferenceObservation(from, to, dh, len) { StandardDeviation = sd, Source =
            $"{ctx.File}:{Line(node)}" };
        return ObservationMarks.Apply(weighting is not null &&
            ctx.Child(m, "sd") is null ? o with { Weighting = weighting } : o, node, ctx.File);
    }

    /// <summary>Helpers that read YAML nodes and raise errors with file and line.</summary>
    private sealed class Context(string file)
    {
        public string File { get; } = file;

        /// <summary>True when reading a plan: observations may leave out their values.</summary>
        public bool Planned { get; init; }

        public ProjectFileException Error(YamlNode node, string item, string problem) =>
            new(File, Line(node), item, problem);

        public YamlNode? Child(YamlMappingNode m, string key) =>
            m.Children.TryGetValue(new YamlScalarNode(key), out var v) &&
                !(v is YamlScalarNode s && s.Value is null or "" && s.Style == ScalarStyle.Plain) ? v : null;

        public YamlMappingNode Mapping(YamlNode node, string what) =>
            node as YamlMappingNode ?? throw Error(node, "", $"expected {what} written as a mapping (key: value)");

        public IEnumerable<YamlNode> Sequence(YamlNode node, string what) =>
            node as YamlSequenceNode ?? throw Error(node, what, "expected a list (items starting with '-')");

        public string Scalar(YamlNode node, string item) =>
            node is YamlScalarNode s &&
                s.Value is not null ? s.Value : throw Error(node, item, "expected a single value here");

        public string? OptionalString(YamlMappingNode m, string key) => Child(m, key) is YamlNode n ? Scalar(n, key) :
            null;

        public string RequiredString(YamlMappingNode m, string key, string item) =>
            Child(m, key) is YamlNode n ? Scalar(n, item) : throw Error(m, item, $"'{key}' is missing");

        public double Number(YamlNode node, string item)
        {
            string s = Scalar(node, item);
            return double.TryParse(s, NumberStyles.Float, CultureInfo.InvariantCulture, out double v) &&
                double.IsFinite(v)
                ? v : throw Error(node, item, $"'{s}' is not a number");
        }

        /// <summary>Reads an enumerated option through its grammar; the error names the item.</summary>
        public T Choice<T>(YamlNode node, string item, TextChoice<T> grammar, string? key = null)
        {
            var r = grammar.Parse(Scalar(node, item));
            return r.Success ? r.Value : throw Error(node, item, key is null ? r.Error! : $"{key}: {r.Error}");
        }

        public Angle ParseAngle(YamlNode node, AnglePattern p, string text, string item)
        {
            var r = p.Parse(text);
            return r.Success ? r.Value : throw Error(node, item, r.Error!);
        }

        public Length ParseLength(YamlNode node, LengthPattern p, string text, string item)
        {
            var r = p.Parse(text);
            return r.Success ? r.Value : throw Error(node, item, r.Error!);
        }

        public void CheckKeys(YamlMappingNode m, string[] allowed, string item)
        {
            foreach (var (k, _) in m.Children)
            {
                string key = (k as YamlScalarNode)?.Value ?? "";
                if (!allowed.Contains(key))
                    throw Error(k, item, $"unknown key '{key}' (expected one of: {string.Join(", ", allowed)})");
            }
        }
    }
}
