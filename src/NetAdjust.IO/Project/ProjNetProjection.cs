using NetAdjust.Geodesy;
using ProjNet.CoordinateSystems;
using ProjNet.CoordinateSystems.Transformations;
using Ellipsoid = NetAdjust.Geodesy.Ellipsoid;

namespace NetAdjust.IO.Project;

/// <summary>
/// A conformal map projection computed by ProjNET (the .NET port of the OGC coordinate transformation services;
/// LGPL-2.1-or-later, used unchanged through its NuGet package), made from WKT (version 1). Coordinates outside
/// are in metres; a system in feet is converted at this edge. Safe to share between threads: ProjNET's transforms
/// do not document thread safety, so each call holds the projection's lock (the command checks the misclosures
/// beside the adjustment, and both may project).
/// </summary>
public sealed class ProjNetProjection : IMapProjection
{
    // Conformal projections of ProjNET (the reductions assume conformality: the scale factor is the same in every
    // direction at a point).
    private static readonly string[] Conformal =
    [
        "transverse_mercator", "mercator", "mercator_1sp", "mercator_2sp", "lambert_conformal_conic",
        "lambert_conformal_conic_2sp", "lambert_conformal_conic_1sp", "oblique_stereographic",
        "double_stereographic",
    ];

    private readonly MathTransform _forward;
    private readonly MathTransform _inverse;
    private readonly double _metresPerUnit;
    private readonly Lock _gate = new();

    private ProjNetProjection(string name, Ellipsoid ellipsoid, MathTransform forward, MathTransform inverse,
        double metresPerUnit)
    {
        Name = name;
        Ellipsoid = ellipsoid;
        _forward = forward;
        _inverse = inverse;
        _metresPerUnit = metresPerUnit;
    }

    /// <inheritdoc/>
    public string Name { get; }

    /// <inheritdoc/>
    public Ellipsoid Ellipsoid { get; }

    /// <summary>Makes the projection of a projected coordinate system given as WKT (version 1, <c>PROJCS[...]</c>).
    /// </summary>
    /// <param name="wkt">The WKT text.</param>
    /// <param name="name">The name reports use (e.g. <c>EPSG:32633 (WGS 84 / UTM zone 33N)</c>).</param>
    /// <exception cref="ArgumentException">When the text is not a projected system with a conformal projection that
    /// ProjNET knows; the message says why.</exception>
    public static ProjNetProjection FromWkt(string wkt, string name)
    {
        ArgumentNullException.ThrowIfNull(wkt);
        CoordinateSystem cs;
        try { cs = new CoordinateSystemFactory().CreateFromWkt(wkt); }
        catch (Exception e) when (e is not OutOfMemoryException)
        { throw new ArgumentException($"the WKT cannot be read ({e.Message.Split('\n')[0].Trim()})", e); }
        if (cs is not ProjectedCoordinateSystem pcs)
            throw new ArgumentException("the WKT is not a projected coordinate system (PROJCS)");
        string kind = pcs.Projection.ClassName.ToLowerInvariant();
        if (!Conformal.Contains(kind))
            throw new ArgumentException($"the projection '{pcs.Projection.ClassName}' is not one of the conformal " +
                "projections the reductions need (transverse Mercator, Mercator, Lambert conformal conic, oblique " +
                "stereographic)");
        var spheroid = pcs.HorizontalDatum.Ellipsoid;
        double a = spheroid.SemiMajorAxis * spheroid.AxisUnit.MetersPerUnit;
        var ellipsoid = new Ellipsoid(spheroid.Name, a, spheroid.InverseFlattening);
        ICoordinateTransformation t;
        try { t = new CoordinateTransformationFactory().CreateFromCoordinateSystems(pcs.GeographicCoordinateSystem,
            pcs); }
        catch (Exception e) when (e is not OutOfMemoryException)
        { throw new ArgumentException($"the projection cannot be set up ({e.Message.Split('\n')[0].Trim()})", e); }
        var forward = t.MathTransform;
        return new ProjNetProjection(name, ellipsoid, forward, forward.Inverse(), pcs.LinearUnit.MetersPerUnit);
    }

    /// <inheritdoc/>
    public (double Easting, double Northing) Forward(double latitude, double longitude)
    {
        try
        {
            double x, y;
            lock (_gate) (x, y) = _forward.Transform(longitude * (180 / Math.PI), latitude * (180 / Math.PI));
            return (x * _metresPerUnit, y * _metresPerUnit);
        }
        catch (Exception e) when (e is ArgumentException or ArithmeticException or InvalidOperationException)
        { return (double.NaN, double.NaN); } // outside the projection's domain: the caller names the point
    }

    /// <inheritdoc/>
    public (double Latitude, double Longitude) Inverse(double easting, double northing)
    {
        try
        {
            double lon, lat;
            lock (_gate) (lon, lat) = _inverse.Transform(easting / _metresPerUnit, northing / _metresPerUnit);
            return (lat * (Math.PI / 180), lon * (Math.PI / 180));
        }
        catch (Exception e) when (e is ArgumentException or ArithmeticException or InvalidOperationException)
        { return (double.NaN, double.NaN); }
    }
}
