using NetAdjust.Geodesy;

namespace NetAdjust.Tests.Geodesy;

/// <summary>
/// Vincenty's inverse problem on the ellipsoid (T. Vincenty, "Direct and inverse solutions of geodesics on the
/// ellipsoid with application of nested equations", Survey Review 23 (176), 1975, 88–93): the geodesic distance
/// and forward azimuth between two points, independent of any map projection. Accurate to about 0.1 mm.
/// </summary>
internal static class Vincenty
{
    /// <summary>Geodesic distance (m) and forward azimuth at the first point (rad, clockwise from north).</summary>
    public static (double Distance, double Azimuth) Inverse(Ellipsoid ell, double lat1, double lon1, double lat2,
        double lon2)
    {
        double a = ell.SemiMajorAxis, f = ell.Flattening, b = ell.SemiMinorAxis;
        double l = lon2 - lon1;
        double u1 = Math.Atan((1 - f) * Math.Tan(lat1)), u2 = Math.Atan((1 - f) * Math.Tan(lat2));
        double su1 = Math.Sin(u1), cu1 = Math.Cos(u1), su2 = Math.Sin(u2), cu2 = Math.Cos(u2);
        double lam = l, sinSig = 0, cosSig = 0, sig = 0, cos2a = 0, cos2sm = 0;
        for (int i = 0; i < 200; i++)
        {
            double sl = Math.Sin(lam), cl = Math.Cos(lam);
            sinSig = Math.Sqrt(Math.Pow(cu2 * sl, 2) + Math.Pow(cu1 * su2 - su1 * cu2 * cl, 2));
            cosSig = su1 * su2 + cu1 * cu2 * cl;
            sig = Math.Atan2(sinSig, cosSig);
            double sinA = cu1 * cu2 * sl / sinSig;
            cos2a = 1 - sinA * sinA;
            cos2sm = cosSig - 2 * su1 * su2 / cos2a;
            double c = f / 16 * cos2a * (4 + f * (4 - 3 * cos2a));
            double prev = lam;
            lam = l + (1 - c) * f * sinA * (sig + c * sinSig * (cos2sm + c * cosSig * (-1 + 2 * cos2sm * cos2sm)));
            if (Math.Abs(lam - prev) < 1e-14) break;
        }
        double uu = cos2a * (a * a - b * b) / (b * b);
        double aa = 1 + uu / 16384 * (4096 + uu * (-768 + uu * (320 - 175 * uu)));
        double bb = uu / 1024 * (256 + uu * (-128 + uu * (74 - 47 * uu)));
        double dSig = bb * sinSig * (cos2sm + bb / 4 * (cosSig * (-1 + 2 * cos2sm * cos2sm) -
            bb / 6 * cos2sm * (-3 + 4 * sinSig * sinSig) * (-3 + 4 * cos2sm * cos2sm)));
        double s = b * aa * (sig - dSig);
        double az = Math.Atan2(cu2 * Math.Sin(lam), cu1 * su2 - su1 * cu2 * Math.Cos(lam));
        return (s, az);
    }
}
