using System.Diagnostics;
using System.Globalization;
using NetAdjust.Adjustment;

namespace NetAdjust.Cli.Commands;

/// <summary>
/// Writes adjustment progress (phase and percent) to standard error, starting only once the run has taken more
/// than a second, so that small adjustments stay silent. Synchronous: each report is written as it comes.
/// </summary>
internal sealed class ProgressPrinter(TextWriter error) : IProgress<AdjustmentProgress>
{
    private readonly Stopwatch _clock = Stopwatch.StartNew();
    private AdjustmentProgress? _pending;

    public void Report(AdjustmentProgress value)
    {
        if (_clock.Elapsed < TimeSpan.FromSeconds(1)) { _pending = value; return; }
        if (_pending is AdjustmentProgress earlier) { Write(earlier); _pending = null; }
        Write(value);
    }

    private void Write(AdjustmentProgress p) => error.WriteLine(string.Create(CultureInfo.InvariantCulture,
        $"netadjust: {_clock.Elapsed.TotalSeconds,6:F1} s  {p.Phase}{(p.Percent is double pc ? $" {pc:F0} %" : "")}"));
}
