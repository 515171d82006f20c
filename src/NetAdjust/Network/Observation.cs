using NetAdjust.Units;

namespace NetAdjust.Network;

/// <summary>The kinds of observation. The JSON and report names are given by
/// <see cref="ObservationKinds.Name"/>.</summary>
public enum ObservationKind
{
    /// <summary>Horizontal distance.</summary>
    Distance,

    /// <summary>Horizontal direction: a circle reading in a set with its own orientation unknown.</summary>
    Direction,

    /// <summary>Horizontal angle at a station, clockwise from backsight to foresight.</summary>
    Angle,

    /// <summary>Grid azimuth, clockwise from grid north.</summary>
    Azimuth,

    /// <summary>Height difference H(to) − H(from), e.g. from levelling.</summary>
    HeightDifference,

    /// <summary>Slope distance from the instrument to the target (chord), with instrument and target heights.</summary>
    SlopeDistance,

    /// <summary>Zenith angle (0 at the zenith) from the instrument to the target, with instrument and target
    /// heights.</summary>
    Zenith,

    /// <summary>One component (ΔX, ΔY or ΔZ) of a GNSS baseline: an earth-centred vector to − from whose three
    /// components share one 3×3 covariance (<see cref="BaselineObservation"/>).</summary>
    Baseline,
}

/// <summary>
/// The identity of observation kinds: their file and JSON names. Everything else about a kind is in its
/// description in <c>NetAdjust.Observations</c> (see <c>ObservationKindRegistry</c>).
/// </summary>
public static class ObservationKinds
{
    /// <summary>The snake_case name used in files and JSON (e.g. <c>height_difference</c>).</summary>
    /// <param name="kind">The kind.</param>
    public static string Name(this ObservationKind kind) => kind switch
    {
        ObservationKind.Distance => "distance",
        ObservationKind.Direction => "direction",
        ObservationKind.Angle => "angle",
        ObservationKind.Azimuth => "azimuth",
        ObservationKind.HeightDifference => "height_difference",
        ObservationKind.SlopeDistance => "slope_distance",
        ObservationKind.Zenith => "zenith",
        ObservationKind.Baseline => "baseline",
        _ => throw new ArgumentOutOfRangeException(nameof(kind)),
    };

    /// <summary>All kinds in documentation order.</summary>
    public static IReadOnlyList<ObservationKind> All { get; } = Enum.GetValues<ObservationKind>();

    /// <summary>True when the kind's value (and so its standard deviation) is an angle; the same answer as the
    /// kind's description in <c>NetAdjust.Observations</c> (a test keeps them equal).</summary>
    internal static bool ValueIsAngle(ObservationKind kind) => kind switch
    {
        ObservationKind.Distance or ObservationKind.HeightDifference or ObservationKind.SlopeDistance
            or ObservationKind.Baseline => false,
        ObservationKind.Direction or ObservationKind.Angle or ObservationKind.Azimuth or ObservationKind.Zenith => true,
        _ => throw new ArgumentOutOfRangeException(nameof(kind)),
    };
}

/// <summary>
/// One measured quantity with its a-priori standard deviation. The constructors take values typed as
/// <see cref="Length"/> or <see cref="Angle"/> and refuse impossible ones (empty ids, a distance that is not positive,
/// a value that is not finite) with an <see cref="ArgumentException"/> naming the parameter; <see cref="Value"/> is
/// the value in SI units (metres or radians) and <see cref="Sd"/> the standard deviation, typed like the value.
/// </summary>
public abstract record Observation
{
    /// <summary>The kind.</summary>
    public abstract ObservationKind Kind { get; }

    /// <summary>The measured value in SI units (metres or radians).</summary>
    public abstract double Value { get; }

    /// <summary>The measured value, typed: a length or an angle by the kind.</summary>
    public Quantity ObservedValue => Quantity.FromSi(Value, ObservationKinds.ValueIsAngle(Kind));

    /// <summary>The station (instrument point) for angles and directions; null for other kinds.</summary>
    public virtual string? At => null;

    /// <summary>The from point (backsight for an angle; the station for a direction).</summary>
    public abstract string From { get; }

    /// <summary>The to point (foresight for an angle; the target for a direction).</summary>
    public abstract string To { get; }

    /// <summary>
    /// A-priori standard deviation in SI units (metres or radians) for the adjustment's hot path; NaN for an
    /// observation whose <see cref="Weighting"/> gives it. Internal: the public, typed view is <see cref="Sd"/>.
    /// Not checked here (the project reader checks it later, naming file and line).
    /// </summary>
    internal double StandardDeviation { get; init; } = double.NaN;

    /// <summary>
    /// The a-priori standard deviation, typed like the value: a length for distances, slope distances and height
    /// differences, an angle for directions, angles, azimuths and zenith angles (e.g.
    /// <c>{ Sd = Angle.FromArcseconds(2) }</c>). Null when the stochastic model derives it from
    /// <see cref="Weighting"/>; the adjustment result's network holds the derived value.
    /// </summary>
    /// <exception cref="ArgumentException">On init, when a length is given to an angular kind or an angle to a
    /// linear one.</exception>
    public ObservationSd? Sd
    {
        get => double.IsNaN(StandardDeviation) ? null
            : ObservationSd.FromSi(StandardDeviation, ObservationKinds.ValueIsAngle(Kind));
        init
        {
            if (value is ObservationSd sd && sd.IsAngle != ObservationKinds.ValueIsAngle(Kind))
                throw new ArgumentException($"A {Kind.Name().Replace('_', ' ')} takes its standard deviation as " +
                    (sd.IsAngle ? "a length, not an angle." : "an angle, not a length."), nameof(Sd));
            if (value is ObservationSd given) Guards.PositiveSd(given.Si, nameof(Sd), given.IsAngle ? "rad" : "m");
            StandardDeviation = value?.Si ?? double.NaN;
        }
    }

    /// <summary>Where the observation was read (e.g. <c>site.yaml:41</c>), for messages; may be null.</summary>
    public string? Source { get => _source.Text; init => _source = new SourceText(value); }

    /// <summary>The same place as <see cref="Source"/>, kept as file and line by a reader of many rows (its text is
    /// made when asked); equality and hash code are those of the text.</summary>
    internal SourceText SourcePlace { get => _source; init => _source = value; }

    private readonly SourceText _source;

    /// <summary>The value's text as booked in the file (e.g. <c>123.4567</c> or <c>123-45-12.3</c>), for the blunder
    /// diagnosis (transposed digits); null when not known.</summary>
    public string? BookedText { get => _booked.Text; init => _booked = new BookedValueText(value); }

    /// <summary>The same text as <see cref="BookedText"/>, a plain decimal kept as its digits by a reader of many rows
    /// (its text is made when asked); equality and hash code are those of the text.</summary>
    internal BookedValueText BookedForm { get => _booked; init => _booked = value; }

    private readonly BookedValueText _booked;

    /// <summary>
    /// True when the observation is set aside (e.g. after a blunder hunt): it gets no weight in the adjustment but
    /// is still reported, with its misclosure against the adjusted coordinates. Nothing is deleted from the data.
    /// </summary>
    public bool Excluded
    {
        get => _marks?.Excluded ?? false;
        init
        {
            if (value != Excluded)
                _marks = Marks.Keep((_marks ?? Marks.None) with { Excluded = value });
        }
    }

    /// <summary>
    /// The factor (≥ 1 normally; any positive value) by which the user re-weighted this observation's standard
    /// deviation; <see cref="Sd"/> already includes it. 1 when not re-weighted. For reports only.
    /// </summary>
    public double SdFactor
    {
        get => _marks?.SdFactor ?? 1.0;
        init
        {
            if (BitConverter.DoubleToInt64Bits(value) != BitConverter.DoubleToInt64Bits(SdFactor))
                _marks = Marks.Keep((_marks ?? Marks.None) with { SdFactor = value });
        }
    }

    /// <summary>
    /// The specifications the standard deviation is derived from (instrument, target, procedure, or level), or null
    /// when the standard deviation is given directly. With a weighting and no <see cref="Sd"/> (null),
    /// the stochastic model derives σ (times <see cref="SdFactor"/>) at the adjustment's coordinates; a finite
    /// standard deviation (e.g. set by a re-weighting procedure) is used as it is, the weighting then giving the
    /// shape of its error budget.
    /// </summary>
    public ObservationWeighting? Weighting
    {
        get => _marks?.Weighting;
        init
        {
            if (!ReferenceEquals(value, Weighting))
                _marks = Marks.Keep((_marks ?? Marks.None) with { Weighting = value });
        }
    }

    /// <summary>
    /// The instrument setup the observation was made at (unique in the network), or null. Observations of one
    /// setup share the instrument's centering error, which the correlated weight model uses.
    /// </summary>
    public string? SetupId
    {
        get => _marks?.SetupId;
        init
        {
            if (!ReferenceEquals(value, SetupId))
                _marks = Marks.Keep((_marks ?? Marks.None) with { SetupId = value });
        }
    }

    /// <summary>
    /// <see cref="Excluded"/>, <see cref="SdFactor"/>, <see cref="Weighting"/> and <see cref="SetupId"/>, kept in one
    /// small record that most observations of a large file do not need (null when all four have their defaults): an
    /// observation takes one reference for them instead of 32 bytes, and a million-point network 300 MB less. The
    /// record has value equality, so an observation's equality and hash code are as with four fields of its own.
    /// A member set to the value it has changes nothing (a reader writes the defaults into every row).
    /// </summary>
    private readonly Marks? _marks;

    /// <summary>The four members held by <see cref="_marks"/>; <see cref="None"/> holds their defaults.</summary>
    private sealed record Marks(bool Excluded, double SdFactor, ObservationWeighting? Weighting, string? SetupId)
    {
        public static readonly Marks None = new(false, 1.0, null, null);

        /// <summary>The marks to keep: null for the defaults.</summary>
        public static Marks? Keep(Marks marks) => marks == None ? null : marks;
    }

    /// <summary>All points the observation involves, without repeats.</summary>
    public IEnumerable<string> Points => Distinct(At, From, To);

    /// <summary>The ids in order without nulls and repeats; no LINQ and no array (the reader and the adjustment ask
    /// it once per observation, and a result holds nothing that can be changed).</summary>
    private static IEnumerable<string> Distinct(string? at, string? from, string? to)
    {
        if (at is not null) yield return at;
        if (from is not null && from != at) yield return from;
        if (to is not null && to != at && to != from) yield return to;
    }

    /// <summary>A short description for messages, e.g. <c>distance T1→T2 (site.yaml:41)</c>.</summary>
    public string Describe()
    {
        string what = Kind == ObservationKind.Angle
            ? $"angle at {At} from {From} to {To}"
            : $"{Kind.Name().Replace('_', ' ')} {From}→{To}";
        string? source = Source;
        return source is null ? what : $"{what} ({source})";
    }
}

/// <summary>A horizontal distance between two points.</summary>
/// <param name="From">Instrument point.</param>
/// <param name="To">Target point.</param>
/// <param name="Distance">The measured horizontal distance.</param>
public sealed record DistanceObservation(string From, string To, Length Distance) : Observation
{
    /// <inheritdoc />
    public override ObservationKind Kind => ObservationKind.Distance;

    /// <inheritdoc />
    public override double Value => Distance.Metres;

    /// <inheritdoc />
    public override string From { get; } = Guards.Id(From, nameof(From));

    /// <inheritdoc />
    public override string To { get; } = Guards.Id(To, nameof(To));

    /// <summary>The measured horizontal distance (positive).</summary>
    public Length Distance { get; init => field = Guards.PositiveLength(value, nameof(Distance), "a distance"); } =
        Guards.PositiveLength(Distance, nameof(Distance), "a distance");
}

/// <summary>
/// A horizontal direction (circle reading) from a station to a target, belonging to a set that shares one
/// orientation unknown. Reading = azimuth − orientation.
/// </summary>
/// <param name="Station">The instrument point.</param>
/// <param name="Target">The target point.</param>
/// <param name="Reading">The circle reading.</param>
/// <param name="SetId">The set's id, unique in the network; all directions of a set share its orientation
/// unknown.</param>
public sealed record DirectionObservation(string Station, string Target, Angle Reading, string SetId) : Observation
{
    /// <inheritdoc />
    public override ObservationKind Kind => ObservationKind.Direction;

    /// <summary>The instrument point.</summary>
    public string Station { get; init => field = Guards.Id(value, nameof(Station)); } =
        Guards.Id(Station, nameof(Station));

    /// <summary>The target point.</summary>
    public string Target { get; init => field = Guards.Id(value, nameof(Target)); } = Guards.Id(Target, nameof(Target));

    /// <summary>The circle reading.</summary>
    public Angle Reading { get; init => field = Guards.FiniteAngle(value, nameof(Reading), "a circle reading"); } =
        Guards.FiniteAngle(Reading, nameof(Reading), "a circle reading");

    /// <summary>The set's id, unique in the network.</summary>
    public string SetId { get; init => field = Guards.Id(value, nameof(SetId)); } = Guards.Id(SetId, nameof(SetId));

    /// <inheritdoc />
    public override double Value => Reading.Radians;

    /// <inheritdoc />
    public override string? At => Station;

    /// <inheritdoc />
    public override string From => Station;

    /// <inheritdoc />
    public override string To => Target;
}

/// <summary>A horizontal angle at a station, measured clockwise from the backsight to the foresight.</summary>
/// <param name="Station">The instrument point.</param>
/// <param name="Backsight">The backsight point.</param>
/// <param name="Foresight">The foresight point.</param>
/// <param name="Measured">The measured angle.</param>
public sealed record AngleObservation(string Station, string Backsight, string Foresight, Angle Measured) : Observation
{
    /// <inheritdoc />
    public override ObservationKind Kind => ObservationKind.Angle;

    /// <summary>The instrument point.</summary>
    public string Station { get; init => field = Guards.Id(value, nameof(Station)); } =
        Guards.Id(Station, nameof(Station));

    /// <summary>The backsight point.</summary>
    public string Backsight { get; init => field = Guards.Id(value, nameof(Backsight)); } =
        Guards.Id(Backsight, nameof(Backsight));

    /// <summary>The foresight point.</summary>
    public string Foresight { get; init => field = Guards.Id(value, nameof(Foresight)); } =
        Guards.Id(Foresight, nameof(Foresight));

    /// <summary>The measured angle.</summary>
    public Angle Measured { get; init => field = Guards.FiniteAngle(value, nameof(Measured), "an angle"); } =
        Guards.FiniteAngle(Measured, nameof(Measured), "an angle");

    /// <inheritdoc />
    public override double Value => Measured.Radians;

    /// <inheritdoc />
    public override string? At => Station;

    /// <inheritdoc />
    public override string From => Backsight;

    /// <inheritdoc />
    public override string To => Foresight;
}

/// <summary>A grid azimuth from one point to another, clockwise from grid north.</summary>
/// <param name="From">The from point.</param>
/// <param name="To">The to point.</param>
/// <param name="Azimuth">The azimuth.</param>
public sealed record AzimuthObservation(string From, string To, Angle Azimuth) : Observation
{
    /// <inheritdoc />
    public override ObservationKind Kind => ObservationKind.Azimuth;

    /// <summary>The azimuth.</summary>
    public Angle Azimuth { get; init => field = Guards.FiniteAngle(value, nameof(Azimuth), "an azimuth"); } =
        Guards.FiniteAngle(Azimuth, nameof(Azimuth), "an azimuth");

    /// <inheritdoc />
    public override double Value => Azimuth.Radians;

    /// <inheritdoc />
    public override string From { get; } = Guards.Id(From, nameof(From));

    /// <inheritdoc />
    public override string To { get; } = Guards.Id(To, nameof(To));
}

/// <summary>A height difference H(to) − H(from), e.g. one levelling section.</summary>
/// <param name="From">The back point.</param>
/// <param name="To">The forward point.</param>
/// <param name="Difference">The measured height difference H(to) − H(from).</param>
/// <param name="LineLength">The levelled length of the section, for weighting; null when not given.</param>
public sealed record HeightDifferenceObservation(string From, string To, Length Difference, Length? LineLength = null) :
    Observation
{
    /// <inheritdoc />
    public override ObservationKind Kind => ObservationKind.HeightDifference;

    /// <summary>The measured height difference H(to) − H(from).</summary>
    public Length Difference
    {
        get;
        init => field = Guards.FiniteLength(value, nameof(Difference), "a height difference");
    } = Guards.FiniteLength(Difference, nameof(Difference), "a height difference");

    /// <summary>The levelled length of the section (positive), or null.</summary>
    public Length? LineLength { get; init => field = value is Length l
        ? Guards.PositiveLength(l, nameof(LineLength), "a section length") : null; } =
        LineLength is Length length ? Guards.PositiveLength(length, nameof(LineLength), "a section length") : null;

    /// <inheritdoc />
    public override double Value => Difference.Metres;

    /// <inheritdoc />
    public override string From { get; } = Guards.Id(From, nameof(From));

    /// <inheritdoc />
    public override string To { get; } = Guards.Id(To, nameof(To));
}

/// <summary>
/// A slope distance measured by EDM from the instrument over <paramref name="From"/> to the target over
/// <paramref name="To"/>: the chord between the instrument's trunnion axis and the target.
/// </summary>
/// <param name="From">Instrument point.</param>
/// <param name="To">Target point.</param>
/// <param name="Distance">The measured slope distance (reduced for EDM constant and atmosphere).</param>
/// <param name="InstrumentHeight">Height of the instrument above the mark at <paramref name="From"/>.</param>
/// <param name="TargetHeight">Height of the target above the mark at <paramref name="To"/>.</param>
public sealed record SlopeDistanceObservation(
    string From, string To, Length Distance, Length InstrumentHeight, Length TargetHeight) : Observation
{
    /// <inheritdoc />
    public override ObservationKind Kind => ObservationKind.SlopeDistance;

    /// <summary>The measured slope distance (positive).</summary>
    public Length Distance
    {
        get;
        init => field = Guards.PositiveLength(value, nameof(Distance), "a slope distance");
    } = Guards.PositiveLength(Distance, nameof(Distance), "a slope distance");

    /// <summary>Height of the instrument above the mark (zero or more).</summary>
    public Length InstrumentHeight
    {
        get;
        init => field = Guards.NonNegativeLength(value, nameof(InstrumentHeight), "an instrument height");
    } = Guards.NonNegativeLength(InstrumentHeight, nameof(InstrumentHeight), "an instrument height");

    /// <summary>Height of the target above the mark.</summary>
    public Length TargetHeight
    {
        get;
        init => field = Guards.FiniteLength(value, nameof(TargetHeight), "a target height");
    } = Guards.FiniteLength(TargetHeight, nameof(TargetHeight), "a target height");

    /// <summary>The reference height H0 of the plane coordinates: the height at which a distance between plane
    /// coordinates is the true horizontal distance (docs/methods.md, "Spatial model"); zero by default (the plane at
    /// the height datum). The project reader sets it for the whole project.</summary>
    /// <exception cref="ArgumentOutOfRangeException">On init, when H0 is not finite.</exception>
    public Length PlaneHeight
    {
        get;
        init => field = Guards.FiniteLength(value, nameof(PlaneHeight), "a plane reference height");
    }

    /// <inheritdoc />
    public override double Value => Distance.Metres;

    /// <inheritdoc />
    public override string From { get; } = Guards.Id(From, nameof(From));

    /// <inheritdoc />
    public override string To { get; } = Guards.Id(To, nameof(To));
}

/// <summary>
/// A zenith angle (0 at the zenith, π/2 horizontal) from the instrument over <paramref name="From"/> to the target
/// over <paramref name="To"/>, as observed through the refracted line of sight.
/// </summary>
/// <param name="From">Instrument point.</param>
/// <param name="To">Target point.</param>
/// <param name="Zenith">The measured zenith angle (the mean of both faces, or one face corrected for index
/// error).</param>
/// <param name="InstrumentHeight">Height of the instrument above the mark at <paramref name="From"/>.</param>
/// <param name="TargetHeight">Height of the target above the mark at <paramref name="To"/>.</param>
public sealed record ZenithObservation(
    string From, string To, Angle Zenith, Length InstrumentHeight, Length TargetHeight) : Observation
{
    /// <inheritdoc />
    public override ObservationKind Kind => ObservationKind.Zenith;

    /// <summary>The measured zenith angle.</summary>
    public Angle Zenith { get; init => field = Guards.FiniteAngle(value, nameof(Zenith), "a zenith angle"); } =
        Guards.FiniteAngle(Zenith, nameof(Zenith), "a zenith angle");

    /// <summary>Height of the instrument above the mark (zero or more).</summary>
    public Length InstrumentHeight
    {
        get;
        init => field = Guards.NonNegativeLength(value, nameof(InstrumentHeight), "an instrument height");
    } = Guards.NonNegativeLength(InstrumentHeight, nameof(InstrumentHeight), "an instrument height");

    /// <summary>Height of the target above the mark.</summary>
    public Length TargetHeight
    {
        get;
        init => field = Guards.FiniteLength(value, nameof(TargetHeight), "a target height");
    } = Guards.FiniteLength(TargetHeight, nameof(TargetHeight), "a target height");

    /// <summary>The reference height H0 of the plane coordinates: the height at which a distance between plane
    /// coordinates is the true horizontal distance (docs/methods.md, "Spatial model"); zero by default (the plane at
    /// the height datum). The project reader sets it for the whole project.</summary>
    /// <exception cref="ArgumentOutOfRangeException">On init, when H0 is not finite.</exception>
    public Length PlaneHeight
    {
        get;
        init => field = Guards.FiniteLength(value, nameof(PlaneHeight), "a plane reference height");
    }

    /// <inheritdoc />
    public override double Value => Zenith.Radians;

    /// <inheritdoc />
    public override string From { get; } = Guards.Id(From, nameof(From));

    /// <inheritdoc />
    public override string To { get; } = Guards.Id(To, nameof(To));

    /// <summary>The refraction coefficient k of the line of sight (the project's or its group's; common practice
    /// 0.13); the start value of the group's unknown when <see cref="RefractionEstimated"/>.</summary>
    /// <exception cref="ArgumentOutOfRangeException">On init, when k is not finite.</exception>
    public double Refraction
    {
        get;
        init => field = double.IsFinite(value) ? value
            : throw new ArgumentOutOfRangeException(nameof(Refraction), value, "k must be a finite number.");
    } = 0.13;

    /// <summary>The group of observations that shares one refraction coefficient (e.g. one day's sights), or null
    /// for the project's.</summary>
    public string? RefractionGroup { get; init; }

    /// <summary>The standard deviation σ_k of the assumed refraction coefficient (≥ 0; 0 counts none): it enters
    /// the error budget of a zenith angle weighted from specifications as σ_k·s/(2R) radians when k is assumed, not
    /// when it is estimated (default 0.05, common practice).</summary>
    /// <exception cref="ArgumentOutOfRangeException">On init, when σ_k is negative or not finite.</exception>
    public double RefractionSd
    {
        get;
        init => field = double.IsFinite(value) && value >= 0 ? value
            : throw new ArgumentOutOfRangeException(nameof(RefractionSd), value,
                "σ_k must be a finite number, 0 or more.");
    } = 0.05;

    /// <summary>True when the refraction coefficient of <see cref="RefractionGroup"/> (which must be set) is an
    /// unknown of the adjustment, with <see cref="Refraction"/> as its start value.</summary>
    public bool RefractionEstimated { get; init; }
}
