namespace NetAdjust.Reduction;

/// <summary>
/// The instrument figures and the tolerances of a reduction of rounds.
/// </summary>
public sealed record RoundsOptions
{
    /// <summary>The default tolerance of a face difference: 60″ (common practice: an instrument in adjustment keeps
    /// twice its collimation and index errors well inside one minute of arc).</summary>
    public const double DefaultFaceTolerance = 60.0 / Units.Angle.ArcsecondsPerRadian;

    /// <summary>Creates options.</summary>
    /// <param name="directionSd">ISO 17123-3 σ of one horizontal direction observed once in both faces (&gt; 0).
    /// </param>
    /// <param name="zenithSd">ISO 17123-3 σ of one zenith angle in both faces (zero: no zenith test).</param>
    /// <exception cref="InvalidInputException">When a standard deviation is not finite, or not positive for
    /// directions, or negative for zenith angles.</exception>
    public RoundsOptions(Units.Angle directionSd, Units.Angle zenithSd)
        : this(directionSd.Radians, zenithSd.Radians)
    {
    }

    /// <summary>Creates options from standard deviations in radians (the project reader's SI values).</summary>
    internal RoundsOptions(double directionSd, double zenithSd)
    {
        if (!(directionSd > 0) || !double.IsFinite(directionSd))
            throw new InvalidInputException("the direction standard deviation of the rounds must be positive");
        if (!(zenithSd >= 0) || !double.IsFinite(zenithSd))
            throw new InvalidInputException("the zenith standard deviation of the rounds must not be negative");
        DirectionSd = directionSd;
        ZenithSd = zenithSd;
    }

    /// <summary>ISO 17123-3 σ of one horizontal direction in both faces, radians.</summary>
    internal double DirectionSd { get; }

    /// <summary>ISO 17123-3 σ of one zenith angle in both faces, radians; 0 when the instrument states none.</summary>
    internal double ZenithSd { get; }

    /// <summary>The largest face difference accepted, radians: |L − R ± 180°| for a horizontal reading and
    /// |z_L + z_R − 360°| for a zenith angle (twice the collimation or index error plus the pointing errors).
    /// </summary>
    internal double FaceTolerance { get; init; } = DefaultFaceTolerance;

    /// <summary>ISO 17123-3 σ of one horizontal direction in both faces.</summary>
    public Units.Angle DirectionSdAngle => Units.Angle.FromRadians(DirectionSd);

    /// <summary>ISO 17123-3 σ of one zenith angle in both faces; zero when the instrument states none.</summary>
    public Units.Angle ZenithSdAngle => Units.Angle.FromRadians(ZenithSd);

    /// <summary>The largest face difference accepted: |L − R ± 180°| for a horizontal reading and
    /// |z_L + z_R − 360°| for a zenith angle (twice the collimation or index error plus the pointing errors); 60″
    /// unless set.</summary>
    public Units.Angle FaceToleranceAngle
    {
        get => Units.Angle.FromRadians(FaceTolerance);
        init => FaceTolerance = value.Radians;
    }

    /// <summary>Significance level α of the spread tests (default 0.05, as ISO 17123-3).</summary>
    public double Alpha { get; init; } = 0.05;
}
