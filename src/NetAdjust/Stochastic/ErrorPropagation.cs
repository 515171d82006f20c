using MathNet.Numerics.LinearAlgebra;

namespace NetAdjust.Stochastic;

/// <summary>
/// The elementary rules of error propagation for independent random errors, and the general law of propagation
/// of variances. Each rule is the law Σy = J Σx Jᵀ applied to a simple function; see docs/methods.md
/// ("Error propagation") and e.g. Ghilani (2017), <i>Adjustment Computations</i>, 6th ed., Wiley, chapter 6
/// (from memory), or Koch (1999), <i>Parameter Estimation and Hypothesis Testing in Linear Models</i>, §2.2.
/// </summary>
public static class ErrorPropagation
{
    /// <summary>
    /// Error of a series: the same standard error <paramref name="e"/> committed <paramref name="n"/> times,
    /// independently, in a quantity that is their sum (e.g. n rod readings, a tape laid n times): E·√n.
    /// </summary>
    /// <param name="e">The standard error of one element (≥ 0, any unit).</param>
    /// <param name="n">The number of elements (≥ 1).</param>
    /// <returns>The standard error of the sum, in the unit of <paramref name="e"/>.</returns>
    /// <exception cref="ArgumentOutOfRangeException">When e is negative or not finite, or n &lt; 1.</exception>
    public static double Series(double e, int n)
    {
        CheckError(e, nameof(e));
        if (n < 1) throw new ArgumentOutOfRangeException(nameof(n), n, "a series needs at least one element");
        return e * Math.Sqrt(n);
    }

    /// <summary>Error of a sum: independent errors from different sources combine as √ΣEᵢ² (root-sum-square).</summary>
    /// <param name="errors">The standard errors (each ≥ 0, one unit).</param>
    /// <returns>√ΣEᵢ²; 0 for no errors. Computed with scaling so that it neither overflows nor underflows.</returns>
    /// <exception cref="ArgumentOutOfRangeException">When an error is negative or not finite.</exception>
    public static double Sum(params ReadOnlySpan<double> errors)
    {
        double max = 0;
        foreach (double e in errors)
        {
            CheckError(e, nameof(errors));
            max = Math.Max(max, e);
        }
        if (max == 0) return 0;
        double s = 0;
        foreach (double e in errors) { double r = e / max; s += r * r; }
        return max * Math.Sqrt(s);
    }

    /// <summary>
    /// Error of redundant measurement: the mean of <paramref name="n"/> independent repetitions of a measurement
    /// with standard error <paramref name="e"/> has the standard error E/√n.
    /// </summary>
    /// <param name="e">The standard error of one measurement (≥ 0).</param>
    /// <param name="n">The number of repetitions averaged (≥ 1).</param>
    /// <returns>The standard error of the mean.</returns>
    /// <exception cref="ArgumentOutOfRangeException">When e is negative or not finite, or n &lt; 1.</exception>
    public static double Mean(double e, int n)
    {
        CheckError(e, nameof(e));
        if (n < 1) throw new ArgumentOutOfRangeException(nameof(n), n, "a mean needs at least one measurement");
        return e / Math.Sqrt(n);
    }

    /// <summary>
    /// The general law of propagation of variances and covariances: for y = f(x) linearised as y ≈ J x,
    /// Σy = J Σx Jᵀ. Exact for linear functions; first-order for non-linear ones.
    /// </summary>
    /// <param name="jacobian">J, m×k: ∂yᵢ/∂xⱼ.</param>
    /// <param name="covariance">Σx, k×k, symmetric positive semi-definite.</param>
    /// <returns>Σy, m×m (symmetrised exactly).</returns>
    /// <exception cref="ArgumentException">When the dimensions do not agree or Σx is not square.</exception>
    public static Matrix<double> Propagate(Matrix<double> jacobian, Matrix<double> covariance)
    {
        ArgumentNullException.ThrowIfNull(jacobian);
        ArgumentNullException.ThrowIfNull(covariance);
        if (covariance.RowCount != covariance.ColumnCount)
            throw new ArgumentException("the covariance matrix must be square", nameof(covariance));
        if (jacobian.ColumnCount != covariance.RowCount)
            throw new ArgumentException($"J has {jacobian.ColumnCount} columns but Σx has {covariance.RowCount} rows",
                nameof(jacobian));
        var s = jacobian * covariance * jacobian.Transpose();
        return (s + s.Transpose()) * 0.5; // remove rounding asymmetry
    }

    private static void CheckError(double e, string name)
    {
        if (!(e >= 0) || !double.IsFinite(e))
            throw new ArgumentOutOfRangeException(name, e, "a standard error must be zero or positive and finite");
    }
}
