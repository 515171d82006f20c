using NetAdjust.Geometry;
using NetAdjust.Network;

namespace NetAdjust.Observations;

/// <summary>
/// Everything the library knows about one kind of observation, in one place: its name and unit class, its
/// observation equation with partial derivatives, the coordinates and datum elements it involves, which of its
/// points are the instrument and the targets (for centering errors), its file columns and its report label.
/// One implementation per kind; all of them are listed in <see cref="ObservationKindRegistry"/>.
/// </summary>
public interface IObservationKind
{
    /// <summary>The kind this describes.</summary>
    ObservationKind Kind { get; }

    /// <summary>The snake_case name used in files and JSON (e.g. <c>height_difference</c>).</summary>
    string Name { get; }

    /// <summary>Whether values and standard deviations are lengths (metres) or angles (radians).</summary>
    UnitClass Unit { get; }

    /// <summary>The short label of the kind in report tables (at most 9 characters).</summary>
    string ReportLabel { get; }

    /// <summary>The coordinates of its points that the equation uses.</summary>
    CoordinateAxes Axes { get; }

    /// <summary>The datum elements an observation of this kind fixes on its own (beyond the shape of the
    /// network).</summary>
    DatumElements Fixes { get; }

    /// <summary>How the kind is measured, which tells the stochastic model how to weight it from
    /// specifications.</summary>
    Measurement Measurement { get; }

    /// <summary>The columns of the kind in the project file and in CSV observation files (read by the IO
    /// layer).</summary>
    ObservationColumns Columns { get; }

    /// <summary>Evaluates the observation equation at the given coordinates.</summary>
    /// <param name="observation">An observation of this kind.</param>
    /// <param name="at">The current coordinates (and orientations of direction sets).</param>
    /// <returns>The computed value (SI) and the partial derivatives by E, N, H (and orientation).</returns>
    EquationValue Evaluate(Observation observation, ICoordinates at);

    /// <summary>
    /// The point the instrument stands on, whose centering error moves the observation by the equation's partial
    /// derivatives at that point; null when the kind is not subject to instrument centering.
    /// </summary>
    /// <param name="observation">An observation of this kind.</param>
    string? Instrument(Observation observation);

    /// <summary>The sighted target points, whose centering errors move the observation; empty for none.</summary>
    /// <param name="observation">An observation of this kind.</param>
    IReadOnlyList<string> Targets(Observation observation);
}

/// <summary>The unit class of an observation kind.</summary>
public enum UnitClass
{
    /// <summary>A length: values and standard deviations in metres.</summary>
    Length,

    /// <summary>An angle: values and standard deviations in radians; differences reduced to (−π, π].</summary>
    Angle,
}

/// <summary>How an observation kind is measured, for weighting it from instrument or level specifications.</summary>
public enum Measurement
{
    /// <summary>Given as data with its standard deviation (not weighted from specifications).</summary>
    Given,

    /// <summary>By an EDM: constant and distance-proportional parts, plus centering.</summary>
    ElectronicDistance,

    /// <summary>By pointing and reading the horizontal circle once per set, plus centering.</summary>
    CircleReading,

    /// <summary>As the difference of two circle readings, plus centering.</summary>
    CircleReadingDifference,

    /// <summary>By levelling: per km, or per rod reading.</summary>
    Levelling,

    /// <summary>By pointing and reading the vertical circle once per set, plus instrument and target
    /// heights.</summary>
    ZenithReading,
}

/// <summary>The datum elements that observations can fix.</summary>
[Flags]
public enum DatumElements
{
    /// <summary>None.</summary>
    None = 0,

    /// <summary>The position (translation in E and N).</summary>
    Position = 1,

    /// <summary>The orientation (rotation about the vertical).</summary>
    Orientation = 2,

    /// <summary>The scale.</summary>
    Scale = 4,

    /// <summary>The height datum.</summary>
    Height = 8,
}

/// <summary>Which coordinates of its points an observation kind uses.</summary>
[Flags]
public enum CoordinateAxes
{
    /// <summary>None.</summary>
    None = 0,

    /// <summary>Plane coordinates E and N.</summary>
    Plane = 1,

    /// <summary>The height H.</summary>
    Height = 2,
}

/// <summary>
/// The columns of a kind in the input files, as metadata: the list under a setup (or top-level section) in the
/// project file with its keys, and the columns a CSV row of this kind fills. Parsing stays in the IO layer.
/// </summary>
/// <param name="YamlList">The key of the list that holds observations of the kind (e.g. <c>distances</c>).</param>
/// <param name="YamlKeys">The keys of one observation in that list.</param>
/// <param name="CsvColumns">The CSV columns a row of the kind uses besides <c>kind</c>.</param>
public sealed record ObservationColumns(
    string YamlList, IReadOnlyList<string> YamlKeys, IReadOnlyList<string> CsvColumns);

/// <summary>Coordinates at which observation equations are evaluated (SI: metres, radians).</summary>
public interface ICoordinates
{
    /// <summary>The plane coordinates of a point.</summary>
    /// <param name="id">The point id.</param>
    PlanePoint Plane(string id);

    /// <summary>The height of a point.</summary>
    /// <param name="id">The point id.</param>
    double Height(string id);

    /// <summary>The orientation unknown of a direction set.</summary>
    /// <param name="setId">The set id.</param>
    double Orientation(string setId);

    /// <summary>
    /// The current refraction coefficient k of a group of zenith angles whose k is estimated; coordinates that hold
    /// no refraction unknowns (the default) give back <paramref name="assumed"/>.
    /// </summary>
    /// <param name="group">The group's id.</param>
    /// <param name="assumed">The group's assumed k (the start value of the unknown).</param>
    double Refraction(string group, double assumed) => assumed;

    /// <summary>
    /// The current value of a frame parameter of a GNSS frame (radians for rotations, dimensionless for the scale
    /// difference); coordinates that hold no frame unknowns (the default) give back 0.
    /// </summary>
    /// <param name="frame">The frame's id.</param>
    /// <param name="parameter">One of the frame parameters (<see cref="Parameter.FrameRotationX"/> ...).</param>
    double Frame(string frame, Parameter parameter) => 0.0;
}
