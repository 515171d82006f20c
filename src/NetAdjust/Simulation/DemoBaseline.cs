namespace NetAdjust.Simulation;

/// <summary>One simulated GNSS baseline of a demo survey: the earth-centred vector to − from with the covariance
/// the processing reported, and the session it was observed in. Metres, m².</summary>
/// <param name="From">The point the vector starts at.</param>
/// <param name="To">The point the vector ends at.</param>
/// <param name="Dx">ΔX = X(to) − X(from), metres.</param>
/// <param name="Dy">ΔY, metres.</param>
/// <param name="Dz">ΔZ, metres.</param>
/// <param name="Covariance">3×3 row-major covariance of (ΔX, ΔY, ΔZ), m².</param>
/// <param name="Session">The session (group) it was observed in.</param>
public sealed record DemoBaseline(string From, string To, double Dx, double Dy, double Dz,
    IReadOnlyList<double> Covariance, string Session)
{
    /// <summary>The standard deviations of ΔX, ΔY, ΔZ (metres).</summary>
    public (double X, double Y, double Z) Sd =>
        (Math.Sqrt(Covariance[0]), Math.Sqrt(Covariance[4]), Math.Sqrt(Covariance[8]));

    /// <summary>The correlations r_xy, r_xz, r_yz.</summary>
    public (double Xy, double Xz, double Yz) Correlations
    {
        get
        {
            var (sx, sy, sz) = Sd;
            return (Covariance[1] / (sx * sy), Covariance[2] / (sx * sz), Covariance[5] / (sy * sz));
        }
    }
}
