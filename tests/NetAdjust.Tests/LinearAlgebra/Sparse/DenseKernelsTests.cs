using FsCheck;
using FsCheck.Fluent;
using FsCheck.Xunit;
using NetAdjust.LinearAlgebra.Sparse;

namespace NetAdjust.Tests.LinearAlgebra.Sparse;

/// <summary>
/// The blocked dot-product kernels must give, bit for bit, the numbers of the single products they replace (so
/// that the factor and the selected inverse, and every printed result, stay the same); and the blocked update
/// U −= L₂ L₂ᵀ must equal the plain sum of products within rounding (the sum itself is the reference: common
/// practice). Random vectors of every length around the vector width (invented data exercising invariants only).
/// </summary>
public class DenseKernelsTests
{
    private static double[] RandomVector(Random rng, int n) =>
        Enumerable.Range(0, n).Select(_ => (rng.NextDouble() - 0.5) * Math.Pow(10, rng.Next(-3, 4))).ToArray();

    [Property(MaxTest = 200)]
    public Property Dot2x2ExactGivesTheFourDotsBitForBit() =>
        Prop.ForAll(Gen.Choose(0, 1000).ToArbitrary(), Gen.Choose(0, 41).ToArbitrary(), (seed, n) =>
        {
            var rng = new Random(seed);
            var a0 = RandomVector(rng, n + 3); var a1 = RandomVector(rng, n + 1);
            var b0 = RandomVector(rng, n); var b1 = RandomVector(rng, n + 2);
            DenseKernels.Dot2x2Exact(a0, a1, b0, b1, n, out double s00, out double s01, out double s10,
                out double s11);
            Assert.Equal(DenseKernels.Dot(a0, b0, n), s00);
            Assert.Equal(DenseKernels.Dot(a0, b1, n), s01);
            Assert.Equal(DenseKernels.Dot(a1, b0, n), s10);
            Assert.Equal(DenseKernels.Dot(a1, b1, n), s11);
        });

    [Property(MaxTest = 200)]
    public Property Dot1x2ExactGivesBothDotsBitForBit() =>
        Prop.ForAll(Gen.Choose(0, 1000).ToArbitrary(), Gen.Choose(0, 41).ToArbitrary(), (seed, n) =>
        {
            var rng = new Random(seed);
            var x = RandomVector(rng, n + 2); var y0 = RandomVector(rng, n); var y1 = RandomVector(rng, n + 5);
            DenseKernels.Dot1x2Exact(x, y0, y1, n, out double s0, out double s1);
            Assert.Equal(DenseKernels.Dot(y0, x, n), s0);
            Assert.Equal(DenseKernels.Dot(y1, x, n), s1);
        });

    [Property(MaxTest = 100)]
    public Property SymmetricUpdateIsIndependentOfTheRowSplitAndMatchesThePlainSums() =>
        Prop.ForAll(Gen.Choose(0, 1000).ToArbitrary(), Gen.Choose(1, 23).ToArbitrary(),
            Gen.Choose(1, 19).ToArbitrary(), (seed, mu, k) =>
        {
            var rng = new Random(seed);
            var l = RandomVector(rng, (mu + 2) * k); // rows 2.. are L₂, row length k
            var u0 = RandomVector(rng, mu * mu);
            var whole = (double[])u0.Clone();
            DenseKernels.SyrkLowerRows(l, 0, k, 2, whole, mu, 0, mu);
            // the split used by the parallel update (even cuts) gives the same bits as one pass
            int parts = Math.Min(4, mu);
            var cuts = DenseKernels.BalancedTriangleSplit(mu, parts);
            var split = (double[])u0.Clone();
            for (int p = 0; p < parts; p++) DenseKernels.SyrkLowerRows(l, 0, k, 2, split, mu, cuts[p], cuts[p + 1]);
            Assert.Equal(whole, split);
            for (int a = 0; a < mu; a++)
                for (int b = 0; b < mu; b++)
                {
                    double expected = u0[(a * mu) + b];
                    if (b <= a)
                    {
                        double s = 0, size = 0;
                        for (int t = 0; t < k; t++)
                        {
                            s += l[((2 + a) * k) + t] * l[((2 + b) * k) + t];
                            size += Math.Abs(l[((2 + a) * k) + t] * l[((2 + b) * k) + t]);
                        }
                        expected -= s;
                        Assert.True(Math.Abs(whole[(a * mu) + b] - expected) <= 1e-14 * (size + Math.Abs(u0[(a * mu)
                            + b])), $"U({a},{b}) {whole[(a * mu) + b]} vs {expected}");
                    }
                    else Assert.Equal(expected, whole[(a * mu) + b]); // the upper triangle is left alone
                }
        });
}
