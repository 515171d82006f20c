namespace NetAdjust.Network;

/// <summary>Which frame parameters between the GNSS frame and the local control are unknowns.</summary>
public enum FrameParameterSet
{
    /// <summary>None: the baselines are taken in the frame of the control as they are.</summary>
    None,

    /// <summary>Three small rotations about the earth-centred X, Y and Z axes.</summary>
    Rotations,

    /// <summary>Three small rotations and a scale difference.</summary>
    RotationsAndScale,
}

/// <summary>
/// Frame parameters between the frame of the GNSS baselines and the frame of the local control (e.g. control in an
/// older realisation): the baselines' equation becomes Δ_gnss = (1 + μ)(I + Ω) Δ_local with Ω the skew matrix of the
/// small rotations (rx, ry, rz) in radians and μ the scale difference (docs/methods.md, "Frame parameters"). Each
/// parameter is an unknown, free or with an a-priori standard deviation about zero.
/// </summary>
/// <param name="Id">The frame's id (the owner of its unknowns in reports), e.g. <c>gnss</c>.</param>
/// <param name="Parameters">Which parameters are unknowns.</param>
public sealed record BaselineFrame(string Id, FrameParameterSet Parameters)
{
    /// <summary>The frame's id.</summary>
    public string Id { get; init => field = Guards.Id(value, nameof(Id)); } = Guards.Id(Id, nameof(Id));

    /// <summary>A-priori standard deviation of each rotation about zero (an angle), or null for free rotations.
    /// </summary>
    public Units.Angle? RotationSd
    {
        get;
        init => field = value is Units.Angle a
            ? (a.Radians > 0 && double.IsFinite(a.Radians) ? a
                : throw new ArgumentOutOfRangeException(nameof(RotationSd), a.Radians, "must be positive."))
            : null;
    }

    /// <summary>A-priori standard deviation of the scale difference about zero, in parts per million, or null for
    /// a free scale.</summary>
    public double? ScalePpmSd
    {
        get;
        init => field = value is double s
            ? (s > 0 && double.IsFinite(s) ? s
                : throw new ArgumentOutOfRangeException(nameof(ScalePpmSd), s, "must be positive."))
            : null;
    }

    /// <summary>True when the scale is an unknown.</summary>
    public bool HasScale => Parameters == FrameParameterSet.RotationsAndScale;

    /// <summary>True when the rotations are unknowns.</summary>
    public bool HasRotations => Parameters != FrameParameterSet.None;
}
