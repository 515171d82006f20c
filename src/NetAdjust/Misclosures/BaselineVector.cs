namespace NetAdjust.Misclosures;

/// <summary>
/// One GNSS baseline as the loop check takes it: the earth-centred vector to − from in metres with its 3×3 covariance
/// (m², row-major, the group scale applied), the group (session) it was observed in, and where it came from.
/// </summary>
/// <param name="From">The point the vector starts at.</param>
/// <param name="To">The point the vector ends at.</param>
/// <param name="Dx">ΔX = X(to) − X(from) in metres.</param>
/// <param name="Dy">ΔY in metres.</param>
/// <param name="Dz">ΔZ in metres.</param>
/// <param name="Covariance">3×3 row-major covariance of (ΔX, ΔY, ΔZ) in m², group scale applied.</param>
/// <param name="Group">The group or session; null when not known.</param>
/// <param name="Source">Where the baseline came from (an id, file and line), for messages; null for none.</param>
internal sealed record BaselineVector(string From, string To, double Dx, double Dy, double Dz,
    double[] Covariance /* 3x3 row-major, m², group scale applied */, string? Group, string? Source);
