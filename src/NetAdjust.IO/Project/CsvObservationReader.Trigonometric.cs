using NetAdjust.Geodesy;
using NetAdjust.IO.Text;
using NetAdjust.Network;
using NetAdjust.Units;

namespace NetAdjust.IO.Project;

/// <summary>
/// CSV rows of slope distances and zenith angles (columns <c>instrument_height</c>, <c>target_height</c> and, for
/// zenith angles, <c>refraction_group</c>), and rows of total-station observations weighted from the project's
/// specifications (columns <c>instrument</c>, <c>target</c>, <c>sets</c>, <c>faces</c>) instead of an <c>sd</c>
/// (docs/input-format.md, "CSV observation files").
/// </summary>
internal static partial class CsvObservationReader
{
    /// <summary>The columns of this part (a property, so that <see cref="Columns"/> can use it whatever the order
    /// of static initialisation between the files).</summary>
    private static string[] TotalStationColumns =>
        ["instrument_height", "target_height", "instrument", "target", "sets", "faces", "refraction_group"];

    /// <summary>The refraction coefficient a zenith angle takes: k, σ_k, its group (null for the project's) and
    /// whether k is estimated.</summary>
    internal readonly record struct RefractionChoice(double K, double Sd, string? Group, bool Estimate);

    /// <summary>What the project file declares that CSV rows may name.</summary>
    /// <param name="Instrument">The total station of an id, or null when not declared.</param>
    /// <param name="Target">The target of an id, or null when not declared.</param>
    /// <param name="Refraction">The refraction of a group id (null id: the project's), or null when the group is
    /// not declared.</param>
    /// <param name="HeightHeld">True when the point's height is held.</param>
    internal sealed record CsvSpecifications(
        Func<string, TotalStationSpecification?> Instrument, Func<string, TargetSpecification?> Target,
        Func<string?, RefractionChoice?> Refraction, Func<string, bool> HeightHeld)
    {
        /// <summary>The project's grid system, which baselines are made with (null: none).</summary>
        public GridSystem? BaselineGrid { get; init; }

        /// <summary>The frame parameters of the project's baselines (null: none).</summary>
        public BaselineFrame? BaselineFrame { get; init; }
    }

    private static bool IsTrigonometric(ObservationKind kind) =>
        kind is ObservationKind.SlopeDistance or ObservationKind.Zenith;

    /// <summary>Fields that belong to other kinds, or that need an instrument, are refused.</summary>
    private static void CheckTotalStationFields(ObservationKind kind, Func<string, string> get, string file, int line,
        string item)
    {
        if (!IsTrigonometric(kind))
            foreach (var name in new[] { "instrument_height", "target_height" })
                if (get(name).Length > 0)
                    throw new ProjectFileException(file, line, item,
                        $"the '{name}' field is for slope distances and zenith angles only");
        if (kind != ObservationKind.Zenith && get("refraction_group").Length > 0)
            throw new ProjectFileException(file, line, item, "the 'refraction_group' field is for zenith angles only");
        if (get("instrument").Length == 0)
            foreach (var name in new[] { "target", "sets", "faces" })
                if (get(name).Length > 0)
                    throw new ProjectFileException(file, line, item, $"the '{name}' field needs an 'instrument'");
    }

    /// <summary>The weighting of a row from its <c>instrument</c>, <c>target</c>, <c>sets</c> and <c>faces</c>
    /// fields.</summary>
    private static ObservationWeighting InstrumentWeighting(ObservationKind kind, Func<string, string> get,
        CsvSpecifications? specs, string file, int line, string item)
    {
        ProjectFileException Bad(string problem) => new(file, line, item, problem);
        if (kind is not (ObservationKind.Distance or ObservationKind.Direction or ObservationKind.Angle
            or ObservationKind.SlopeDistance or ObservationKind.Zenith))
            throw Bad($"a {kind.Name().Replace('_', ' ')} is not weighted from an instrument: give its 'sd'");
        string id = get("instrument");
        var ts = specs?.Instrument(id) ?? throw Bad($"instrument '{id}' is not defined under 'instruments'");
        TargetSpecification? target = null;
        if (get("target") is { Length: > 0 } tid)
            target = specs.Target(tid) ?? throw Bad($"target '{tid}' is not defined under 'targets'");
        int sets = 1;
        if (get("sets") is { Length: > 0 } st
            && !(int.TryParse(st, System.Globalization.NumberStyles.None,
                System.Globalization.CultureInfo.InvariantCulture, out sets) && sets is >= 1 and <= 1000))
            throw Bad("'sets' must be a whole number from 1 to 1000");
        var faces = Faces.Both;
        if (get("faces") is { Length: > 0 } ft)
        {
            var r = OptionGrammars.Faces.Parse(ft);
            faces = r.Success ? r.Value : throw Bad($"faces: {r.Error}");
        }
        if (kind is ObservationKind.Distance or ObservationKind.SlopeDistance && ts.Edm is null)
            throw Bad($"instrument {ts.Id} has no EDM specification, so it cannot weight a distance");
        if (kind == ObservationKind.Zenith && !(ts.ZenithSd > 0))
            throw Bad($"instrument {ts.Id} has no zenith_sd, so it cannot weight a zenith angle");
        return new ObservationWeighting
        {
            Instrument = ts, Target = target, Procedure = new ObservingProcedure(sets, faces),
        };
    }

    /// <summary>A slope distance or zenith angle row (limits as in a setup of the project file).</summary>
    private static Observation Trigonometric(ObservationKind kind, string from, string to, string value,
        Func<string, string> get, Func<string, Length> length, AnglePattern angles, CsvSpecifications? specs,
        string file, int line, string item)
    {
        ProjectFileException Bad(string problem) => new(file, line, item, problem);
        Length Field(string name) => get(name) is { Length: > 0 } t ? length(t)
            : throw Bad($"the '{name}' field is empty: slope distances and zenith angles need it");
        var hi = Field("instrument_height");
        if (!(hi.Metres >= 0) || hi.Metres > 100)
            throw Bad($"the instrument height must be between 0 and 100 m above the mark, not {hi.Metres} m");
        var th = Field("target_height");
        if (!(Math.Abs(th.Metres) <= 100))
            throw Bad($"the target height {th.Metres} m is not within ±100 m");
        if (value.Length == 0) throw Bad("the 'value' field is empty");
        if (kind == ObservationKind.SlopeDistance)
        {
            var d = length(value);
            return d.Metres > 0 ? new SlopeDistanceObservation(from, to, d, hi, th)
                : throw Bad($"a slope distance must be positive, not {value}");
        }
        var r = angles.Parse(value);
        var z = r.Success ? r.Value : throw Bad(r.Error!);
        if (!(z.Radians > 0 && z.Radians < Math.PI))
            throw Bad($"a zenith angle must lie between 0 and 180° (0 at the zenith), not {value}");
        string? group = get("refraction_group") is { Length: > 0 } g ? g : null;
        var k = specs is null ? new RefractionChoice(Geometry.SpatialGeometry.DefaultRefraction,
                Geometry.SpatialGeometry.DefaultRefractionSd, null, false)
            : specs.Refraction(group) ?? throw Bad($"refraction group '{group}' is not defined under " +
                "'refraction_groups'");
        return new ZenithObservation(from, to, z, hi, th)
        {
            Refraction = k.K, RefractionSd = k.Sd, RefractionGroup = k.Group, RefractionEstimated = k.Estimate,
        };
    }

    /// <summary>As in a setup: a slope distance needs a zenith angle between the same points in the same file,
    /// unless both heights are held.</summary>
    private static void CheckSlopesHaveZeniths(List<Observation> rows,
        List<(SlopeDistanceObservation Slope, int Line, string Item)> slopes, CsvSpecifications? specs, string file)
    {
        if (slopes.Count == 0) return;
        var zeniths = rows.OfType<ZenithObservation>().Select(z => (z.From, z.To)).ToHashSet();
        foreach (var (slope, line, item) in slopes)
        {
            bool held = specs is not null && specs.HeightHeld(slope.From) && specs.HeightHeld(slope.To);
            if (!held && !zeniths.Contains((slope.From, slope.To)))
                throw new ProjectFileException(file, line, item, "a slope distance needs a zenith angle from the " +
                    "same station to the same target in the same file (or both heights held): alone it cannot " +
                    "separate the horizontal distance from the height difference");
        }
    }
}
