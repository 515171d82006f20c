namespace NetAdjust.Simulation;

/// <summary>
/// The one seeded noise source of the simulations (<c>netadjust simulate --scenario</c> and <c>plan --simulate</c>):
/// uniform numbers and Gaussian noise by the Box–Muller transform on a seeded <see cref="Random"/>, so the same seed
/// gives the same draw on every machine.
/// </summary>
internal sealed class SeededNoise(int seed)
{
    private readonly Random _rng = new(seed);

    /// <summary>A uniform number in [a, b).</summary>
    public double Uniform(double a, double b) => a + ((b - a) * _rng.NextDouble());

    /// <summary>A normal number of mean 0 and standard deviation <paramref name="sd"/> (Box–Muller).</summary>
    public double Gauss(double sd) =>
        sd * Math.Sqrt(-2 * Math.Log(1 - _rng.NextDouble())) * Math.Cos(2 * Math.PI * _rng.NextDouble());
}
