namespace NetAdjust.Stochastic;

/// <summary>One named contribution to a standard deviation, in SI units (metres, or radians for angles).</summary>
/// <param name="Name">A snake_case name, e.g. <c>edm_constant</c> (see <see cref="ContributionNames"/>).</param>
/// <param name="Value">The contribution's standard deviation (≥ 0), metres or radians.</param>
public sealed record ErrorContribution(string Name, double Value);

/// <summary>
/// The error budget of one observation: an ordered list of named, mutually independent contributions whose
/// root-sum-square (error of a sum, √ΣEᵢ²) is the observation's a-priori standard deviation. Immutable.
/// </summary>
public sealed class ErrorBudget
{
    private readonly ErrorContribution[] _items;

    /// <summary>Creates a budget.</summary>
    /// <param name="contributions">The contributions in the order they should be shown; names distinct, values ≥ 0 and
    /// finite.</param>
    /// <exception cref="ArgumentException">When a name repeats or is empty, a value is negative or not finite, or the
    /// total is 0.</exception>
    public ErrorBudget(IEnumerable<ErrorContribution> contributions)
    {
        ArgumentNullException.ThrowIfNull(contributions);
        _items = contributions.ToArray();
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

    /// <summary>The contributions, in order.</summary>
    public IReadOnlyList<ErrorContribution> Contributions { get; }

    /// <summary>The total standard deviation √ΣEᵢ² (SI units).</summary>
    public double Total { get; }

    /// <summary>The value of a named contribution, or 0 when the budget has none of that name.</summary>
    /// <param name="name">The contribution's name.</param>
    public double ValueOf(string name) => _items.FirstOrDefault(c => c.Name == name)?.Value ?? 0.0;

    /// <summary>The budget with every contribution multiplied by a positive factor (e.g. a unit conversion).</summary>
    /// <param name="factor">The factor (&gt; 0).</param>
    public ErrorBudget Scaled(double factor) =>
        factor > 0 && double.IsFinite(factor)
            ? new ErrorBudget(_items.Select(c => c with { Value = c.Value * factor }))
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
