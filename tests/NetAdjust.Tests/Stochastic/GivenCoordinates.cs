using NetAdjust.Geometry;
using NetAdjust.Network;
using NetAdjust.Observations;

namespace NetAdjust.Tests.Stochastic;

/// <summary>The given coordinates of a network's points, for evaluating a stochastic model without adjusting.</summary>
internal sealed class GivenCoordinates(SurveyNetwork network) : ICoordinates
{
    public PlanePoint Plane(string id) => new(network[id].E!.Value, network[id].N!.Value);

    public double Height(string id) => network[id].H ?? 0;

    public double Orientation(string setId) => 0;
}
