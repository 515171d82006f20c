using NetAdjust.IO;

namespace NetAdjust.Cli.Commands;

/// <summary>Maps NetAdjust's domain errors to messages and exit codes, so no stack trace reaches the user.</summary>
internal static class CommandRunner
{
    public static int Guard(CliConsole console, Func<int> body)
    {
        try
        {
            return body();
        }
        catch (OutputException e)
        {
            console.Error.WriteLine($"error: {e.Message}");
            return ExitCodes.OutputFailed;
        }
        catch (InvalidInputException e)
        {
            console.Error.WriteLine($"error: {e.Message}");
            return ExitCodes.InvalidInput;
        }
        catch (AdjustmentFailedException e)
        {
            console.Error.WriteLine($"error: adjustment failed: {e.Message}");
            return ExitCodes.AdjustmentFailed;
        }
        catch (OutOfMemoryException)
        {
            // not a defect: the network is larger than the memory the process may use (the outputs are written only
            // when all of them are complete, so none was written or replaced)
            console.Error.WriteLine("error: out of memory: this network needs more memory than the process may " +
                "use (docs/performance.md gives the measured peak per network size); no output was written");
            return ExitCodes.OutOfMemory;
        }
    }
}
