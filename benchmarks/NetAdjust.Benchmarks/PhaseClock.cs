using System.Diagnostics;
using System.Globalization;

namespace NetAdjust.Benchmarks;

/// <summary>Wall and CPU time (user + system, of the whole process, so that parallel work counts) per phase of an
/// in-process probe: <see cref="Lap"/> closes the phase that ran since the last lap.</summary>
internal sealed class PhaseClock
{
    private readonly Stopwatch _wall = Stopwatch.StartNew();
    private TimeSpan _cpu = Process.GetCurrentProcess().TotalProcessorTime;

    /// <summary>The phases closed so far, in order.</summary>
    public List<(string Phase, double Wall, double Cpu)> Laps { get; } = [];

    /// <summary>Closes a phase.</summary>
    public void Lap(string phase)
    {
        var cpu = Process.GetCurrentProcess().TotalProcessorTime;
        Laps.Add((phase, _wall.Elapsed.TotalSeconds, (cpu - _cpu).TotalSeconds));
        _cpu = cpu;
        _wall.Restart();
    }

    /// <summary>Prints a line per phase (names padded to <paramref name="width"/>) and, when asked, their total.
    /// </summary>
    public void Print(int width = 22, bool total = true)
    {
        var inv = CultureInfo.InvariantCulture;
        foreach (var (phase, wall, cpu) in Laps)
            Console.WriteLine(string.Create(inv,
                $"  {phase.PadRight(width)} wall {wall,7:F3} s   CPU {cpu,7:F3} s"));
        if (total)
        {
            double wall = Laps.Sum(l => l.Wall), cpu = Laps.Sum(l => l.Cpu);
            Console.WriteLine(string.Create(inv, $"  {"total".PadRight(width)} wall {wall,7:F3} s   CPU {cpu,7:F3} s"));
        }
    }
}
