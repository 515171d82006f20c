using NetAdjust.Units;

namespace NetAdjust.Network;

/// <summary>
/// A total station (or theodolite with EDM). Angular values in radians, lengths in metres. Centering errors are
/// the standard deviation of the offset from the mark in any one horizontal direction (per axis).
/// </summary>
public sealed record TotalStationSpecification
{
    /// <summary>Creates a specification.</summary>
    /// <param name="id">The name used in the project file.</param>
    /// <param name="directionSd">ISO 17123-3 σ of a horizontal direction observed once in both faces (&gt; 0),
    /// e.g. <c>Angle.FromArcseconds(1)</c>.</param>
    /// <param name="zenithSd">ISO 17123-3 σ of a zenith angle observed once in both faces (≥ 0; zero when not
    /// given).</param>
    /// <param name="edm">The EDM specification; null when the instrument measures no distances.</param>
    /// <param name="centeringSd">Instrument centering σ per axis (≥ 0).</param>
    /// <param name="heightSd">Instrument height measurement σ (≥ 0).</param>
    /// <exception cref="InvalidInputException">When a value is out of range.</exception>
    public TotalStationSpecification(string id, Angle directionSd, Angle zenithSd, EdmSpecification? edm,
        Length centeringSd, Length heightSd)
        : this(id, directionSd.Radians, zenithSd.Radians, edm, centeringSd.Metres, heightSd.Metres) { }

    /// <summary>Creates a specification from SI values (for the reader).</summary>
    /// <param name="id">The name used in the project file.</param>
    /// <param name="directionSd">ISO 17123-3 σ of a horizontal direction observed once in both faces,
    /// radians (&gt; 0).</param>
    /// <param name="zenithSd">ISO 17123-3 σ of a zenith angle observed once in both faces, radians (≥ 0; 0 when not
    /// given). Stored for 3D use.</param>
    /// <param name="edm">The EDM specification; null when the instrument measures no distances.</param>
    /// <param name="centeringSd">Instrument centering σ per axis, metres (≥ 0).</param>
    /// <param name="heightSd">Instrument height measurement σ, metres (≥ 0). Stored for 3D use.</param>
    /// <exception cref="InvalidInputException">When a value is out of range.</exception>
    internal TotalStationSpecification(string id, double directionSd, double zenithSd, EdmSpecification? edm,
        double centeringSd, double heightSd)
    {
        Checks.Id(id, "an instrument");
        Id = id;
        Checks.Positive(directionSd, $"the direction standard deviation of instrument {id}");
        Checks.NonNegative(zenithSd, $"the zenith angle standard deviation of instrument {id}");
        Checks.NonNegative(centeringSd, $"the centering error of instrument {id}");
        Checks.NonNegative(heightSd, $"the height measurement error of instrument {id}");
        DirectionSd = directionSd;
        ZenithSd = zenithSd;
        Edm = edm;
        CenteringSd = centeringSd;
        HeightSd = heightSd;
    }

    /// <summary>The name used in the project file.</summary>
    public string Id { get; }

    /// <summary>ISO 17123-3 σ of one horizontal direction observed once in both faces, radians (SI, for the
    /// stochastic model).</summary>
    internal double DirectionSd { get; }

    /// <summary>ISO 17123-3 σ of one zenith angle observed once in both faces, radians (0 when not given).</summary>
    internal double ZenithSd { get; }

    /// <summary>The EDM specification, or null.</summary>
    public EdmSpecification? Edm { get; }

    /// <summary>Centering σ per axis, metres.</summary>
    internal double CenteringSd { get; }

    /// <summary>Instrument height measurement σ, metres.</summary>
    internal double HeightSd { get; }

    /// <summary>ISO 17123-3 σ of one horizontal direction observed once in both faces.</summary>
    public Angle DirectionStandardDeviation => Angle.FromRadians(DirectionSd);

    /// <summary>ISO 17123-3 σ of one zenith angle observed once in both faces (zero when not given).</summary>
    public Angle ZenithStandardDeviation => Angle.FromRadians(ZenithSd);

    /// <summary>Centering σ per axis.</summary>
    public Length CenteringStandardDeviation => Length.FromMetres(CenteringSd);

    /// <summary>Instrument height measurement σ.</summary>
    public Length HeightStandardDeviation => Length.FromMetres(HeightSd);
}
