namespace NetAdjust.IO.Results;

/// <summary>The unit class of a column: what a number in it measures.</summary>
internal enum ColumnUnit
{
    /// <summary>Text or a plain count: no unit.</summary>
    None,

    /// <summary>A length in metres, shown in the project's length unit.</summary>
    Length,

    /// <summary>An azimuth already in decimal degrees (rounded where the model says so).</summary>
    Degrees,

    /// <summary>An observed quantity: an angle (radians) or a length (metres), by the row's observation kind.</summary>
    ObservedValue,

    /// <summary>A residual or standard deviation of an observation: small angle (radians) or length, by kind.</summary>
    ObservedPrecision,

    /// <summary>A dimensionless test statistic (e.g. the standardised residual w).</summary>
    Statistic,
}
