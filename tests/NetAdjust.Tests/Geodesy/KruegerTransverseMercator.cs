using NetAdjust.Geodesy;

namespace NetAdjust.Tests.Geodesy;

/// <summary>
/// An independent transverse Mercator for the tests: Krüger's series in the third flattening n to order n⁴
/// (L. Krüger, Konforme Abbildung des Erdellipsoids in der Ebene, 1912; coefficients as printed in C. F. F. Karney,
/// "Transverse Mercator with an accuracy of a few nanometers", J. Geodesy 85 (2011) 475–485, eqs. 35–36, from
/// memory). Accurate to well under a millimetre within a UTM zone. Also used by the IO tests (linked file).
/// </summary>
internal sealed class KruegerTransverseMercator : IMapProjection
{
    private readonly double _lon0, _k0, _e0, _n0, _a, _e;
    private readonly double[] _alpha, _beta;

    public KruegerTransverseMercator(Ellipsoid ellipsoid, double centralMeridianDeg, double k0, double falseEasting,
        double falseNorthing)
    {
        Ellipsoid = ellipsoid;
        _lon0 = centralMeridianDeg * Math.PI / 180;
        (_k0, _e0, _n0) = (k0, falseEasting, falseNorthing);
        double f = ellipsoid.Flattening, n = f / (2 - f), n2 = n * n, n3 = n2 * n, n4 = n3 * n;
        _a = ellipsoid.SemiMajorAxis / (1 + n) * (1 + n2 / 4 + n4 / 64);
        _e = Math.Sqrt(ellipsoid.EccentricitySquared);
        _alpha =
        [
            n / 2 - 2 * n2 / 3 + 5 * n3 / 16 + 41 * n4 / 180,
            13 * n2 / 48 - 3 * n3 / 5 + 557 * n4 / 1440,
            61 * n3 / 240 - 103 * n4 / 140,
            49561 * n4 / 161280,
        ];
        _beta =
        [
            n / 2 - 2 * n2 / 3 + 37 * n3 / 96 - n4 / 360,
            n2 / 48 + n3 / 15 - 437 * n4 / 1440,
            17 * n3 / 480 - 37 * n4 / 840,
            4397 * n4 / 161280,
        ];
    }

    /// <summary>UTM zone on an ellipsoid: central meridian 6·zone − 183°, k0 0.9996, 500 km false easting.</summary>
    public static KruegerTransverseMercator Utm(Ellipsoid e, int zone, bool north = true) =>
        new(e, 6 * zone - 183, 0.9996, 500000, north ? 0 : 10000000);

    public string Name => "Krüger series (test)";

    public Ellipsoid Ellipsoid { get; }

    public (double Easting, double Northing) Forward(double latitude, double longitude)
    {
        double lam = longitude - _lon0, s = Math.Sin(latitude);
        double t = Math.Sinh(Math.Atanh(s) - _e * Math.Atanh(_e * s));
        double xi1 = Math.Atan2(t, Math.Cos(lam)), eta1 = Math.Atanh(Math.Sin(lam) / Math.Sqrt(1 + t * t));
        double xi = xi1, eta = eta1;
        for (int j = 1; j <= 4; j++)
        {
            xi += _alpha[j - 1] * Math.Sin(2 * j * xi1) * Math.Cosh(2 * j * eta1);
            eta += _alpha[j - 1] * Math.Cos(2 * j * xi1) * Math.Sinh(2 * j * eta1);
        }
        return (_e0 + _k0 * _a * eta, _n0 + _k0 * _a * xi);
    }

    public (double Latitude, double Longitude) Inverse(double easting, double northing)
    {
        double xi = (northing - _n0) / (_k0 * _a), eta = (easting - _e0) / (_k0 * _a);
        double xi1 = xi, eta1 = eta;
        for (int j = 1; j <= 4; j++)
        {
            xi1 -= _beta[j - 1] * Math.Sin(2 * j * xi) * Math.Cosh(2 * j * eta);
            eta1 -= _beta[j - 1] * Math.Cos(2 * j * xi) * Math.Sinh(2 * j * eta);
        }
        double chi = Math.Asin(Math.Sin(xi1) / Math.Cosh(eta1));
        double lam = Math.Atan2(Math.Sinh(eta1), Math.Cos(xi1));
        // geodetic latitude from the conformal latitude χ by fixed-point iteration
        double phi = chi;
        for (int i = 0; i < 20; i++)
        {
            double es = _e * Math.Sin(phi);
            phi = 2 * Math.Atan(Math.Tan(Math.PI / 4 + chi / 2) * Math.Pow((1 + es) / (1 - es), _e / 2)) - Math.PI / 2;
        }
        return (phi, _lon0 + lam);
    }
}
