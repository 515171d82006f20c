using System.Diagnostics;
using MathNet.Numerics;
using MathNet.Numerics.LinearAlgebra;

namespace NetAdjust.Benchmarks;

/// <summary>
/// Tries MathNet's native OpenBLAS linear-algebra provider and reports which provider runs, then times a dense
/// Cholesky of order 2,000 with it: <c>... -- provider</c>. Never claims a provider that did not load.
/// </summary>
public static class ProviderProbe
{
    /// <summary>Runs the probe and prints its findings.</summary>
    public static void Run()
    {
        string native;
        try
        {
            native =
                Control.TryUseNativeOpenBLAS() ? "native OpenBLAS loaded" : "native OpenBLAS did not load (the " +
                "provider package ships no native library for this platform)";
        }
        catch (Exception e)
        {
            native = $"native OpenBLAS did not load: {e.GetType().Name}: {e.Message}";
        }
        Console.WriteLine(
            $"MathNet provider probe: {native}; provider in use: " +
            $"{MathNet.Numerics.Providers.LinearAlgebra.LinearAlgebraControl.Provider}");
        var rng = new Random(1);
        var b = Matrix<double>.Build.Dense(2000, 2000, (_, _) => rng.NextDouble());
        var spd = b.TransposeThisAndMultiply(b) + Matrix<double>.Build.DenseIdentity(2000);
        var sw = Stopwatch.StartNew();
        var chol = spd.Cholesky();
        Console.WriteLine(
            $"dense Cholesky of order 2000 with " +
            $"{MathNet.Numerics.Providers.LinearAlgebra.LinearAlgebraControl.Provider}: {sw.Elapsed.TotalSeconds:F2} " +
            $"s (det sign check {Math.Sign(chol.DeterminantLn)})");
    }
}
