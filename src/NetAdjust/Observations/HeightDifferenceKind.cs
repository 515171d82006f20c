using NetAdjust.Geometry;
using NetAdjust.Network;

namespace NetAdjust.Observations;

/// <summary>Height difference Δh = H(to) − H(from), e.g. one levelling section.</summary>
public sealed class HeightDifferenceKind : IObservationKind
{
    /// <inheritdoc />
    public ObservationKind Kind => ObservationKind.HeightDifference;

    /// <inheritdoc />
    public string Name => Kind.Name();

    /// <inheritdoc />
    public UnitClass Unit => UnitClass.Length;

    /// <inheritdoc />
    public string ReportLabel => "height";

    /// <inheritdoc />
    public CoordinateAxes Axes => CoordinateAxes.Height;

    /// <inheritdoc />
    public DatumElements Fixes => DatumElements.None;

    /// <inheritdoc />
    public Measurement Measurement => Measurement.Levelling;

    /// <inheritdoc />
    public ObservationColumns Columns { get; } = new("levelling",
        ["from", "to", "dh", "length", "sd", "level", "setups", "runs"],
        ["from", "to", "value", "sd", "length", "level", "setups", "runs"]);

    /// <inheritdoc />
    public EquationValue Evaluate(Observation observation, ICoordinates at) =>
        PlaneGeometry.HeightDifference(observation.From, at.Height(observation.From), observation.To,
            at.Height(observation.To));

    /// <inheritdoc />
    public string? Instrument(Observation observation) => null;

    /// <inheritdoc />
    public IReadOnlyList<string> Targets(Observation observation) => [];
}
