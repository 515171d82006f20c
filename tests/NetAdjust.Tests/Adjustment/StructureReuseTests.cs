using NetAdjust.Adjustment;
using NetAdjust.Geometry;
using NetAdjust.LinearAlgebra;
using NetAdjust.Network;
using NetAdjust.Observations;
using NetAdjust.Procedures;
using NetAdjust.Simulation;

namespace NetAdjust.Tests.Adjustment;

/// <summary>
/// What an adjustment computes once and reuses: the linearisation at each state (the step control's trial at the new
/// state is the next iteration's linearisation, and the last one serves the residuals), and, by default, the sparse
/// engine's symbolic analysis over every round of a procedure; the columns of the design matrix, resolved once per
/// adjustment.
/// </summary>
public class StructureReuseTests
{
    // 120 points: 356 unknowns, above the dense limit, so the sparse engine runs.
    private static SurveyNetwork Plane(int seed) =>
        SyntheticNetworks.Create(new SyntheticNetworkSpec(SyntheticNetworkKind.Plane, 120, Seed: seed)
        {
            ControlEvery = 50,
        });

    /// <summary>The network with a gross error added to its first distance.</summary>
    private static SurveyNetwork WithDistanceBlunder(SurveyNetwork network, double metres)
    {
        int i = network.Observations.ToList().FindIndex(o => o is DistanceObservation);
        return BracedNetworks.WithBias(network, i, metres);
    }

    [Fact]
    public void EachGaussNewtonIterationLinearisesOnce()
    {
        var network = Plane(5);
        int before = Adjuster.LinearisationCount;
        var result = Adjuster.Adjust(network);
        int made = Adjuster.LinearisationCount - before;
        Assert.True(result.Statistics.Iterations >= 2, "the test needs more than one iteration");
        // one at the start, one per iteration at the state it reaches (the step control's trial, reused by the next
        // iteration and by the residuals); the step control halved no step here
        Assert.Equal(result.Statistics.Iterations + 1, made);
    }

    [Fact]
    public void TheRowsOfALinearisationShareOneArrayOfColumnsAndOneOfCoefficients()
    {
        // Compact rows of A: no array per observation, the rows laid end to end in the order of the rows.
        var result = Adjuster.Adjust(Plane(7));
        var rows = result.DesignRows;
        Assert.True(rows.Count > 500, "the test needs a network of some size");
        var (columns, coefficients) = rows[0].Storage;
        int total = 0;
        for (int i = 0; i < rows.Count; i++)
        {
            Assert.Same(columns, rows[i].Storage.Columns);
            Assert.Same(coefficients, rows[i].Storage.Values);
            total += rows[i].Count;
        }
        Assert.Equal(total, columns.Length);
        Assert.Equal(total, coefficients.Length);
    }

    [Fact]
    public void EveryLinearisationOfAnAdjustmentWritesIntoTheArraysOfTheOneBefore()
    {
        // The sparse engine's factor of an iteration is done with once its step is taken, and so is the linearisation
        // it came from: the next linearisation writes over its arrays instead of allocating new ones. The result is
        // the same as with arrays of its own (the final rows against a lookup by names in the test below; the
        // golden outputs).
        var network = Plane(5);
        int linearisations = Adjuster.LinearisationCount, arrays = Adjuster.CoefficientArrayCount;
        Adjuster.Adjust(network);
        Assert.True(Adjuster.LinearisationCount - linearisations >= 3, "the test needs several linearisations");
        Assert.Equal(1, Adjuster.CoefficientArrayCount - arrays);
    }

    [Fact]
    public void AFactorOfAnotherKindKeepsItsRowsAndEachLinearisationGetsArraysOfItsOwn()
    {
        // The dense solver's factor is not the sparse engine's: it may keep the rows it was made from, so nothing is
        // written over.
        var network = Plane(5);
        int linearisations = Adjuster.LinearisationCount, arrays = Adjuster.CoefficientArrayCount;
        Adjuster.Adjust(network, AdjustmentOptions.Default with { Solver = new DenseNormalEquationsSolver() });
        int made = Adjuster.LinearisationCount - linearisations;
        Assert.True(made >= 3, "the test needs several linearisations");
        Assert.Equal(made, Adjuster.CoefficientArrayCount - arrays);
    }

    [Fact]
    public void ARowOfItsOwnArraysNeedsAsManyCoefficientsAsColumns()
    {
        var row = new NetAdjust.LinearAlgebra.SparseRow([3, 1], [0.5, -2.0]);
        Assert.Equal([3, 1], row.Columns.ToArray());
        Assert.Equal(0.5 * 7 + -2.0 * 11, row.Dot([0, 11, 0, 7]));
        Assert.Throws<ArgumentException>(() => new NetAdjust.LinearAlgebra.SparseRow([3, 1], [0.5]));
    }

    [Fact]
    public void TheColumnsOfTheDesignMatrixAreResolvedOnceAndMatchALookupByNames()
    {
        // Directions, slope distances, zenith angles and angles, with two held points (held columns left out).
        var network = NetAdjust.Tests.Diagnosis.DiagnosisNetworks.Draw(3);
        int before = Adjuster.PatternCount;
        var result = Adjuster.Adjust(network);
        Assert.Equal(1, Adjuster.PatternCount - before);
        Assert.True(result.Statistics.Iterations >= 2, "the test needs more than one iteration");
        // The final rows (made on the pattern) against the rows found as before the pattern existed: each partial
        // derivative of the equation at the adjusted coordinates looked up by its unknown's name, a repeated
        // column added.
        var at = new AdjustedCoordinates(result);
        for (int i = 0; i < network.Observations.Count; i++)
        {
            var cols = new List<int>();
            var vals = new List<double>();
            foreach (var p in ObservationKindRegistry.Evaluate(network.Observations[i], at).Partials)
            {
                int j = result.Unknowns.IndexOf(p.Owner, p.Parameter);
                if (j < 0) continue;
                int k = cols.IndexOf(j);
                if (k >= 0) vals[k] += p.Derivative;
                else { cols.Add(j); vals.Add(p.Derivative); }
            }
            var row = result.DesignRows[i];
            Assert.Equal(cols, row.Columns.ToArray());
            Assert.Equal(vals.Select(BitConverter.DoubleToInt64Bits),
                row.Values.ToArray().Select(BitConverter.DoubleToInt64Bits));
        }
    }

    /// <summary>The adjusted coordinates (the state the last linearisation was made at); orientations, which no
    /// partial derivative depends on, are zero.</summary>
    private sealed class AdjustedCoordinates(AdjustmentResult result) : ICoordinates
    {
        private readonly Dictionary<string, AdjustedPoint> _points =
            result.Points.ToDictionary(p => p.Input.Id, StringComparer.Ordinal);

        public PlanePoint Plane(string id) => new(_points[id].E!.Value, _points[id].N!.Value);

        public double Height(string id) => _points[id].H!.Value;

        public double Orientation(string setId) => 0;
    }

    [Fact]
    public void ABlunderHuntAnalysesThePatternOnceByDefault()
    {
        var hunt = DataSnooping.Run(WithDistanceBlunder(Plane(7), 0.5));
        Assert.True(hunt.Rounds.Count >= 2, "the hunt should set the blunder aside and adjust again");
        Assert.NotEmpty(hunt.SetAside);
        var solver = Assert.IsType<ReusableSolver>(hunt.Final.Options.Solver);
        Assert.Equal(1, solver.SparseAnalyses);
        Assert.StartsWith("sparse supernodal Cholesky", hunt.Final.SolverName);
    }

    [Fact]
    public void RobustAndVarianceComponentRoundsAnalyseThePatternOnceByDefault()
    {
        var network = WithDistanceBlunder(Plane(8), 0.5);
        var robust = RobustEstimation.Run(network, RobustMethod.Huber);
        Assert.True(robust.Iterations >= 2);
        Assert.Equal(1, Assert.IsType<ReusableSolver>(robust.Final.Options.Solver).SparseAnalyses);
        var components = VarianceComponents.Estimate(Plane(8));
        Assert.True(components.Iterations >= 1);
        Assert.Equal(1, Assert.IsType<ReusableSolver>(components.Final.Options.Solver).SparseAnalyses);
    }

    [Fact]
    public void ACallerSolverIsKeptAndSmallNetworksStayDense()
    {
        var given = new NetAdjust.LinearAlgebra.DenseNormalEquationsSolver();
        var (small, _) = BracedNetworks.Horizontal(41, 4);
        var hunt = DataSnooping.Run(small, AdjustmentOptions.Default with { Solver = given });
        Assert.Same(given, hunt.Final.Options.Solver);
        var automatic = DataSnooping.Run(small);
        Assert.StartsWith("dense", automatic.Final.SolverName);
        Assert.Equal(0, Assert.IsType<ReusableSolver>(automatic.Final.Options.Solver).SparseAnalyses);
    }
}
