using NetAdjust.Cli.Commands;
using Xunit;

namespace NetAdjust.Cli.Tests.Commands;

/// <summary>A run that exhausts the memory it may use is reported as such (exit code 5, docs/cli.md), not as a
/// defect.</summary>
public class OutOfMemoryTests
{
    [Fact]
    public void OutOfMemoryIsAClearMessageAndItsOwnExitCode()
    {
        using var o = new StringWriter();
        using var e = new StringWriter();
        int code = CommandRunner.Guard(new CliConsole(o, e), () => throw new OutOfMemoryException());
        Assert.Equal(ExitCodes.OutOfMemory, code);
        Assert.Equal(5, code);
        Assert.StartsWith("error: out of memory:", e.ToString(), StringComparison.Ordinal);
        Assert.Contains("no output was written", e.ToString(), StringComparison.Ordinal);
        Assert.DoesNotContain("defect", e.ToString(), StringComparison.Ordinal);
    }

    [Fact]
    public void AnUnexpectedErrorIsStillNotCaughtByTheGuard()
    {
        // the guard maps only the documented failures; anything else reaches Program's internal-error handler (70)
        using var o = new StringWriter();
        using var e = new StringWriter();
        Assert.Throws<InvalidOperationException>(() =>
            CommandRunner.Guard(new CliConsole(o, e), () => throw new InvalidOperationException("boom")));
    }
}
