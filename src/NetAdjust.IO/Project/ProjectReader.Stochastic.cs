using System.Globalization;
using NetAdjust.IO.Text;
using NetAdjust.Network;
using NetAdjust.Stochastic;
using NetAdjust.Units;
using YamlDotNet.RepresentationModel;

namespace NetAdjust.IO.Project;

/// <summary>The stochastic part of the project file: instruments, targets, levels, and per-setup procedure
/// (docs/input-format.md).</summary>
public static partial class ProjectReader
{
    /// <summary>Specifications declared at the top level.</summary>
    private sealed class StochasticInputs
    {
        public Dictionary<string, TotalStationSpecification> Instruments { get; } = new(StringComparer.Ordinal);

        public Dictionary<string, TargetSpecification> Targets { get; } = new(StringComparer.Ordinal);

        public Dictionary<string, LevelSpecification> Levels { get; } = new(StringComparer.Ordinal);

        public Dictionary<string, Point> Points { get; } = new(StringComparer.Ordinal);

        public Dictionary<string, int> SetupsPerStation { get; } = new(StringComparer.Ordinal);

        /// <summary>The project's refraction coefficient k for zenith angles.</summary>
        public double Refraction { get; set; } = Geometry.SpatialGeometry.DefaultRefraction;

        /// <summary>The project's σ_k and its groups of zenith angles with their own k (ProjectReader.Trigonometric).
        /// </summary>
        public double RefractionSd { get; set; } = DefaultRefractionSd;

        /// <summary>The refraction groups by id.</summary>
        public Dictionary<string, RefractionGroup> RefractionGroups { get; } = new(StringComparer.Ordinal);

        /// <summary>The face tolerance (radians) and the level of the spread tests of rounds.</summary>
        public (double Tolerance, double Alpha) Reduction { get; set; }

        /// <summary>The rounds read so far, setup by setup.</summary>
        public List<SetupRounds> Rounds { get; } = [];

        /// <summary>
        /// The weighting of a height difference from a named level (for CSV rows); throws InvalidInputException.
        /// </summary>
        public ObservationWeighting WeightingOfLevel(string id, Length? length, int? setups, int? runs)
        {
            var level = Levels.TryGetValue(id, out var spec) ? spec
                : throw new InvalidInputException($"level '{id}' is not defined under 'levels'");
            if (level.ReadingSd is not null && setups is null)
                throw new InvalidInputException(
                    $"level {id} is specified per reading: give the section's number of setups");
            if (level.SdPerKm is not null && length is null)
                throw new InvalidInputException($"level {id} is specified per km, so the section needs its length");
            if (length is Length l && !(l.Metres > 0))
                throw new InvalidInputException("the section length must be positive");
            var procedure = new LevellingProcedure(setups ?? 1, runs ?? (level.SdPerKm is not null ? 2 : 1));
            return new ObservationWeighting { Level = level, Levelling = procedure };
        }
    }

    /// <summary>The instrument, default target and procedure of one setup; Instrument null when the setup names
    /// none.</summary>
    private sealed record SetupSpec(TotalStationSpecification? Instrument, TargetSpecification? Target,
        ObservingProcedure Procedure);

    /// <summary>An observation read in a setup, waiting for its budget.</summary>
    private sealed record Pending(Observation Observation, bool NeedsBudget, TargetSpecification? Target, YamlNode Node,
        string Item);

    private static StochasticInputs ReadSpecifications(Context ctx, YamlMappingNode root, ProjectUnits units,
        IEnumerable<Point> points)
    {
        var s = new StochasticInputs();
        foreach (var p in points) s.Points.TryAdd(p.Id, p);
        if (ctx.Child(root, "instruments") is YamlNode ins)
            foreach (var node in ctx.Sequence(ins, "instruments"))
            {
                var m = ctx.Mapping(node, "an instrument");
                string id = ctx.RequiredString(m, "id", "an instrument");
                string item = "instrument " + id;
                ctx.CheckKeys(m, ["id", "direction_sd", "zenith_sd", "edm", "centering", "height"], item);
                if (ctx.Child(m, "direction_sd") is null)
                    throw ctx.Error(m, item,
                        "'direction_sd' is missing (the ISO 17123-3 standard deviation of a direction in both faces)");
                double dir = SpecAngle(ctx, m, "direction_sd", item, units, positive: true);
                double zen = SpecAngle(ctx, m, "zenith_sd", item, units, positive: false);
                EdmSpecification? edm = null;
                if (ctx.Child(m, "edm") is YamlNode en)
                {
                    var r = EdmSpecification.Parse(ctx.Scalar(en, item + " edm"), units.Length);
                    edm = r.Success ? r.Value : throw ctx.Error(en, item, "edm: " + r.Error);
                }
                var spec = Wrap(ctx, m, item, () => new TotalStationSpecification(id, dir, zen, edm,
                    SpecLength(ctx, m, "centering", item, units), SpecLength(ctx, m, "height", item, units)));
                if (!s.Instruments.TryAdd(id, spec)) throw ctx.Error(node, item, "is defined twice");
            }
        if (ctx.Child(root, "targets") is YamlNode tgs)
            foreach (var node in ctx.Sequence(tgs, "targets"))
            {
                var m = ctx.Mapping(node, "a target");
                string id = ctx.RequiredString(m, "id", "a target");
                string item = "target " + id;
                ctx.CheckKeys(m, ["id", "centering", "height"], item);
                var spec = Wrap(ctx, m, item, () => new TargetSpecification(id, SpecLength(ctx, m, "centering", item,
                    units), SpecLength(ctx, m, "height", item, units)));
                if (!s.Targets.TryAdd(id, spec)) throw ctx.Error(node, item, "is defined twice");
            }
        if (ctx.Child(root, "levels") is YamlNode lvs)
            foreach (var node in ctx.Sequence(lvs, "levels"))
            {
                var m = ctx.Mapping(node, "a level");
                string id = ctx.RequiredString(m, "id", "a level");
                string item = "level " + id;
                ctx.CheckKeys(m, ["id", "sd_per_km", "reading_sd", "resolution", "rounding"], item);
                bool perKm = ctx.Child(m, "sd_per_km") is not null, perReading = ctx.Child(m, "reading_sd") is not null;
                if (perKm == perReading)
                    throw ctx.Error(m, item,
                        "give either 'sd_per_km' (ISO 17123-2, 1 km double-run) or 'reading_sd' (one rod reading), " +
                        "not both or neither");
                LevelSpecification spec;
                if (perKm)
                {
                    foreach (var k in new[] { "resolution", "rounding" })
                        if (ctx.Child(m, k) is YamlNode bad)
                            throw ctx.Error(bad, item,
                                $"'{k}' belongs to the per-reading model; the ISO 17123-2 figure per km already " +
                                $"includes the reading errors");
                    spec = Wrap(ctx, m, item, () => LevelSpecification.PerKm(id, SpecLength(ctx, m, "sd_per_km", item,
                        units)));
                }
                else
                {
                    var rounding = RoundingTreatment.Uniform;
                    if (ctx.Child(m, "rounding") is YamlNode rn)
                    {
                        rounding = ctx.Choice(rn, item, OptionGrammars.Rounding, "rounding");
                    }
                    spec = Wrap(ctx, m, item, () => LevelSpecification.PerReading(id, SpecLength(ctx, m, "reading_sd",
                        item, units),
                        SpecLength(ctx, m, "resolution", item, units), rounding));
                }
                if (!s.Levels.TryAdd(id, spec)) throw ctx.Error(node, item, "is defined twice");
            }
        return s;
    }

    private static T Wrap<T>(Context ctx, YamlNode node, string item, Func<T> make)
    {
        try { return make(); }
        // already names file, line and item
        catch (InvalidInputException e) when (e is not ProjectFileException) { throw ctx.Error(node, item, e.Message); }
        catch (ArgumentException) // a contribution overflowed (e.g. centering over a sight of 1e-300 m)
        {
            throw ctx.Error(node, item, "the standard deviation derived from the specification is not a finite " +
                "number " +
                "(a sight length near zero?); see docs/input-format.md, \"Limits\"");
        }
    }

    /// <summary>A length ≥ 0 in the project's unit (suffix allowed); 0 when the key is absent.</summary>
    private static double SpecLength(Context ctx, YamlMappingNode m, string key, string item, ProjectUnits units)
    {
        if (ctx.Child(m, key) is not YamlNode n) return 0;
        var r = new LengthPattern(units.Length, 4).Parse(ctx.Scalar(n, $"{item} {key}"));
        if (!r.Success) throw ctx.Error(n, item, $"{key}: {r.Error}");
        if (r.Value.Metres < 0) throw ctx.Error(n, item, $"{key} must not be negative");
        return r.Value.Metres;
    }

    /// <summary>An angular standard deviation in units.angle_sd; 0 when the key is absent.</summary>
    private static double SpecAngle(Context ctx, YamlMappingNode m, string key, string item, ProjectUnits units,
        bool positive)
    {
        if (ctx.Child(m, key) is not YamlNode n) return 0;
        string t = ctx.Scalar(n, $"{item} {key}");
        if (!double.TryParse(t, NumberStyles.Float, CultureInfo.InvariantCulture, out double v) || !double.IsFinite(v))
            throw ctx.Error(n, item, $"{key} '{t}' is not a number of {units.AngleSd.Symbol()}");
        if (positive ? !(v > 0) : v < 0)
            throw ctx.Error(n, item, $"{key} must be {(positive ? "positive" : "zero or positive")}");
        return v * units.AngleSd.RadiansPerUnit();
    }

    private static SetupSpec ReadSetupSpec(Context ctx, YamlMappingNode m, string item, StochasticInputs s)
    {
        TotalStationSpecification? instrument = null;
        if (ctx.Child(m, "instrument") is YamlNode i)
        {
            string id = ctx.Scalar(i, item + " instrument");
            instrument = s.Instruments.TryGetValue(id, out var spec) ? spec
                : throw ctx.Error(i, item, $"instrument '{id}' is not defined under 'instruments'");
        }
        var target = TargetOf(ctx, m, item, s);
        int sets = 1;
        if (ctx.Child(m, "sets") is YamlNode sn)
        {
            double v = ctx.Number(sn, item + " sets");
            if (v != Math.Floor(v) || v < 1 || v > 1000)
                throw ctx.Error(sn, item, "sets must be a whole number from 1 to 1000");
            sets = (int)v;
        }
        var faces = Faces.Both;
        if (ctx.Child(m, "faces") is YamlNode fn)
        {
            faces = ctx.Choice(fn, item, OptionGrammars.Faces, "faces");
        }
        if (instrument is null)
            foreach (var k in new[] { "target", "sets", "faces" })
                if (ctx.Child(m, k) is YamlNode bad)
                    throw ctx.Error(bad, item,
                        $"'{k}' is used to weight observations from an instrument specification: name the setup's " +
                        $"'instrument' too");
        return new SetupSpec(instrument, target, new ObservingProcedure(sets, faces));
    }

    private static TargetSpecification? TargetOf(Context ctx, YamlMappingNode m, string item, StochasticInputs s)
    {
        if (ctx.Child(m, "target") is not YamlNode t) return null;
        string id = ctx.Scalar(t, item + " target");
        return s.Targets.TryGetValue(id, out var spec) ? spec : throw ctx.Error(t, item,
            $"target '{id}' is not defined under 'targets'");
    }

    /// <summary>
    /// Gives each pending observation of a setup the setup's id and, when it is weighted from the setup's instrument,
    /// its weighting (instrument, target, procedure, and the distances observed in the setup as sight lengths; other
    /// sight lengths are taken from the adjustment's coordinates), and appends it to the output.
    /// </summary>
    private static void FinishSetup(Context ctx, string at, SetupSpec spec, List<Pending> pending, StochasticInputs s,
        List<Observation> output)
    {
        if (spec.Instrument is not TotalStationSpecification ts)
        {
            output.AddRange(pending.Select(p => ObservationMarks.Apply(p.Observation, p.Node, ctx.File)));
            return;
        }
        int k = s.SetupsPerStation.TryGetValue(at, out int c) ? c + 1 : 1;
        s.SetupsPerStation[at] = k;
        string setupId = $"{at}#{k}";
        var observed = new Dictionary<string, double>(StringComparer.Ordinal);
        foreach (var p in pending)
            if (p.Observation is DistanceObservation d) observed.TryAdd(d.To, d.Distance.Metres);
        foreach (var p in pending)
        {
            var o = p.Observation with { SetupId = setupId };
            if (p.NeedsBudget)
            {
                if (o is DistanceObservation or SlopeDistanceObservation && ts.Edm is null)
                    throw ctx.Error(p.Node, p.Item,
                        $"instrument {ts.Id} has no EDM specification, so it cannot weight a distance");
                o = o with
                {
                    StandardDeviation = double.NaN,
                    Weighting = new ObservationWeighting
                    {
                        Instrument = ts, Target = p.Target ?? spec.Target, Procedure = spec.Procedure,
                        ObservedSights = observed,
                    },
                };
            }
            output.Add(ObservationMarks.Apply(o, p.Node, ctx.File)); // re-weighting marks scale the budget too
        }
    }

    /// <summary>The weighting of a levelling section from its 'level', 'setups' and 'runs' keys; null when it names no
    /// level.</summary>
    private static ObservationWeighting? LevellingWeighting(Context ctx, YamlMappingNode m, string item, Length? length,
        StochasticInputs s)
    {
        int? Count(string key, int max)
        {
            if (ctx.Child(m, key) is not YamlNode n) return null;
            double v = ctx.Number(n, $"{item} {key}");
            return v == Math.Floor(v) && v >= 1 &&
                v <= max ? (int)v : throw ctx.Error(n, item, $"{key} must be a whole number from 1 to {max}");
        }
        int? setups = Count("setups", 100000), runs = Count("runs", 100);
        if (ctx.Child(m, "level") is not YamlNode ln)
        {
            if (setups is not null || runs is not null)
                throw ctx.Error(m, item,
                    "'setups' and 'runs' weight the section from a level specification: name its 'level' too");
            return null;
        }
        string id = ctx.Scalar(ln, item + " level");
        if (!s.Levels.ContainsKey(id)) throw ctx.Error(ln, item, $"level '{id}' is not defined under 'levels'");
        // Runs meaned: default 2 for the per-km model (the ISO 17123-2 figure is for a double run), 1 per reading.
        return Wrap(ctx, m, item, () => s.WeightingOfLevel(id, length, setups, runs));
    }
}
