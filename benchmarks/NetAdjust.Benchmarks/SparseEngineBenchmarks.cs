using BenchmarkDotNet.Attributes;
using BenchmarkDotNet.Configs;
using BenchmarkDotNet.Diagnosers;
using BenchmarkDotNet.Engines;
using BenchmarkDotNet.Jobs;
using BenchmarkDotNet.Toolchains.InProcess.Emit;
using NetAdjust.Adjustment;
using NetAdjust.Simulation;
using NetAdjust.LinearAlgebra;
using NetAdjust.LinearAlgebra.Sparse;
using NetAdjust.Network;

namespace NetAdjust.Benchmarks;

/// <summary>
/// The sparse engine's phases on seeded synthetic plane networks (directions to 6 nearest neighbours and
/// distances, 3 unknowns and about 9 observations per point) at 1,000, 10,000 and 100,000 points.
/// Monitoring strategy (one call per iteration, 3 iterations) so that the 100,000-point case fits the time.
/// </summary>
[Config(typeof(LargeNetworkConfig))]
public class SparseEngineBenchmarks
{
    private SurveyNetwork _network = null!;
    private SyntheticProblem _problem = null!;
    private AdjacencyGraph _graph = null!;
    private SymbolicCholesky _symbolic = null!;
    private NormalMatrixAssembly _assembly = null!;
    private SparseCholeskyFactor _factor = null!;
    private double[] _rhs = [];

    /// <summary>Number of points.</summary>
    [Params(1_000, 10_000, 100_000)]
    public int Points { get; set; }

    /// <summary>Generates and prepares the network.</summary>
    [GlobalSetup]
    public void Setup()
    {
        _network = SyntheticNetworks.Create(new SyntheticNetworkSpec(SyntheticNetworkKind.Plane, Points, Seed: 1));
        _problem = SyntheticProblem.Linearise(_network);
        _graph = AdjacencyGraph.FromNormalEquations(_problem.Unknowns, _problem.Rows, _problem.Weights);
        _symbolic = SymbolicCholesky.Analyze(_graph, GeometricNestedDissection.Order(_graph, _problem.Geometry),
            "nested dissection");
        _assembly = new NormalMatrixAssembly(_symbolic, _problem.Rows);
        _factor = SparseCholeskyFactor.Factorize(_symbolic, _assembly, _problem.Rows, _problem.Weights);
        _rhs = Enumerable.Range(0, _problem.Unknowns).Select(i => Math.Sin(i)).ToArray();
    }

    /// <summary>Sparse assembly: the graph of N, the assembly plan, and the values of N = AᵀPA.</summary>
    [Benchmark]
    public object Assembly() // object: the engine's types are internal to the library
    {
        var g = AdjacencyGraph.FromNormalEquations(_problem.Unknowns, _problem.Rows, _problem.Weights);
        return (g, new NormalMatrixAssembly(_symbolic, _problem.Rows).Assemble(_problem.Rows, _problem.Weights));
    }

    /// <summary>Geometric nested dissection and the symbolic analysis (elimination tree, counts, supernodes,
    /// patterns).</summary>
    [Benchmark]
    public object OrderingAndSymbolic() =>
        SymbolicCholesky.Analyze(_graph, GeometricNestedDissection.Order(_graph, _problem.Geometry),
            "nested dissection");

    /// <summary>Numeric phase on the analysed pattern: values of N and the supernodal factorisation.</summary>
    [Benchmark]
    public object NumericFactorisation() =>
        SparseCholeskyFactor.Factorize(_symbolic, _assembly, _problem.Rows, _problem.Weights);

    /// <summary>Forward and back substitution.</summary>
    [Benchmark]
    public double[] Solve() => _factor.Solve(_rhs);

    /// <summary>
    /// Full statistics from a fresh factor: selected inversion, then every point's sd and E/N covariance and every
    /// observation's sd of the adjusted value (a Qxx aᵀ), all from Qxx on the pattern.
    /// </summary>
    [Benchmark]
    public double FullStatistics()
    {
        var f = SparseCholeskyFactor.Factorize(_symbolic, _assembly, _problem.Rows, _problem.Weights);
        f.ComputeSelectedInverse();
        double s = 0;
        for (int j = 0; j < _problem.Unknowns; j++) s += f.InverseEntry(j, j);
        foreach (var row in _problem.Rows)
            for (int p = 0; p < row.Columns.Length; p++)
                for (int q = 0; q < row.Columns.Length; q++)
                    s += row.Values[p] * row.Values[q] * f.InverseEntry(row.Columns[p], row.Columns[q]);
        return s;
    }

    /// <summary>
    /// The whole adjustment with all statistics: Gauss-Newton iterations, final factor, selected inverse, then the
    /// analysis (redundancy numbers, w and tau tests, MDB, point ellipses, relative ellipses of observed pairs).
    /// </summary>
    [Benchmark]
    public NetAdjust.Statistics.NetworkAnalysis FullAdjustment() =>
        NetAdjust.Statistics.ResultAnalysis.Analyse(Adjuster.Adjust(_network));
}

/// <summary>Level networks (height differences to 6 nearest neighbours): the whole adjustment at 10,000 and 100,000
/// benchmarks.</summary>
[Config(typeof(LargeNetworkConfig))]
public class LevelNetworkBenchmarks
{
    private SurveyNetwork _network = null!;

    /// <summary>Number of benchmarks (points).</summary>
    [Params(10_000, 100_000)]
    public int Points { get; set; }

    /// <summary>Generates the network.</summary>
    [GlobalSetup]
    public void Setup() =>
        _network = SyntheticNetworks.Create(new SyntheticNetworkSpec(SyntheticNetworkKind.Levels, Points, Seed: 1));

    /// <summary>The whole adjustment with all statistics (as <see
    /// cref="SparseEngineBenchmarks.FullAdjustment"/>).</summary>
    [Benchmark]
    public NetAdjust.Statistics.NetworkAnalysis FullAdjustment() =>
        NetAdjust.Statistics.ResultAnalysis.Analyse(Adjuster.Adjust(_network));
}

/// <summary>
/// Dense against sparse on the same plane networks (1,000 and 2,000 points, about 3,000 and 6,000 unknowns): the
/// whole adjustment. The dense path costs O(u³) per factorisation, minutes at 6,000 unknowns, so this runs one
/// cold call per case (BenchmarkDotNet's dry job).
/// </summary>
[Config(typeof(DryConfig))]
public class DenseVersusSparseBenchmarks
{
    private SurveyNetwork _network = null!;

    /// <summary>Number of points.</summary>
    [Params(1_000, 2_000)]
    public int Points { get; set; }

    /// <summary>Generates the network.</summary>
    [GlobalSetup]
    public void Setup() =>
        _network = SyntheticNetworks.Create(new SyntheticNetworkSpec(SyntheticNetworkKind.Plane, Points, Seed: 1));

    /// <summary>Dense Cholesky (managed).</summary>
    [Benchmark(Baseline = true)]
    public AdjustmentResult Dense() =>
        Adjuster.Adjust(_network, AdjustmentOptions.Default with { Solver = new DenseNormalEquationsSolver() });

    /// <summary>Sparse supernodal Cholesky with selected inversion.</summary>
    [Benchmark]
    public AdjustmentResult Sparse() =>
        Adjuster.Adjust(_network, AdjustmentOptions.Default with { Solver = new SparseNormalEquationsSolver() });
}

/// <summary>Monitoring strategy, 1 warm-up and 3 measured calls, in process (large networks take seconds per
/// call).</summary>
public sealed class LargeNetworkConfig : ManualConfig
{
    /// <summary>Creates the configuration.</summary>
    public LargeNetworkConfig()
    {
        AddJob(Job.Default.WithStrategy(RunStrategy.Monitoring).WithLaunchCount(1).WithWarmupCount(
            1).WithIterationCount(3)
            .WithToolchain(InProcessEmitToolchain.Instance).WithId("Monitoring3"));
        AddDiagnoser(MemoryDiagnoser.Default);
    }
}

/// <summary>BenchmarkDotNet's dry job (one cold call), in process.</summary>
public sealed class DryConfig : ManualConfig
{
    /// <summary>Creates the configuration.</summary>
    public DryConfig()
    {
        AddJob(Job.Dry.WithToolchain(InProcessEmitToolchain.Instance).WithId("Dry"));
        AddDiagnoser(MemoryDiagnoser.Default);
    }
}
