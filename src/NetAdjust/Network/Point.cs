namespace NetAdjust.Network;

/// <summary>Which coordinate components of a point are held fixed.</summary>
[Flags]
public enum Fixity
{
    /// <summary>Nothing is held.</summary>
    None = 0,

    /// <summary>Easting held.</summary>
    E = 1,

    /// <summary>Northing held.</summary>
    N = 2,

    /// <summary>Height held.</summary>
    H = 4,

    /// <summary>Easting and northing held.</summary>
    EN = E | N,

    /// <summary>All three held.</summary>
    ENH = E | N | H,
}

/// <summary>
/// A survey point: an id and its given or approximate coordinates (metres; any may be unknown), which components
/// are held fixed, and which are weighted control (observed with a standard deviation).
/// </summary>
/// <param name="Id">The point's id, unique in its network (compared ordinally).</param>
/// <exception cref="ArgumentException">When the id is empty or white space, or a standard deviation is given that is
/// not positive and finite (<see cref="ArgumentOutOfRangeException"/>, naming the property).</exception>
public sealed record Point(string Id)
{
    /// <summary>The point's id, unique in its network (compared ordinally).</summary>
    public string Id { get; init => field = Guards.Id(value, nameof(Id)); } = Guards.Id(Id, nameof(Id));

    /// <summary>Easting in metres: given (control) or approximate; null when unknown.</summary>
    public double? E { get; init; }

    /// <summary>Northing in metres: given (control) or approximate; null when unknown.</summary>
    public double? N { get; init; }

    /// <summary>Height in metres: given (control) or approximate; null when unknown.</summary>
    public double? H { get; init; }

    /// <summary>Components held fixed. A fixed component must have a value.</summary>
    public Fixity Fixed { get; init; }

    /// <summary>Standard deviation (m) of the given easting when it is weighted control; null otherwise.</summary>
    public double? SdE
    {
        get;
        init => field = value is double sd ? Guards.PositiveSd(sd, nameof(SdE), "m") : null;
    }

    /// <summary>Standard deviation (m) of the given northing when it is weighted control; null otherwise.</summary>
    public double? SdN
    {
        get;
        init => field = value is double sd ? Guards.PositiveSd(sd, nameof(SdN), "m") : null;
    }

    /// <summary>Standard deviation (m) of the given height when it is weighted control; null otherwise.</summary>
    public double? SdH
    {
        get;
        init => field = value is double sd ? Guards.PositiveSd(sd, nameof(SdH), "m") : null;
    }

    /// <summary>Where the point was defined (e.g. <c>site.yaml:12</c>), for messages; may be null.</summary>
    public string? Source { get; init; }

    /// <summary>True when the component is held fixed.</summary>
    /// <param name="component">One of <see cref="Fixity.E"/>, <see cref="Fixity.N"/>, <see cref="Fixity.H"/>.</param>
    public bool IsFixed(Fixity component) => (Fixed & component) == component;

    /// <summary>True when any component is fixed or weighted: the point is control.</summary>
    public bool IsControl => Fixed != Fixity.None || SdE.HasValue || SdN.HasValue || SdH.HasValue;
}
