using NetAdjust.Units;

namespace NetAdjust.Stochastic;

/// <summary>
/// One named contribution to a standard deviation: a <see cref="Quantity"/>, a length for distances and height
/// differences, an angle for directions, angles and zenith angles (the kind of the budget it belongs to).
/// </summary>
public sealed record ErrorContribution
{
    /// <summary>Creates a contribution.</summary>
    /// <param name="name">A snake_case name, e.g. <c>edm_constant</c> (see <see cref="ContributionNames"/>).</param>
    /// <param name="sd">The contribution's standard deviation (zero or positive, finite), a length or an angle.
    /// </param>
    /// <exception cref="ArgumentOutOfRangeException">When the standard deviation is negative or not finite.
    /// </exception>
    public ErrorContribution(string name, Quantity sd)
    {
        Name = name;
        Value = sd.Si;
        IsAngle = sd.IsAngle;
        if (!(Value >= 0) || !double.IsFinite(Value))
            throw new ArgumentOutOfRangeException(nameof(sd), sd,
                "a standard deviation must be zero or positive and finite");
    }

    /// <summary>Made by the budget builders: the value in SI units; the kind is set by the budget
    /// (<see cref="ErrorBudget(IEnumerable{ErrorContribution}, bool)"/>), a length until then.</summary>
    internal ErrorContribution(string name, double value)
    {
        Name = name;
        Value = value;
    }

    /// <summary>A snake_case name, e.g. <c>edm_constant</c> (see <see cref="ContributionNames"/>).</summary>
    public string Name { get; }

    /// <summary>The contribution's standard deviation (≥ 0) in SI units, metres or radians (<see cref="IsAngle"/>),
    /// for the library and its writers.</summary>
    internal double Value { get; init; }

    /// <summary>True when <see cref="Value"/> is an angle (radians).</summary>
    internal bool IsAngle { get; init; }

    /// <summary>The contribution's standard deviation (≥ 0): a length, or an angle for angular observations.</summary>
    public Quantity Sd => Quantity.FromSi(Value, IsAngle);
}

/// <summary>
/// The error budget of one observation: an ordered list of named, mutually independent contributions whose
/// root-sum-square (error of a sum, √ΣEᵢ²) is the observation's a-priori standard deviation. All contributions are
/// of one kind: lengths for distances and height differences, angles for directions, angles and zenith angles.
/// Immutable.
/// </summary>
public sealed class ErrorBudget
{
    private readonly ErrorContribution[] _items;

    /// <summary>Creates a budget.</summary>
    /// <param name="contributions">The contributions in the order they should be shown; names distinct, values ≥ 0 and
    /// finite.</param>
    /// <exception cref="ArgumentException">When a name repeats or is empty, a value is negative or not finite, lengths
    /// and angles are mixed, or the total is 0.</exception>
    public ErrorBudget(IEnumerable<ErrorContribution> contributions)
        : this(Checked(contributions, out bool isAngle), isAngle)
    {
    }

    /// <summary>Made by the budget builders: every contribution taken as a length, or as an angle when
    /// <paramref name="isAngle"/>, whatever kind it had.</summary>
    /// <param name="contributions">The contributions in SI units.</param>
    /// <param name="isAngle">True when the observation's value is an angle.</param>
    internal ErrorBudget(IEnumerable<ErrorContribution> contributions, bool isAngle)
    {
        ArgumentNullException.ThrowIfNull(contributions);
        IsAngle = isAngle;
        _items = contributions.Select(c => c.IsAngle == isAngle ? c : c with { IsAngle = isAngle }).ToArray();
        Contributions = _items.AsReadOnly();
        var names = new HashSet<string>(StringComparer.Ordinal);
        foreach (var c in _items)
        {
            if (string.IsNullOrWhiteSpace(c.Name))
                throw new ArgumentException("an error contribution needs a name", nameof(contributions));
            if (!names.Add(c.Name))
                throw new ArgumentException($"the error contribution '{c.Name}' appears twice", nameof(contributions));
            if (!(c.Value >= 0) || !double.IsFinite(c.Value))
                throw new ArgumentException(
                    $"the error contribution '{c.Name}' must be zero or positive and finite, not {c.Value}",
                    nameof(contributions));
        }
        Total = ErrorPropagation.Sum(_items.Select(c => c.Value).ToArray());
        if (!(Total > 0))
            throw new ArgumentException("an error budget must have a positive total: every contribution is zero",
                nameof(contributions));
    }

    /// <summary>The public constructor's check before the kind is read: a list, with one kind in it.</summary>
    private static ErrorContribution[] Checked(IEnumerable<ErrorContribution> contributions, out bool isAngle)
    {
        ArgumentNullException.ThrowIfNull(contributions);
        var items = contributions.ToArray();
        if (items.Length == 0)
            throw new ArgumentException("an error budget must have a positive total: it has no contribution",
                nameof(contributions));
        if (items.Any(c => c is null))
            throw new ArgumentException("an error contribution is null", nameof(contributions));
        if (items.Any(c => c.IsAngle != items[0].IsAngle))
            throw new ArgumentException("an error budget's contributions are all lengths or all angles, not both",
                nameof(contributions));
        isAngle = items[0].IsAngle;
        return items;
    }

    /// <summary>The contributions, in order.</summary>
    public IReadOnlyList<ErrorContribution> Contributions { get; }

    /// <summary>True when the budget is of an angle (its values in radians), false for a length.</summary>
    internal bool IsAngle { get; }

    /// <summary>The total standard deviation √ΣEᵢ² in SI units, metres or radians (<see cref="IsAngle"/>), for the
    /// library and its writers.</summary>
    internal double Total { get; }

    /// <summary>The total standard deviation √ΣEᵢ²: a length, or an angle for angular observations.</summary>
    public Quantity TotalSd => Quantity.FromSi(Total, IsAngle);

    /// <summary>The value of a named contribution in SI units (metres or radians), or 0 when the budget has none of
    /// that name.</summary>
    /// <param name="name">The contribution's name.</param>
    internal double ValueOf(string name) => _items.FirstOrDefault(c => c.Name == name)?.Value ?? 0.0;

    /// <summary>The standard deviation of a named contribution (a length or an angle, as the budget), zero when the
    /// budget has none of that name.</summary>
    /// <param name="name">The contribution's name.</param>
    public Quantity SdOf(string name) => Quantity.FromSi(ValueOf(name), IsAngle);

    /// <summary>The budget with every contribution multiplied by a positive dimensionless factor (e.g. an
    /// observation's standard-deviation factor); the kind stays.</summary>
    /// <param name="factor">The factor (&gt; 0).</param>
    public ErrorBudget Scaled(double factor) =>
        factor > 0 && double.IsFinite(factor)
            ? new ErrorBudget(_items.Select(c => c with { Value = c.Value * factor }), IsAngle)
            : throw new ArgumentOutOfRangeException(nameof(factor), factor, "the factor must be positive and finite");
}

/// <summary>The names of error contributions used by the builders (snake_case, as in the JSON output).</summary>
public static class ContributionNames
{
    /// <summary>EDM constant part a.</summary>
    public const string EdmConstant = "edm_constant";

    /// <summary>EDM distance-proportional part b·D.</summary>
    public const string EdmProportional = "edm_proportional";

    /// <summary>Centering of the instrument over its mark.</summary>
    public const string InstrumentCentering = "instrument_centering";

    /// <summary>Centering of the target (for an angle: of both targets together, or per side when named so).</summary>
    public const string TargetCentering = "target_centering";

    /// <summary>Centering of the backsight target of an angle.</summary>
    public const string BacksightCentering = "backsight_centering";

    /// <summary>Centering of the foresight target of an angle.</summary>
    public const string ForesightCentering = "foresight_centering";

    /// <summary>Pointing and reading of the horizontal circle, from the ISO 17123-3 σ, the sets and the
    /// faces.</summary>
    public const string PointingReading = "pointing_reading";

    /// <summary>Pointing and reading of the vertical circle, from the ISO 17123-3 zenith σ, the sets and the
    /// faces.</summary>
    public const string ZenithPointingReading = "zenith_pointing_reading";

    /// <summary>The measured instrument height, carried into a zenith angle as σ_i / horizontal distance.</summary>
    public const string InstrumentHeight = "instrument_height";

    /// <summary>The measured target height, carried into a zenith angle as σ_t / horizontal distance.</summary>
    public const string TargetHeight = "target_height";

    /// <summary>The uncertainty σ_k of an assumed refraction coefficient, carried into a zenith angle as
    /// σ_k·s/(2R) radians (s the horizontal distance, R the mean earth radius).</summary>
    public const string Refraction = "refraction";

    /// <summary>Levelling per km (ISO 17123-2 σ × √K).</summary>
    public const string LevellingPerKm = "levelling_per_km";

    /// <summary>Rod readings of a levelling section (per-reading σ as an error of a series).</summary>
    public const string RodReadings = "rod_readings";

    /// <summary>Rounding of the rod readings to the reading resolution.</summary>
    public const string RodRounding = "rod_rounding";
}
