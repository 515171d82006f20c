using NetAdjust.Units;

namespace NetAdjust.Reduction;

/// <summary>
/// One pointing to a target in one set, as booked: the horizontal circle readings, zenith angles and slope
/// distances in face left and face right. A quantity not booked is null; a one-face set books only one face of each.
/// </summary>
/// <param name="Target">The point sighted.</param>
public sealed record FaceReadings(string Target)
{
    /// <summary>Horizontal circle reading in face left, or null.</summary>
    public Angle? HorizontalLeft { get; init; }

    /// <summary>Horizontal circle reading in face right (about 180° from face left), or null.</summary>
    public Angle? HorizontalRight { get; init; }

    /// <summary>Zenith angle read in face left, strictly between 0 and 180°, or null.</summary>
    public Angle? ZenithLeft { get; init; }

    /// <summary>Zenith angle read in face right, strictly between 180° and 360°, or null.</summary>
    public Angle? ZenithRight { get; init; }

    /// <summary>Slope distance measured in face left (corrected for EDM constant and atmosphere), or null.</summary>
    public Length? SlopeLeft { get; init; }

    /// <summary>Slope distance measured in face right, or null.</summary>
    public Length? SlopeRight { get; init; }
}

/// <summary>A reading of a set that the reduction refuses (a booking or pointing error, or sets that do not match);
/// the indices let the reader name the file and line.</summary>
public sealed class RoundsReadingException : InvalidInputException
{
    /// <summary>Creates the exception.</summary>
    /// <param name="set">Index of the set (0-based) in the setup.</param>
    /// <param name="reading">Index of the reading (0-based) in the set; −1 for the set as a whole.</param>
    /// <param name="message">What is wrong, in the surveyor's terms.</param>
    public RoundsReadingException(int set, int reading, string message) : base(message)
    {
        Set = set;
        Reading = reading;
    }

    /// <summary>Index of the set (0-based).</summary>
    public int Set { get; }

    /// <summary>Index of the reading (0-based) in its set; −1 for the set as a whole.</summary>
    public int Reading { get; }
}
