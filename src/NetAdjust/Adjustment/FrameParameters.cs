using NetAdjust.Geometry;
using NetAdjust.LinearAlgebra;
using NetAdjust.Network;

namespace NetAdjust.Adjustment;

/// <summary>One adjusted frame parameter between a GNSS frame and the local control (docs/methods.md, "GNSS
/// baselines").</summary>
/// <param name="Frame">The frame's id.</param>
/// <param name="Parameter">Which parameter (<see cref="Parameter.FrameRotationX"/> ... <see
/// cref="Parameter.FrameScale"/>).</param>
/// <param name="Value">The estimate: radians for rotations, dimensionless for the scale difference.</param>
/// <param name="Sd">Its standard deviation (with the a-priori variance factor), same unit.</param>
public sealed record AdjustedFrameParameter(string Frame, Parameter Parameter, double Value, double Sd);

/// <summary>The frame parameters of GNSS baselines as unknowns: which frames have them, their unknowns, the
/// convergence tolerance and the adjusted values.</summary>
internal static class FrameParameters
{
    /// <summary>The largest correction that counts as converged: 1e-10 rad or 1e-10 of scale moves a 10 km vector
    /// by 1 µm.</summary>
    public const double Tolerance = 1e-10;

    /// <summary>True for the four frame parameters.</summary>
    public static bool IsFrame(Parameter p) =>
        p is Parameter.FrameRotationX or Parameter.FrameRotationY or Parameter.FrameRotationZ or Parameter.FrameScale;

    /// <summary>The unknowns of a frame: three rotations, and the scale when it has one.</summary>
    public static IEnumerable<Parameter> Of(BaselineFrame frame)
    {
        if (!frame.HasRotations) yield break;
        yield return Parameter.FrameRotationX;
        yield return Parameter.FrameRotationY;
        yield return Parameter.FrameRotationZ;
        if (frame.HasScale) yield return Parameter.FrameScale;
    }

    /// <summary>The frames with parameters that the network's baselines use, in order of first appearance, and whether
    /// a baseline that is not set aside uses each (only those get unknowns).</summary>
    /// <exception cref="InvalidInputException">When two frames share an id but differ.</exception>
    public static List<(BaselineFrame Frame, bool Used)> Frames(SurveyNetwork network)
    {
        var list = new List<(BaselineFrame Frame, bool Used)>();
        foreach (var b in network.Observations.OfType<BaselineObservation>())
        {
            if (b.Frame is not { HasRotations: true } f) continue;
            int at = list.FindIndex(x => x.Frame.Id == f.Id);
            if (at < 0) { list.Add((f, !b.Excluded)); continue; }
            if (list[at].Frame != f)
                throw new InvalidInputException($"{b.Describe()}: frame {f.Id} is declared twice with different " +
                    "parameters");
            if (!b.Excluded) list[at] = (f, true);
        }
        return list;
    }

    /// <summary>The frame parameters that are unknowns and have an a-priori standard deviation about zero (radians,
    /// or dimensionless for the scale), in order of their frames and parameters: the adjustment takes each as a
    /// direct observation of zero, after the weighted control of the points.</summary>
    public static IEnumerable<(string Owner, Parameter Parameter, double Sd)> Weighted(SurveyNetwork network,
        UnknownIndex index)
    {
        foreach (var (frame, used) in Frames(network))
        {
            if (!used) continue;
            foreach (var par in Of(frame))
            {
                double? sd = par == Parameter.FrameScale ? frame.ScalePpmSd * 1e-6 : frame.RotationSd?.Radians;
                if (sd is double s && index.IndexOf(frame.Id, par) >= 0) yield return (frame.Id, par, s);
            }
        }
    }

    /// <summary>The adjusted frame parameters in unknown order.</summary>
    public static IReadOnlyList<AdjustedFrameParameter> Adjusted(UnknownIndex index, ParameterState state,
        INormalFactor? f, double s0) =>
        Enumerable.Range(0, index.Count).Where(j => IsFrame(index.Unknowns[j].Parameter))
            .Select(j => new AdjustedFrameParameter(index.Unknowns[j].Owner, index.Unknowns[j].Parameter,
                state.Get(index.Unknowns[j]), f is null ? 0 : Math.Sqrt(Math.Max(0, s0 * f.InverseEntry(j, j)))))
            .ToArray();
}
