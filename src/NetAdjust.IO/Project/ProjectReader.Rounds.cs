using System.Globalization;
using NetAdjust.Network;
using NetAdjust.Reduction;
using NetAdjust.Units;
using YamlDotNet.RepresentationModel;

namespace NetAdjust.IO.Project;

/// <summary>
/// Raw rounds of a setup in both faces (docs/input-format.md, "Rounds in both faces"): the sets are read here,
/// reduced by <see cref="RoundsReducer"/> before any adjustment, and their mean directions, zenith angles and slope
/// distances join the setup's observations, weighted as the mean of the rounds' sets and faces.
/// </summary>
public static partial class ProjectReader
{
    private static readonly string[] ReadingKeys =
        ["to", "hz_left", "hz_right", "zenith_left", "zenith_right", "slope_left", "slope_right", "target_height",
        "target"];

    /// <summary>The keys a setup with rounds must not have: the rounds give these observations and the
    /// procedure.</summary>
    private static readonly string[] KeysReplacedByRounds =
        ["directions", "angles", "zeniths", "slope_distances", "sets", "faces"];

    /// <summary>The optional top-level <c>reduction</c> section: the face tolerance and the level of the spread
    /// tests.</summary>
    private static (double Tolerance, double Alpha) ReadReductionSection(Context ctx, YamlMappingNode root,
        ProjectUnits units)
    {
        double tolerance = RoundsOptions.DefaultFaceTolerance, alpha = 0.05;
        if (ctx.Child(root, "reduction") is not YamlNode node) return (tolerance, alpha);
        var m = ctx.Mapping(node, "reduction");
        ctx.CheckKeys(m, ["face_tolerance", "alpha"], "reduction");
        if (ctx.Child(m, "face_tolerance") is YamlNode ft)
        {
            double v = ctx.Number(ft, "reduction.face_tolerance") * units.AngleSd.RadiansPerUnit();
            // Below 0.1″ no instrument's faces agree; above 1° a tolerance no longer catches a misread degree.
            if (!(v >= 0.1 / Angle.ArcsecondsPerRadian && v <= Math.PI / 180))
                throw ctx.Error(ft, "reduction.face_tolerance",
                    "the tolerance of the face differences must lie between 0.1″ and 1° " +
                    $"(in {units.AngleSd.Symbol()})");
            tolerance = v;
        }
        if (ctx.Child(m, "alpha") is YamlNode al)
        {
            double v = ctx.Number(al, "reduction.alpha");
            alpha = v is > 0 and < 1 ? v
                : throw ctx.Error(al, "reduction.alpha", "the significance level must be between 0 and 1 (e.g. 0.05)");
        }
        return (tolerance, alpha);
    }

    /// <summary>
    /// Reads the setup's <c>rounds</c>, reduces them and adds their observations to <paramref name="output"/>;
    /// returns the setup's specification with the procedure of the rounds (or <paramref name="spec"/> unchanged when
    /// the setup has no rounds).
    /// </summary>
    private static SetupSpec ReadRounds(Context ctx, YamlMappingNode m, string at, string item, LengthPattern lengths,
        AnglePattern angles, SetupSpec spec, StochasticInputs specs,
        Dictionary<string, int> setsPerStation, List<Pending> output)
    {
        if (ctx.Child(m, "rounds") is not YamlNode roundsNode) return spec;
        var group = ReadSetupRefractionGroup(ctx, m, item, specs);
        foreach (var key in KeysReplacedByRounds)
            if (ctx.Child(m, key) is YamlNode bad)
                throw ctx.Error(bad, item, $"'{key}' cannot stand beside 'rounds': the rounds give the setup's " +
                    "directions, zenith angles, slope distances and its number of sets and faces");
        var instrument = spec.Instrument
            ?? throw ctx.Error(roundsNode, item, "rounds need the setup's 'instrument': its ISO 17123-3 figures test " +
                "the spread of the sets and weight the reduced observations");

        var setNodes = new List<YamlNode>();
        var readingNodes = new List<List<YamlMappingNode>>();
        var sets = new List<IReadOnlyList<FaceReadings>>();
        foreach (var sn in ctx.Sequence(roundsNode, item + " rounds"))
        {
            string setItem = $"set {setNodes.Count + 1} of the {item}";
            var sm = ctx.Mapping(sn, setItem);
            ctx.CheckKeys(sm, ["readings"], setItem);
            var rn = ctx.Child(sm, "readings") ?? throw ctx.Error(sm, setItem, "'readings' is missing");
            var nodes = new List<YamlMappingNode>();
            var readings = new List<FaceReadings>();
            foreach (var r in ctx.Sequence(rn, setItem + " readings"))
            {
                var rm = ctx.Mapping(r, $"a reading in {setItem}");
                string to = ctx.RequiredString(rm, "to", $"a reading in {setItem}");
                string what = $"reading of {to} in {setItem}";
                ctx.CheckKeys(rm, ReadingKeys, what);
                Angle? A(string key) => ctx.Child(rm, key) is YamlNode v
                    ? ctx.ParseAngle(v, angles, ctx.Scalar(v, $"{what} {key}"), $"{what} {key}") : null;
                Length? L(string key) => ctx.Child(rm, key) is YamlNode v
                    ? ctx.ParseLength(v, lengths, ctx.Scalar(v, $"{what} {key}"), $"{what} {key}") : null;
                readings.Add(new FaceReadings(to)
                {
                    HorizontalLeft = A("hz_left"), HorizontalRight = A("hz_right"),
                    ZenithLeft = A("zenith_left"), ZenithRight = A("zenith_right"),
                    SlopeLeft = L("slope_left"), SlopeRight = L("slope_right"),
                });
                nodes.Add(rm);
            }
            setNodes.Add(sn);
            readingNodes.Add(nodes);
            sets.Add(readings);
        }
        if (sets.Count == 0) throw ctx.Error(roundsNode, item + " rounds", "the rounds hold no set");

        var (tolerance, alpha) = specs.Reduction;
        ReducedRounds reduced;
        try
        {
            reduced = RoundsReducer.Reduce(sets,
                new RoundsOptions(instrument.DirectionSd, instrument.ZenithSd)
                {
                    FaceTolerance = tolerance, Alpha = alpha,
                });
        }
        catch (RoundsReadingException e)
        {
            int s = Math.Min(e.Set, setNodes.Count - 1);
            YamlNode where = e.Reading >= 0 ? readingNodes[s][e.Reading] : setNodes[s];
            string what = e.Reading >= 0 ? $"reading of {sets[s][e.Reading].Target} in set {s + 1} of the {item}"
                : $"set {s + 1} of the {item}";
            throw ctx.Error(where, what, e.Message);
        }

        Length? hi = null;
        var first = readingNodes[0];
        if (reduced.Targets.Any(x => !double.IsNaN(x.Zenith)))
            hi = InstrumentHeight(ctx, m, item, lengths);
        string? setId = null;
        if (reduced.ReferenceTarget is not null)
        {
            int k = setsPerStation.TryGetValue(at, out int c) ? c + 1 : 1;
            setsPerStation[at] = k;
            setId = $"{at}/{k}";
        }
        foreach (var x in reduced.Targets)
        {
            var node = first[x.Reading];
            string what = $"reading of {x.Target} in set 1 of the {item}";
            string src = $"{ctx.File}:{Line(node)}";
            var target = TargetOf(ctx, node, what, specs);
            if (!double.IsNaN(x.Direction))
                output.Add(new(new DirectionObservation(at, x.Target, Angle.FromRadians(x.Direction), setId!)
                { Source = src }, true, target, node, $"direction to {x.Target} from the rounds of the {item}"));
            if (double.IsNaN(x.Zenith)) continue;
            var th = RoundsTargetHeight(ctx, readingNodes, x, item, lengths);
            output.Add(new(new ZenithObservation(at, x.Target, Angle.FromRadians(x.Zenith), hi!.Value, th)
            {
                Source = src, Refraction = group?.K ?? specs.Refraction, RefractionSd = group?.Sd ?? specs.RefractionSd,
                RefractionGroup = group?.Id, RefractionEstimated = group?.Estimate ?? false,
            }, true, target, node,
                $"zenith angle to {x.Target} from the rounds of the {item}"));
            if (!double.IsNaN(x.SlopeDistance))
                output.Add(new(new SlopeDistanceObservation(at, x.Target, Length.FromMetres(x.SlopeDistance), hi.Value,
                    th) { Source = src }, true, target, node,
                    $"slope distance to {x.Target} from the rounds of the {item}"));
        }
        specs.Rounds.Add(new SetupRounds(at, setId, $"{ctx.File}:{Line(m)}",
            [.. setNodes.Select(n => $"{ctx.File}:{Line(n)}")], reduced));
        return spec with { Procedure = reduced.Procedure };
    }

    /// <summary>The setup's instrument height (0 to 100 m), required with zenith angles and slope distances.</summary>
    private static Length InstrumentHeight(Context ctx, YamlMappingNode m, string item, LengthPattern lengths)
    {
        var hiNode = ctx.Child(m, "instrument_height")
            ?? throw ctx.Error(m, item, "'instrument_height' is missing: slope distances and zenith angles need it");
        var hi = ctx.ParseLength(hiNode, lengths, ctx.Scalar(hiNode, item + " instrument_height"),
            item + " instrument_height");
        return hi.Metres is >= 0 and <= 100 ? hi
            : throw ctx.Error(hiNode, item + " instrument_height",
                $"the instrument height must be between 0 and 100 m above the mark, not {hi.Metres} m");
    }

    /// <summary>A target's height: required in its reading of the first set; a later set may repeat it, unchanged.
    /// </summary>
    private static Length RoundsTargetHeight(Context ctx, List<List<YamlMappingNode>> readingNodes, TargetFigures x,
        string item, LengthPattern lengths)
    {
        Length? height = null;
        for (int s = 0; s < readingNodes.Count; s++)
        {
            var node = readingNodes[s].First(r => ctx.RequiredString(r, "to", item) == x.Target);
            string what = $"reading of {x.Target} in set {s + 1} of the {item}";
            if (ctx.Child(node, "target_height") is not YamlNode th)
            {
                if (s == 0) throw ctx.Error(node, what, "'target_height' is missing: a zenith angle needs it");
                continue;
            }
            var t = ctx.ParseLength(th, lengths, ctx.Scalar(th, what + " target_height"), what + " target_height");
            if (!(Math.Abs(t.Metres) <= 100))
                throw ctx.Error(th, what + " target_height", $"the target height {t.Metres} m is not within ±100 m");
            if (height is Length h && h.Metres != t.Metres)
                throw ctx.Error(th, what + " target_height", "the target height changes between the sets: book the " +
                    "sets with another target height as a setup of their own");
            height ??= t;
        }
        return height!.Value;
    }

    /// <summary>Warnings for setups whose spread over the sets fails its test (docs/input-format.md, "Rounds in
    /// both faces": a warning, not an error).</summary>
    private static IEnumerable<string> RoundsWarnings(IEnumerable<SetupRounds> rounds, ProjectUnits units)
    {
        string F(double radians) =>
            (radians / units.AngleSd.RadiansPerUnit()).ToString("0.0", CultureInfo.InvariantCulture) + " " +
            units.AngleSd.Symbol();
        foreach (var r in rounds.Where(r => !r.Reduction.Passes))
        {
            var red = r.Reduction;
            var failing = red.Targets.Where(t => t.DirectionTest is { Passes: false } || t.ZenithTest is
                { Passes: false }).Select(t => t.Target).ToList();
            var parts = new List<string>();
            if (red.Directions is SpreadTest d && !d.Passes)
                parts.Add($"directions s = {F(d.Empirical)} > {F(d.Bound)}");
            if (red.Zeniths is SpreadTest z && !z.Passes)
                parts.Add($"zenith angles s = {F(z.Empirical)} > {F(z.Bound)}");
            if (failing.Count > 0) parts.Add("targets " + string.Join(", ", failing));
            yield return $"the rounds of the setup at {r.Station} ({r.Source}) spread more over their " +
                $"{red.Sets.Count} sets than the instrument's ISO 17123-3 figures allow " +
                $"({string.Join("; ", parts)}): " +
                "check the pointings and the instrument";
        }
    }
}

/// <summary>The rounds of one setup as read and reduced (docs/input-format.md, "Rounds in both faces").</summary>
/// <param name="Station">The station occupied.</param>
/// <param name="SetId">The direction set the reduced directions form (<c>station/k</c>), or null without horizontal
/// readings.</param>
/// <param name="Source">File and line of the setup.</param>
/// <param name="SetSources">File and line of each set.</param>
/// <param name="Reduction">The reduction.</param>
public sealed record SetupRounds(string Station, string? SetId, string Source, IReadOnlyList<string> SetSources,
    ReducedRounds Reduction);
