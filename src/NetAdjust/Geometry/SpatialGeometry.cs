namespace NetAdjust.Geometry;

/// <summary>
/// The ends of a total-station sighting for the curved-earth model: the marks' plane coordinates and heights, the
/// instrument height above the station mark and the target height above the target mark (metres).
/// </summary>
/// <param name="StationId">Id of the station (instrument point).</param>
/// <param name="Station">Plane coordinates of the station.</param>
/// <param name="StationHeight">Height of the station mark.</param>
/// <param name="InstrumentHeight">Height of the instrument's trunnion axis above the station mark.</param>
/// <param name="TargetId">Id of the target point.</param>
/// <param name="Target">Plane coordinates of the target.</param>
/// <param name="TargetHeight">Height of the target mark.</param>
/// <param name="SignalHeight">Height of the sighted target (prism centre) above the target mark.</param>
public readonly record struct Sighting(
    string StationId, PlanePoint Station, double StationHeight, double InstrumentHeight,
    string TargetId, PlanePoint Target, double TargetHeight, double SignalHeight)
{
    /// <summary>The reference height H0 of the plane coordinates (metres, 0 by default): the height at which a
    /// distance between plane coordinates is the true horizontal distance (docs/methods.md, "Spatial model").
    /// </summary>
    public double PlaneHeight { get; init; }
}

/// <summary>
/// Slope distance and zenith angle over a spherical earth of radius R with a refracted line of sight (refraction
/// coefficient k = R / radius of the line of sight), as pure functions with their partial derivatives by E, N and H
/// of both points. The plane distance s between the marks is taken as the arc at the plane's reference height H0
/// (<see cref="Sighting.PlaneHeight"/>), so the central angle is γ = s/(R + H0); the instrument and the target lie on
/// the radii at r_A = R + H_A + i and r_B = R + H_B + t. In the plane of the two radii, the target seen from the
/// instrument is u = r_B sin γ across and v = r_B cos γ − r_A along the instrument's vertical; the chord is
/// D = √(u² + v²) and the geometric zenith angle is atan2(u, v). The line of sight, an arc of radius R/k, leaves the
/// instrument tilted up by the refraction angle δ = k·γ/2, so the observed zenith angle is z = atan2(u, v) − k·γ/2.
/// The EDM's path along the curved ray is longer than the chord by k²D³/(24R²) (Rüeger, <i>Electronic Distance
/// Measurement</i>, 4th ed. 1996, ch. 7, from memory): 0.3 nm at 1 km, neglected. To first order this gives
/// ΔH = D cos z + (1 − k)·s²/(2R) + i − t, the textbook trigonometric height with the combined curvature-and-refraction
/// correction (docs/methods.md).
/// </summary>
public static class SpatialGeometry
{
    /// <summary>
    /// The mean earth radius used for curvature and refraction, metres: the IUGG mean radius R₁ = (2a + b)/3 of the
    /// GRS 80 ellipsoid (Moritz, <i>Geodetic Reference System 1980</i>, Bulletin Géodésique 54, 1980), rounded to
    /// 0.1 m. Over a network of a few kilometres the radius of curvature of the sighting's normal section differs from
    /// it by less than 0.5 % anywhere on earth, which changes the curvature correction at 1 km by under 0.4 mm.
    /// </summary>
    public const double EarthRadius = 6_371_008.8;

    /// <summary>The refraction coefficient taken when the project sets none (common practice: 0.13).</summary>
    public const double DefaultRefraction = 0.13;

    /// <summary>
    /// The standard deviation σ_k of an assumed refraction coefficient taken when the project sets none (common
    /// practice: 0.05, the day-to-day spread of k for daytime sights well above the ground; near the ground k varies
    /// far more and a larger σ_k should be set).
    /// </summary>
    public const double DefaultRefractionSd = 0.05;

    /// <summary>The slope distance D (chord from instrument to target) and its partial derivatives.</summary>
    /// <param name="s">The sighting.</param>
    public static EquationValue SlopeDistance(Sighting s) => Evaluate(s, 0.0, slope: true);

    /// <summary>The observed zenith angle z (0 at the zenith) with refraction coefficient k, and its partial
    /// derivatives.</summary>
    /// <param name="s">The sighting.</param>
    /// <param name="refraction">The refraction coefficient k.</param>
    public static EquationValue Zenith(Sighting s, double refraction) => Evaluate(s, refraction, slope: false);

    /// <summary>
    /// The combined curvature-and-refraction correction (1 − k)·s²/(2R) to add to D cos z for the height difference
    /// of a sight of plane length s, metres.
    /// </summary>
    /// <param name="planeDistance">s, metres.</param>
    /// <param name="refraction">k.</param>
    /// <param name="radius">R, metres.</param>
    public static double CurvatureAndRefraction(double planeDistance, double refraction, double radius = EarthRadius) =>
        (1 - refraction) * planeDistance * planeDistance / (2 * radius);

    /// <summary>
    /// ∂z/∂k = −γ/2 = −s/(2R): how the observed zenith angle changes with the refraction coefficient (radians per
    /// unit of k), for a sight of plane length s.
    /// </summary>
    /// <param name="planeDistance">s, metres.</param>
    public static double ZenithByRefraction(double planeDistance) => -planeDistance / (2 * EarthRadius);

    /// <summary>
    /// ∂z/∂k = −γ/2 = −s/(2(R + H0)) for a sight of plane length s on plane coordinates of reference height H0.
    /// </summary>
    /// <param name="planeDistance">s, metres.</param>
    /// <param name="planeHeight">H0, metres (<see cref="Sighting.PlaneHeight"/>).</param>
    public static double ZenithByRefraction(double planeDistance, double planeHeight) =>
        -planeDistance / (2 * (EarthRadius + planeHeight));

    private static EquationValue Evaluate(Sighting s, double k, bool slope)
    {
        const double R = EarthRadius;
        double rp = R + s.PlaneHeight; // the radius of the plane's sphere: plane distances are arcs on it
        double de = s.Target.E - s.Station.E, dn = s.Target.N - s.Station.N;
        double plane = Math.Sqrt((de * de) + (dn * dn));
        double g = plane / rp;
        double ra = R + s.StationHeight + s.InstrumentHeight, rb = R + s.TargetHeight + s.SignalHeight;
        double sin = Math.Sin(g), cos = Math.Cos(g);
        // v = r_B cos γ − r_A written without the cancellation of two earth radii: (r_B − r_A) − 2 r_B sin²(γ/2).
        double half = Math.Sin(g / 2);
        double u = rb * sin;
        double v = (s.TargetHeight + s.SignalHeight - s.StationHeight - s.InstrumentHeight) - (2 * rb * half * half);
        double d2 = (u * u) + (v * v), d = Math.Sqrt(d2);
        // Derivatives by γ, r_B and r_A (∂u/∂γ = r_B cos γ, ∂v/∂γ = −r_B sin γ, ∂u/∂r_B = sin γ, ∂v/∂r_B = cos γ,
        // ∂v/∂r_A = −1).
        double value, byG, byRb, byRa;
        if (slope)
        {
            value = d;
            byG = ((u * rb * cos) - (v * rb * sin)) / d;
            byRb = ((u * sin) + (v * cos)) / d;
            byRa = -v / d;
        }
        else
        {
            value = Math.Atan2(u, v) - (k * g / 2);
            byG = (((v * rb * cos) + (u * rb * sin)) / d2) - (k / 2);
            byRb = ((v * sin) - (u * cos)) / d2;
            byRa = u / d2;
        }
        // ∂γ/∂E_B = ΔE/(s (R + H0)), ∂γ/∂N_B = ΔN/(s (R + H0)); the station's are their negatives. A vertical sight
        // (s = 0) has no plane direction: its plane derivatives are taken as zero.
        double ge = plane > 0 ? byG * de / (plane * rp) : 0.0, gn = plane > 0 ? byG * dn / (plane * rp) : 0.0;
        return new EquationValue(value,
        [
            new(s.StationId, Parameter.E, -ge), new(s.StationId, Parameter.N, -gn), new(s.StationId, Parameter.H, byRa),
            new(s.TargetId, Parameter.E, ge), new(s.TargetId, Parameter.N, gn), new(s.TargetId, Parameter.H, byRb),
        ]);
    }
}
