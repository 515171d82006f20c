using NetAdjust.Units;

namespace NetAdjust.Network;

/// <summary>
/// The accuracy of an electronic distance meter as a constant part plus a part proportional to the distance
/// (e.g. <c>3 mm + 2 ppm</c>). The two parts are combined as independent errors (root-sum-square) by
/// <c>Stochastic.DistanceBudgetBuilder</c>.
/// </summary>
public sealed record EdmSpecification
{
    /// <summary>Creates a specification.</summary>
    /// <param name="constant">The constant part a (≥ 0), e.g. <c>Length.FromMillimetres(2)</c>.</param>
    /// <param name="ppm">The proportional part b, parts per million of the distance (≥ 0).</param>
    /// <exception cref="InvalidInputException">When a part is negative or not finite.</exception>
    public EdmSpecification(Length constant, double ppm) : this(constant.Metres, ppm) { }

    /// <summary>Creates a specification from the constant part in metres (SI, for the reader).</summary>
    internal EdmSpecification(double constant, double ppm)
    {
        Checks.NonNegative(constant, "the EDM constant part");
        Checks.NonNegative(ppm, "the EDM proportional part (ppm)");
        Constant = constant;
        Ppm = ppm;
    }

    /// <summary>The constant part a, metres (SI, for the stochastic model).</summary>
    internal double Constant { get; }

    /// <summary>The constant part a.</summary>
    public Length ConstantPart => Length.FromMetres(Constant);

    /// <summary>The proportional part b, parts per million.</summary>
    public double Ppm { get; }

    /// <summary>
    /// Parses <c>A [unit] + B ppm</c>, e.g. <c>3 mm + 2 ppm</c>, <c>0.01 ft + 5ppm</c>, <c>2mm</c> (b = 0),
    /// <c>1.5 ppm</c> (a = 0). A bare number for a is read in <paramref name="unit"/>.
    /// Illegal: <c>3 mm + x ppm</c>, <c>3 mm + 2</c> (no ppm), <c>-3 mm + 2 ppm</c> (negative), empty text.
    /// </summary>
    /// <param name="text">The text.</param>
    /// <param name="unit">The unit of a bare constant part.</param>
    /// <returns>The specification, or a message naming what is wrong.</returns>
    public static ParseResult<EdmSpecification> Parse(string? text, LengthUnit unit)
    {
        if (string.IsNullOrWhiteSpace(text))
            return ParseResult<EdmSpecification>.Fail(
                "an EDM specification such as '3 mm + 2 ppm' is required, but the text is empty");
        string t = text.Trim();
        string[] parts = t.Split('+');
        double a = 0, b = 0;
        bool seenA = false, seenB = false;
        foreach (string raw in parts)
        {
            string p = raw.Trim();
            if (p.Length == 0)
                return ParseResult<EdmSpecification>.Fail(
                    $"'{t}' is not an EDM specification: write it as 'a mm + b ppm', e.g. '3 mm + 2 ppm'");
            if (p.EndsWith("ppm", StringComparison.Ordinal))
            {
                string num = p[..^3].Trim();
                if (seenB) return ParseResult<EdmSpecification>.Fail($"'{t}' gives the ppm part twice");
                if (!AnglePattern.TryNumber(num, out b))
                    return ParseResult<EdmSpecification>.Fail($"'{num}' in '{t}' is not a number of ppm");
                if (b < 0) return ParseResult<EdmSpecification>.Fail($"the ppm part in '{t}' must not be negative");
                seenB = true;
            }
            else
            {
                if (seenA)
                    return ParseResult<EdmSpecification>.Fail(
                        $"'{t}' gives the constant part twice, or its second part lacks 'ppm'");
                var r = new LengthPattern(unit, 4).Parse(p);
                if (!r.Success) return ParseResult<EdmSpecification>.Fail($"the constant part of '{t}': {r.Error}");
                a = r.Value.Metres;
                if (a < 0)
                    return ParseResult<EdmSpecification>.Fail($"the constant part in '{t}' must not be negative");
                seenA = true;
            }
        }
        return ParseResult<EdmSpecification>.Ok(new EdmSpecification(a, b));
    }
}

/// <summary>
/// A total station (or theodolite with EDM). Angular values in radians, lengths in metres. Centering errors are
/// the standard deviation of the offset from the mark in any one horizontal direction (per axis).
/// </summary>
public sealed record TotalStationSpecification
{
    /// <summary>Creates a specification.</summary>
    /// <param name="id">The name used in the project file.</param>
    /// <param name="directionSd">ISO 17123-3 σ of a horizontal direction observed once in both faces (&gt; 0),
    /// e.g. <c>Angle.FromArcseconds(1)</c>.</param>
    /// <param name="zenithSd">ISO 17123-3 σ of a zenith angle observed once in both faces (≥ 0; zero when not
    /// given).</param>
    /// <param name="edm">The EDM specification; null when the instrument measures no distances.</param>
    /// <param name="centeringSd">Instrument centering σ per axis (≥ 0).</param>
    /// <param name="heightSd">Instrument height measurement σ (≥ 0).</param>
    /// <exception cref="InvalidInputException">When a value is out of range.</exception>
    public TotalStationSpecification(string id, Angle directionSd, Angle zenithSd, EdmSpecification? edm,
        Length centeringSd, Length heightSd)
        : this(id, directionSd.Radians, zenithSd.Radians, edm, centeringSd.Metres, heightSd.Metres) { }

    /// <summary>Creates a specification from SI values (for the reader).</summary>
    /// <param name="id">The name used in the project file.</param>
    /// <param name="directionSd">ISO 17123-3 σ of a horizontal direction observed once in both faces,
    /// radians (&gt; 0).</param>
    /// <param name="zenithSd">ISO 17123-3 σ of a zenith angle observed once in both faces, radians (≥ 0; 0 when not
    /// given). Stored for 3D use.</param>
    /// <param name="edm">The EDM specification; null when the instrument measures no distances.</param>
    /// <param name="centeringSd">Instrument centering σ per axis, metres (≥ 0).</param>
    /// <param name="heightSd">Instrument height measurement σ, metres (≥ 0). Stored for 3D use.</param>
    /// <exception cref="InvalidInputException">When a value is out of range.</exception>
    internal TotalStationSpecification(string id, double directionSd, double zenithSd, EdmSpecification? edm,
        double centeringSd, double heightSd)
    {
        Checks.Id(id, "an instrument");
        Id = id;
        Checks.Positive(directionSd, $"the direction standard deviation of instrument {id}");
        Checks.NonNegative(zenithSd, $"the zenith angle standard deviation of instrument {id}");
        Checks.NonNegative(centeringSd, $"the centering error of instrument {id}");
        Checks.NonNegative(heightSd, $"the height measurement error of instrument {id}");
        DirectionSd = directionSd;
        ZenithSd = zenithSd;
        Edm = edm;
        CenteringSd = centeringSd;
        HeightSd = heightSd;
    }

    /// <summary>The name used in the project file.</summary>
    public string Id { get; }

    /// <summary>ISO 17123-3 σ of one horizontal direction observed once in both faces, radians (SI, for the
    /// stochastic model).</summary>
    internal double DirectionSd { get; }

    /// <summary>ISO 17123-3 σ of one zenith angle observed once in both faces, radians (0 when not given).</summary>
    internal double ZenithSd { get; }

    /// <summary>The EDM specification, or null.</summary>
    public EdmSpecification? Edm { get; }

    /// <summary>Centering σ per axis, metres.</summary>
    internal double CenteringSd { get; }

    /// <summary>Instrument height measurement σ, metres.</summary>
    internal double HeightSd { get; }

    /// <summary>ISO 17123-3 σ of one horizontal direction observed once in both faces.</summary>
    public Angle DirectionStandardDeviation => Angle.FromRadians(DirectionSd);

    /// <summary>ISO 17123-3 σ of one zenith angle observed once in both faces (zero when not given).</summary>
    public Angle ZenithStandardDeviation => Angle.FromRadians(ZenithSd);

    /// <summary>Centering σ per axis.</summary>
    public Length CenteringStandardDeviation => Length.FromMetres(CenteringSd);

    /// <summary>Instrument height measurement σ.</summary>
    public Length HeightStandardDeviation => Length.FromMetres(HeightSd);
}

/// <summary>A target (prism on a pole, on a tripod with tribrach, on a bipod...). Lengths in metres.</summary>
public sealed record TargetSpecification
{
    /// <summary>Creates a specification.</summary>
    /// <param name="id">The name used in the project file.</param>
    /// <param name="centeringSd">Centering σ per axis (≥ 0), e.g. <c>Length.FromMillimetres(1)</c>.</param>
    /// <param name="heightSd">Target height measurement σ (≥ 0).</param>
    /// <exception cref="InvalidInputException">When a value is out of range.</exception>
    public TargetSpecification(string id, Length centeringSd, Length heightSd)
        : this(id, centeringSd.Metres, heightSd.Metres) { }

    /// <summary>Creates a specification from SI values (for the reader).</summary>
    /// <param name="id">The name used in the project file.</param>
    /// <param name="centeringSd">Centering σ per axis, metres (≥ 0).</param>
    /// <param name="heightSd">Target height measurement σ, metres (≥ 0). Stored for 3D use.</param>
    /// <exception cref="InvalidInputException">When a value is out of range.</exception>
    internal TargetSpecification(string id, double centeringSd, double heightSd)
    {
        Checks.Id(id, "a target");
        Id = id;
        Checks.NonNegative(centeringSd, $"the centering error of target {id}");
        Checks.NonNegative(heightSd, $"the height measurement error of target {id}");
        CenteringSd = centeringSd;
        HeightSd = heightSd;
    }

    /// <summary>The name used in the project file.</summary>
    public string Id { get; }

    /// <summary>Centering σ per axis, metres (SI, for the stochastic model).</summary>
    internal double CenteringSd { get; }

    /// <summary>Height measurement σ, metres.</summary>
    internal double HeightSd { get; }

    /// <summary>Centering σ per axis.</summary>
    public Length CenteringStandardDeviation => Length.FromMetres(CenteringSd);

    /// <summary>Target height measurement σ.</summary>
    public Length HeightStandardDeviation => Length.FromMetres(HeightSd);
}

/// <summary>Whether directions are observed in both faces (face left and face right) or one face only.</summary>
public enum Faces
{
    /// <summary>Both faces: each set is the mean of face left and face right.</summary>
    Both,

    /// <summary>One face only.</summary>
    One,
}

/// <summary>How directions are observed at a setup: the number of sets averaged and the faces.</summary>
public sealed record ObservingProcedure
{
    /// <summary>One set in both faces.</summary>
    public static ObservingProcedure Default { get; } = new(1, Faces.Both);

    /// <summary>Creates a procedure.</summary>
    /// <param name="sets">Number of sets averaged (1..1000).</param>
    /// <param name="faces">Faces observed in each set.</param>
    /// <exception cref="InvalidInputException">When sets is out of range.</exception>
    public ObservingProcedure(int sets, Faces faces)
    {
        if (sets is < 1 or > 1000)
            throw new InvalidInputException($"the number of sets must be a whole number from 1 to 1000, not {sets}");
        Sets = sets;
        Faces = faces;
    }

    /// <summary>Number of sets averaged.</summary>
    public int Sets { get; }

    /// <summary>Faces observed in each set.</summary>
    public Faces Faces { get; }
}

/// <summary>How the rounding of a rod reading to its resolution d is counted.</summary>
public enum RoundingTreatment
{
    /// <summary>As a uniform distribution: σ = d/√12 (GUM, JCGM 100:2008 §4.3.7 and §F.2.2.1).</summary>
    Uniform,

    /// <summary>As the conservative maximum error: σ = d/2.</summary>
    HalfResolution,
}

/// <summary>
/// A level: either the ISO 17123-2 standard deviation of 1 km of double-run levelling, or the standard deviation
/// of one rod reading (with the reading resolution and how to count its rounding). Lengths in metres.
/// </summary>
public sealed record LevelSpecification
{
    private LevelSpecification(string id, double? perKm, double? reading, double resolution, RoundingTreatment rounding)
    {
        Checks.Id(id, "a level");
        Id = id;
        SdPerKm = perKm;
        ReadingSd = reading;
        Resolution = resolution;
        Rounding = rounding;
    }

    /// <summary>A level described by its ISO 17123-2 σ of 1 km double-run levelling.</summary>
    /// <param name="id">The name used in the project file.</param>
    /// <param name="sdPerKm">σ of 1 km of double-run levelling (&gt; 0), e.g. <c>Length.FromMillimetres(0.7)</c>.
    /// </param>
    /// <exception cref="InvalidInputException">When σ is not positive.</exception>
    public static LevelSpecification PerKm(string id, Length sdPerKm) => PerKm(id, sdPerKm.Metres);

    /// <summary>A level described by the σ of one rod reading and the reading resolution.</summary>
    /// <param name="id">The name used in the project file.</param>
    /// <param name="readingSd">σ of one rod reading (pointing, level bubble or compensator, rod) (≥ 0).</param>
    /// <param name="resolution">The reading resolution d (≥ 0; zero when rounding is negligible).</param>
    /// <param name="rounding">How the rounding to d is counted.</param>
    /// <exception cref="InvalidInputException">When a value is out of range or both are zero.</exception>
    public static LevelSpecification PerReading(string id, Length readingSd, Length resolution,
        RoundingTreatment rounding) => PerReading(id, readingSd.Metres, resolution.Metres, rounding);

    /// <summary>A level described by its σ per km in metres (SI, for the reader).</summary>
    /// <param name="id">The name used in the project file.</param>
    /// <param name="sdPerKm">σ of 1 km of double-run levelling, metres (&gt; 0), e.g. 0.0007 for 0.7 mm.</param>
    /// <exception cref="InvalidInputException">When σ is not positive.</exception>
    internal static LevelSpecification PerKm(string id, double sdPerKm)
    {
        Checks.Positive(sdPerKm, $"the standard deviation per km of level {id}");
        return new(id, sdPerKm, null, 0, RoundingTreatment.Uniform);
    }

    /// <summary>A level described by the σ of one rod reading and the reading resolution, metres (SI, for the
    /// reader).</summary>
    /// <param name="id">The name used in the project file.</param>
    /// <param name="readingSd">σ of one rod reading (pointing, level bubble or compensator, rod), metres (≥ 0).</param>
    /// <param name="resolution">The reading resolution d, metres (≥ 0; 0 when rounding is negligible).</param>
    /// <param name="rounding">How the rounding to d is counted.</param>
    /// <exception cref="InvalidInputException">When a value is out of range or both are zero.</exception>
    internal static LevelSpecification PerReading(string id, double readingSd, double resolution,
        RoundingTreatment rounding)
    {
        Checks.NonNegative(readingSd, $"the reading standard deviation of level {id}");
        Checks.NonNegative(resolution, $"the reading resolution of level {id}");
        if (readingSd == 0 && resolution == 0)
            throw new InvalidInputException($"level {id}: give a positive reading standard deviation or resolution");
        return new(id, null, readingSd, resolution, rounding);
    }

    /// <summary>The name used in the project file.</summary>
    public string Id { get; }

    /// <summary>ISO 17123-2 σ of 1 km double-run levelling, metres; null for the per-reading model (SI, for the
    /// stochastic model).</summary>
    internal double? SdPerKm { get; }

    /// <summary>σ of one rod reading, metres; null for the per-km model.</summary>
    internal double? ReadingSd { get; }

    /// <summary>Reading resolution d, metres (per-reading model; 0 otherwise).</summary>
    internal double Resolution { get; }

    /// <summary>ISO 17123-2 σ of 1 km double-run levelling; null for the per-reading model.</summary>
    public Length? StandardDeviationPerKm => SdPerKm is double v ? Length.FromMetres(v) : null;

    /// <summary>σ of one rod reading; null for the per-km model.</summary>
    public Length? ReadingStandardDeviation => ReadingSd is double v ? Length.FromMetres(v) : null;

    /// <summary>Reading resolution d (per-reading model; zero otherwise).</summary>
    public Length ReadingResolution => Length.FromMetres(Resolution);

    /// <summary>The σ of the rounding of one reading: d/√12 (uniform) or d/2 (half resolution).</summary>
    public Length RoundingStandardDeviation => Length.FromMetres(RoundingSd);

    /// <summary>How the rounding is counted.</summary>
    public RoundingTreatment Rounding { get; }

    /// <summary>The σ of the rounding of one reading in metres: d/√12 (uniform) or d/2 (half resolution).</summary>
    internal double RoundingSd =>
        Rounding == RoundingTreatment.Uniform ? Resolution / Math.Sqrt(12.0) : Resolution / 2.0;
}

/// <summary>How one levelling section was run: the number of instrument setups in one run, and how many runs are
/// meaned.</summary>
public sealed record LevellingProcedure
{
    /// <summary>Creates a procedure.</summary>
    /// <param name="setups">Instrument setups in one run of the section (1..100000); each gives a backsight and a
    /// foresight reading.</param>
    /// <param name="runs">Independent runs meaned (1 = single run, 2 = double run; 1..100).</param>
    /// <exception cref="InvalidInputException">When a count is out of range.</exception>
    public LevellingProcedure(int setups, int runs)
    {
        if (setups is < 1 or > 100000)
            throw new InvalidInputException(
                $"the number of level setups must be a whole number from 1 to 100000, not {setups}");
        if (runs is < 1 or > 100)
            throw new InvalidInputException(
                $"the number of levelling runs must be a whole number from 1 to 100, not {runs}");
        Setups = setups;
        Runs = runs;
    }

    /// <summary>Setups in one run.</summary>
    public int Setups { get; }

    /// <summary>Runs meaned.</summary>
    public int Runs { get; }

    /// <summary>Rod readings in one run: a backsight and a foresight per setup.</summary>
    public int Readings => 2 * Setups;
}

internal static class Checks
{
    public static void Id(string? id, string what)
    {
        if (string.IsNullOrWhiteSpace(id)) throw new InvalidInputException($"{what} needs an id (a name of its own)");
    }

    public static void NonNegative(double v, string what)
    {
        if (!double.IsFinite(v)) throw new InvalidInputException($"{what} must be a finite number");
        if (v < 0) throw new InvalidInputException($"{what} must not be negative");
    }

    public static void Positive(double v, string what)
    {
        if (!double.IsFinite(v)) throw new InvalidInputException($"{what} must be a finite number");
        if (!(v > 0)) throw new InvalidInputException($"{what} must be positive");
    }
}
