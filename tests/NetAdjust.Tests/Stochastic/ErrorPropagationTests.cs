using MathNet.Numerics.LinearAlgebra;
using NetAdjust.Stochastic;

namespace NetAdjust.Tests.Stochastic;

public class ErrorPropagationTests
{
    // The three elementary rules are special cases of the general law Σy = J Σx Jᵀ (Koch 1999, §2.2, and
    // Ghilani 2017, ch. 6: section and chapter from memory). Each is checked against the general law evaluated by
    // MathNet.

    [Theory]
    [InlineData(0.0005, 1)]
    [InlineData(0.0005, 4)]
    [InlineData(1.7, 25)]
    public void SeriesEqualsGeneralLawForASumOfNEqualErrors(double e, int n)
    {
        var j = Matrix<double>.Build.Dense(1, n, 1.0);                 // y = x1 + ... + xn
        var sx = Matrix<double>.Build.DiagonalIdentity(n) * (e * e);
        double expected = Math.Sqrt(ErrorPropagation.Propagate(j, sx)[0, 0]);
        Assert.Equal(expected, ErrorPropagation.Series(e, n), 12);
    }

    [Theory]
    [InlineData(5.0, 1)]
    [InlineData(5.0, 2)]
    [InlineData(5.0, 7)]
    public void MeanEqualsGeneralLawForAnAverage(double e, int n)
    {
        var j = Matrix<double>.Build.Dense(1, n, 1.0 / n);             // y = (x1 + ... + xn)/n
        var sx = Matrix<double>.Build.DiagonalIdentity(n) * (e * e);
        double expected = Math.Sqrt(ErrorPropagation.Propagate(j, sx)[0, 0]);
        Assert.Equal(expected, ErrorPropagation.Mean(e, n), 12);
    }

    [Fact]
    public void SumEqualsGeneralLawForIndependentSources()
    {
        double[] e = [0.002, 0.0008, 0.0015, 0.0];
        var j = Matrix<double>.Build.Dense(1, e.Length, 1.0);
        var sx = Matrix<double>.Build.DiagonalOfDiagonalArray(e.Select(x => x * x).ToArray());
        Assert.Equal(Math.Sqrt(ErrorPropagation.Propagate(j, sx)[0, 0]), ErrorPropagation.Sum(e), 15);
        Assert.Equal(0.0, ErrorPropagation.Sum());
    }

    [Fact]
    public void SumNeitherOverflowsNorUnderflows()
    {
        Assert.Equal(5e200, ErrorPropagation.Sum(3e200, 4e200), 1e188);
        Assert.Equal(5e-200, ErrorPropagation.Sum(3e-200, 4e-200), 1e-212);
    }

    [Fact]
    public void PropagateGivesTheCovarianceOfASumAndADifference()
    {
        // y1 = x1 + x2, y2 = x1 − x2 with Σx = diag(a², b²): Σy = [[a²+b², a²−b²], [a²−b², a²+b²]] (worked by hand).
        double a = 3, b = 2;
        var j = Matrix<double>.Build.DenseOfArray(new double[,] { { 1, 1 }, { 1, -1 } });
        var sy = ErrorPropagation.Propagate(j, Matrix<double>.Build.DiagonalOfDiagonalArray([a * a, b * b]));
        Assert.Equal(13.0, sy[0, 0], 12);
        Assert.Equal(5.0, sy[0, 1], 12);
        Assert.Equal(5.0, sy[1, 0], 12);
        Assert.Equal(13.0, sy[1, 1], 12);
    }

    [Fact]
    public void BadArgumentsAreRejected()
    {
        Assert.Throws<ArgumentOutOfRangeException>(() => ErrorPropagation.Series(-1, 2));
        Assert.Throws<ArgumentOutOfRangeException>(() => ErrorPropagation.Series(1, 0));
        Assert.Throws<ArgumentOutOfRangeException>(() => ErrorPropagation.Mean(double.NaN, 2));
        Assert.Throws<ArgumentOutOfRangeException>(() => ErrorPropagation.Sum(1, -0.1));
        Assert.Throws<ArgumentException>(() =>
            ErrorPropagation.Propagate(Matrix<double>.Build.Dense(1, 3), Matrix<double>.Build.Dense(2, 2)));
    }

    [Fact]
    public void BudgetTotalIsTheRootSumSquareAndNamesAreChecked()
    {
        var b = new ErrorBudget([new("a", 3), new("b", 4)]);
        Assert.Equal(5.0, b.Total, 15);
        Assert.Equal(4.0, b.ValueOf("b"));
        Assert.Equal(0.0, b.ValueOf("c"));
        Assert.Equal(10.0, b.Scaled(2).Total, 14);
        Assert.Throws<ArgumentException>(() => new ErrorBudget([new("a", 3), new("a", 4)]));
        Assert.Throws<ArgumentException>(() => new ErrorBudget([new("a", -3)]));
        Assert.Throws<ArgumentException>(() => new ErrorBudget([new("a", 0)]));
    }
}
