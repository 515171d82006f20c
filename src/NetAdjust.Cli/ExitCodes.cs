namespace NetAdjust.Cli;

/// <summary>The documented exit codes of the <c>netadjust</c> command (docs/cli.md).</summary>
public static class ExitCodes
{
    /// <summary>Success. A failed global test is a result, not an error: it also exits 0.</summary>
    public const int Success = 0;

    /// <summary>The command line is wrong (unknown option, missing argument).</summary>
    public const int Usage = 1;

    /// <summary>The input is invalid (project file, CSV, specification): nothing was adjusted.</summary>
    public const int InvalidInput = 2;

    /// <summary>The adjustment failed (datum defect, no convergence).</summary>
    public const int AdjustmentFailed = 3;

    /// <summary>An output file could not be written (nothing partial was left).</summary>
    public const int OutputFailed = 4;

    /// <summary>The run needed more memory than the process may use (nothing was written).</summary>
    public const int OutOfMemory = 5;

    /// <summary>An unexpected internal error (a defect: please report it).</summary>
    public const int InternalError = 70;
}
