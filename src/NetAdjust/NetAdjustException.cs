namespace NetAdjust;

/// <summary>
/// Base of every error NetAdjust reports on purpose. Messages are written for the surveyor and name the points
/// and observations involved. The command-line tool maps each subtype to a documented exit code.
/// </summary>
public abstract class NetAdjustException : Exception
{
    /// <summary>Creates the exception.</summary>
    /// <param name="message">A message in the surveyor's terms.</param>
    /// <param name="inner">The underlying cause, if any.</param>
    protected NetAdjustException(string message, Exception? inner = null) : base(message, inner) { }
}

/// <summary>The input (network, project file, specification) is invalid: nothing was adjusted.</summary>
public class InvalidInputException : NetAdjustException
{
    /// <summary>Creates the exception.</summary>
    /// <param name="message">What is wrong and where.</param>
    /// <param name="inner">The underlying cause, if any.</param>
    public InvalidInputException(string message, Exception? inner = null) : base(message, inner) { }
}

/// <summary>The adjustment could not be computed (datum defect, no convergence).</summary>
public class AdjustmentFailedException : NetAdjustException
{
    /// <summary>Creates the exception.</summary>
    /// <param name="message">What failed, in the surveyor's terms.</param>
    /// <param name="inner">The underlying cause, if any.</param>
    public AdjustmentFailedException(string message, Exception? inner = null) : base(message, inner) { }
}

/// <summary>
/// The observations and control leave part of the reference frame undetermined (translation, rotation, scale,
/// height datum) or the network falls apart into pieces: the normal matrix is singular.
/// </summary>
public sealed class DatumDefectException : AdjustmentFailedException
{
    /// <summary>Creates the exception.</summary>
    /// <param name="message">Which unknowns are undetermined and what to add.</param>
    /// <param name="undetermined">Descriptions of the unknowns found undetermined (e.g. "easting of T4").</param>
    public DatumDefectException(string message, IReadOnlyList<string> undetermined) : base(message) =>
        Undetermined = ReadOnlyCopies.List(undetermined);

    /// <summary>Descriptions of the unknowns found undetermined.</summary>
    public IReadOnlyList<string> Undetermined { get; }
}

/// <summary>Gauss-Newton iterations did not converge within the iteration limit.</summary>
public sealed class NoConvergenceException : AdjustmentFailedException
{
    /// <summary>Creates the exception.</summary>
    /// <param name="message">The message, naming the points with the largest last corrections.</param>
    public NoConvergenceException(string message) : base(message) { }
}
