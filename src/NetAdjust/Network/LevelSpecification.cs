using NetAdjust.Units;

namespace NetAdjust.Network;

/// <summary>
/// A level: either the ISO 17123-2 standard deviation of 1 km of double-run levelling, or the standard deviation
/// of one rod reading (with the reading resolution and how to count its rounding). Lengths in metres.
/// </summary>
public sealed record LevelSpecification
{
    private LevelSpecification(string id, double? perKm, double? reading, double resolution, RoundingTreatment rounding)
    {
        Checks.Id(id, "a level");
        Id = id;
        SdPerKm = perKm;
        ReadingSd = reading;
        Resolution = resolution;
        Rounding = rounding;
    }

    /// <summary>A level described by its ISO 17123-2 σ of 1 km double-run levelling.</summary>
    /// <param name="id">The name used in the project file.</param>
    /// <param name="sdPerKm">σ of 1 km of double-run levelling (&gt; 0), e.g. <c>Length.FromMillimetres(0.7)</c>.
    /// </param>
    /// <exception cref="InvalidInputException">When σ is not positive.</exception>
    public static LevelSpecification PerKm(string id, Length sdPerKm) => PerKm(id, sdPerKm.Metres);

    /// <summary>A level described by the σ of one rod reading and the reading resolution.</summary>
    /// <param name="id">The name used in the project file.</param>
    /// <param name="readingSd">σ of one rod reading (pointing, level bubble or compensator, rod) (≥ 0).</param>
    /// <param name="resolution">The reading resolution d (≥ 0; zero when rounding is negligible).</param>
    /// <param name="rounding">How the rounding to d is counted.</param>
    /// <exception cref="InvalidInputException">When a value is out of range or both are zero.</exception>
    public static LevelSpecification PerReading(string id, Length readingSd, Length resolution,
        RoundingTreatment rounding) => PerReading(id, readingSd.Metres, resolution.Metres, rounding);

    /// <summary>A level described by its σ per km in metres (SI, for the reader).</summary>
    /// <param name="id">The name used in the project file.</param>
    /// <param name="sdPerKm">σ of 1 km of double-run levelling, metres (&gt; 0), e.g. 0.0007 for 0.7 mm.</param>
    /// <exception cref="InvalidInputException">When σ is not positive.</exception>
    internal static LevelSpecification PerKm(string id, double sdPerKm)
    {
        Checks.Positive(sdPerKm, $"the standard deviation per km of level {id}");
        return new(id, sdPerKm, null, 0, RoundingTreatment.Uniform);
    }

    /// <summary>A level described by the σ of one rod reading and the reading resolution, metres (SI, for the
    /// reader).</summary>
    /// <param name="id">The name used in the project file.</param>
    /// <param name="readingSd">σ of one rod reading (pointing, level bubble or compensator, rod), metres (≥ 0).</param>
    /// <param name="resolution">The reading resolution d, metres (≥ 0; 0 when rounding is negligible).</param>
    /// <param name="rounding">How the rounding to d is counted.</param>
    /// <exception cref="InvalidInputException">When a value is out of range or both are zero.</exception>
    internal static LevelSpecification PerReading(string id, double readingSd, double resolution,
        RoundingTreatment rounding)
    {
        Checks.NonNegative(readingSd, $"the reading standard deviation of level {id}");
        Checks.NonNegative(resolution, $"the reading resolution of level {id}");
        if (readingSd == 0 && resolution == 0)
            throw new InvalidInputException($"level {id}: give a positive reading standard deviation or resolution");
        return new(id, null, readingSd, resolution, rounding);
    }

    /// <summary>The name used in the project file.</summary>
    public string Id { get; }

    /// <summary>ISO 17123-2 σ of 1 km double-run levelling, metres; null for the per-reading model (SI, for the
    /// stochastic model).</summary>
    internal double? SdPerKm { get; }

    /// <summary>σ of one rod reading, metres; null for the per-km model.</summary>
    internal double? ReadingSd { get; }

    /// <summary>Reading resolution d, metres (per-reading model; 0 otherwise).</summary>
    internal double Resolution { get; }

    /// <summary>ISO 17123-2 σ of 1 km double-run levelling; null for the per-reading model.</summary>
    public Length? StandardDeviationPerKm => SdPerKm is double v ? Length.FromMetres(v) : null;

    /// <summary>σ of one rod reading; null for the per-km model.</summary>
    public Length? ReadingStandardDeviation => ReadingSd is double v ? Length.FromMetres(v) : null;

    /// <summary>Reading resolution d (per-reading model; zero otherwise).</summary>
    public Length ReadingResolution => Length.FromMetres(Resolution);

    /// <summary>The σ of the rounding of one reading: d/√12 (uniform) or d/2 (half resolution).</summary>
    public Length RoundingStandardDeviation => Length.FromMetres(RoundingSd);

    /// <summary>How the rounding is counted.</summary>
    public RoundingTreatment Rounding { get; }

    /// <summary>The σ of the rounding of one reading in metres: d/√12 (uniform) or d/2 (half resolution).</summary>
    internal double RoundingSd =>
        Rounding == RoundingTreatment.Uniform ? Resolution / Math.Sqrt(12.0) : Resolution / 2.0;
}
