using NetAdjust.Adjustment.Approximation;
using NetAdjust.Adjustment;
using NetAdjust.Geometry;
using NetAdjust.LinearAlgebra;
using NetAdjust.Network;
using NetAdjust.Observations;

namespace NetAdjust.Adjustment.Datum;

/// <summary>The datum plan, conditions: the datum step, and the conditions Bᵀx = c at the current state.</summary>
internal sealed partial class DatumPlan
{
    /// <summary>The datum step: the solution of the normal equations that meets the datum conditions at the current
    /// state.</summary>
    public double[] Step(INormalFactor factor, double[] rhs)
    {
        if (factor is not DatumFactor df) return factor.Solve(rhs);
        return df.SolveWithConditions(rhs, ConditionValues());
    }

    /// <summary>The null-space basis G and the datum-condition basis B at the current state (d columns of length
    /// u).</summary>
    private (double[][] G, double[][] B) Bases()
    {
        int u = Index.Count, d = ConditionCount;
        var g = DatumConditions.NullSpace(Index.Unknowns, _defects, State.Plane, _planePoints);
        CompleteNullSpace(g);
        if (Definition.Mode == DatumMode.InnerConstraints)
            return (g, DatumConditions.Inner(g, Index.Unknowns, _subset));
        var b = new double[d][];
        for (int k = 0; k < d; k++)
        {
            b[k] = new double[u];
            foreach (var (owner, par, value) in DatumConditions.MinimalGradient(_defects[k], _p0, _p1, _hp,
                State.Plane))
                b[k][Index.IndexOf(owner, par)] += value;
        }
        return (g, b);
    }

    /// <summary>c: how far the current state is from meeting each datum condition.</summary>
    private double[] ConditionValues()
    {
        int d = ConditionCount;
        var c = new double[d];
        if (Definition.Mode == DatumMode.InnerConstraints)
        {
            // c = Bᵀ (x0 − x): the free network stays, in the minimum-trace sense, on its approximate coordinates.
            var (_, b) = Bases();
            for (int j = 0; j < Index.Count; j++)
            {
                var unk = Index.Unknowns[j];
                double x0 = unk.Parameter switch
                {
                    Parameter.E => _e0[unk.Owner],
                    Parameter.N => _n0[unk.Owner],
                    Parameter.H => _h0[unk.Owner],
                    _ => State.Get(unk),
                };
                double diff = x0 - State.Get(unk);
                for (int k = 0; k < d; k++) c[k] += b[k][j] * diff;
            }
            return c;
        }
        for (int k = 0; k < d; k++)
        {
            c[k] = _defects[k] switch
            {
                DatumDefect.East => _e0[_p0!] - State.Plane(_p0!).E,
                DatumDefect.North => _n0[_p0!] - State.Plane(_p0!).N,
                DatumDefect.Height => _h0[_hp!] - State.Height(_hp!),
                DatumDefect.Rotation => Units.Angle.ReduceSigned(
                    PlaneGeometry.Azimuth(_p0!, new PlanePoint(_e0[_p0!], _n0[_p0!]), _p1!,
                        new PlanePoint(_e0[_p1!], _n0[_p1!])).Value -
                    PlaneGeometry.Azimuth(_p0!, State.Plane(_p0!), _p1!, State.Plane(_p1!)).Value),
                _ => PlaneGeometry.Distance(_p0!, new PlanePoint(_e0[_p0!], _n0[_p0!]), _p1!, new PlanePoint(_e0[_p1!],
                    _n0[_p1!])).Value -
                     PlaneGeometry.Distance(_p0!, State.Plane(_p0!), _p1!, State.Plane(_p1!)).Value,
            };
        }
        return c;
    }
}
