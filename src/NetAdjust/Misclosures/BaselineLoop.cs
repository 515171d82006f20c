namespace NetAdjust.Misclosures;

/// <summary>
/// The misclosure of one closed loop of GNSS baselines (docs/methods.md, "Misclosures before the adjustment"): the sum
/// of the earth-centred vectors round the loop, with the sign of the direction of travel, tested against the sum of
/// their covariances (χ² with 3 degrees of freedom), and shown in parts per million of the loop's length and in the
/// local east, north, up frame at the loop's mean position. Made by the check only (the constructor is internal);
/// lengths typed as <see cref="Units.Length"/>.
/// </summary>
public sealed record BaselineLoop
{
    /// <summary>Made by the baseline loop check.</summary>
    internal BaselineLoop(IReadOnlyList<string> Points, IReadOnlyList<int> Baselines, IReadOnlyList<bool> Reversed,
        IReadOnlyList<string?> Groups, bool Trivial, double Dx, double Dy, double Dz, double Length, double East,
        double North, double Up, double SdEast, double SdNorth, double SdUp, double Statistic, double Critical,
                double ComponentCritical)
    {
        this.Points = Points;
        this.Baselines = Baselines;
        this.Reversed = Reversed;
        this.Groups = Groups;
        this.Trivial = Trivial;
        this.Dx = Dx;
        this.Dy = Dy;
        this.Dz = Dz;
        this.Length = Length;
        this.East = East;
        this.North = North;
        this.Up = Up;
        this.SdEast = SdEast;
        this.SdNorth = SdNorth;
        this.SdUp = SdUp;
        this.Statistic = Statistic;
        this.Critical = Critical;
        this.ComponentCritical = ComponentCritical;
    }

    /// <summary>The points in running order, the first repeated at the end.</summary>
    public IReadOnlyList<string> Points
    {
        get;
        internal init => field = ReadOnlyCopies.List(value);
    }

    /// <summary>Indices of the baselines in running order, in the list that was checked.</summary>
    public IReadOnlyList<int> Baselines
    {
        get;
        internal init => field = ReadOnlyCopies.List(value);
    }

    /// <summary>For each baseline, true when the loop runs it from its end to its start.</summary>
    public IReadOnlyList<bool> Reversed
    {
        get;
        internal init => field = ReadOnlyCopies.List(value);
    }

    /// <summary>The groups (sessions) of the baselines, each once, in running order; null for a baseline
    /// with no group.</summary>
    public IReadOnlyList<string?> Groups
    {
        get;
        internal init => field = ReadOnlyCopies.List(value);
    }

    /// <summary>True when every baseline comes from one group (one session): such a loop closes by the
    /// processing itself and checks little.</summary>
    public bool Trivial { get; internal init; }

    /// <summary>Misclosure ΔX (m). Internal SI value; the public, typed view is <see cref="DeltaX"/>.</summary>
    internal double Dx { get; init; }

    /// <summary>Misclosure ΔX.</summary>
    public Units.Length DeltaX => Units.Length.FromMetres(Dx);

    /// <summary>Misclosure ΔY (m). Internal SI value; the public, typed view is <see cref="DeltaY"/>.</summary>
    internal double Dy { get; init; }

    /// <summary>Misclosure ΔY.</summary>
    public Units.Length DeltaY => Units.Length.FromMetres(Dy);

    /// <summary>Misclosure ΔZ (m). Internal SI value; the public, typed view is <see cref="DeltaZ"/>.</summary>
    internal double Dz { get; init; }

    /// <summary>Misclosure ΔZ.</summary>
    public Units.Length DeltaZ => Units.Length.FromMetres(Dz);

    /// <summary>The loop length, the sum of the baselines' lengths (m). Internal SI value; the public, typed view is
    /// <see cref="LoopLength"/>.</summary>
    internal double Length { get; init; }

    /// <summary>The loop length, the sum of the baselines' lengths.</summary>
    public Units.Length LoopLength => Units.Length.FromMetres(Length);

    /// <summary>The misclosure's east component at the loop's mean position (m); NaN when no position of a
    /// point is known. Internal SI value; the public, typed view is <see cref="EastComponent"/>.</summary>
    internal double East { get; init; }

    /// <summary>The misclosure's east component at the loop's mean position; NaN when no position of a
    /// point is known.</summary>
    public Units.Length EastComponent => Units.Length.FromMetres(East);

    /// <summary>Its north component (m); NaN likewise. Internal SI value; the public, typed view is <see
    /// cref="NorthComponent"/>.</summary>
    internal double North { get; init; }

    /// <summary>Its north component; NaN likewise.</summary>
    public Units.Length NorthComponent => Units.Length.FromMetres(North);

    /// <summary>Its up component (m); NaN likewise. Internal SI value; the public, typed view is <see
    /// cref="UpComponent"/>.</summary>
    internal double Up { get; init; }

    /// <summary>Its up component; NaN likewise.</summary>
    public Units.Length UpComponent => Units.Length.FromMetres(Up);

    /// <summary>Expected standard deviation of <see cref="East"/> (m). Internal SI value; the public, typed view is
    /// <see cref="SdEastComponent"/>.</summary>
    internal double SdEast { get; init; }

    /// <summary>Expected standard deviation of <see cref="East"/>.</summary>
    public Units.Length SdEastComponent => Units.Length.FromMetres(SdEast);

    /// <summary>Expected standard deviation of <see cref="North"/> (m). Internal SI value; the public, typed view is
    /// <see cref="SdNorthComponent"/>.</summary>
    internal double SdNorth { get; init; }

    /// <summary>Expected standard deviation of <see cref="North"/>.</summary>
    public Units.Length SdNorthComponent => Units.Length.FromMetres(SdNorth);

    /// <summary>Expected standard deviation of <see cref="Up"/> (m). Internal SI value; the public, typed view is <see
    /// cref="SdUpComponent"/>.</summary>
    internal double SdUp { get; init; }

    /// <summary>Expected standard deviation of <see cref="Up"/>.</summary>
    public Units.Length SdUpComponent => Units.Length.FromMetres(SdUp);

    /// <summary>wᵀ C⁻¹ w of the misclosure w with the summed covariance C; NaN when C is singular.
    /// </summary>
    public double Statistic { get; internal init; }

    /// <summary>The χ²(3) quantile at the check's confidence.</summary>
    public double Critical { get; internal init; }

    /// <summary>The two-sided normal quantile z at the check's confidence, for the components.
    /// </summary>
    public double ComponentCritical { get; internal init; }

    /// <summary>Indices of the baselines' component observations in the network's observation list (ΔX, ΔY, ΔZ of
    /// each baseline in running order); empty when the loop was checked on vectors outside a network.</summary>
    public IReadOnlyList<int> Observations { get; internal init; } = [];

    /// <summary>The length of the misclosure vector √(ΔX² + ΔY² + ΔZ²) (m); the public, typed view is
    /// <see cref="MisclosureLength"/>.</summary>
    internal double Misclosure => Math.Sqrt(Dx * Dx + Dy * Dy + Dz * Dz);

    /// <summary>The length of the misclosure vector √(ΔX² + ΔY² + ΔZ²).</summary>
    public Units.Length MisclosureLength => Units.Length.FromMetres(Misclosure);

    /// <summary>The misclosure in parts per million of the loop length.</summary>
    public double Ppm => Length > 0 ? Misclosure / Length * 1e6 : double.NaN;

    /// <summary>True when the summed covariance is positive definite, so the loop can be tested.</summary>
    public bool Testable => double.IsFinite(Statistic);

    /// <summary>√(wᵀC⁻¹w / χ²): the misclosure against its allowance (≤ 1 passes); NaN when not testable.</summary>
    public double Ratio => Math.Sqrt(Statistic / Critical);

    /// <summary>The largest |component| / (z σ) of east, north and up (for locating the cause; the pass or fail is
    /// the χ² test's); NaN when no position is known.</summary>
    public double ComponentRatio => Math.Max(Math.Abs(East) / (ComponentCritical * SdEast),
        Math.Max(Math.Abs(North) / (ComponentCritical * SdNorth), Math.Abs(Up) / (ComponentCritical * SdUp)));

    /// <summary>True when the χ² test passes or the loop cannot be tested.</summary>
    public bool Passed => !Testable || Ratio <= 1;
}
