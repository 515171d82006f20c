namespace NetAdjust.LinearAlgebra.Sparse;

/// <summary>
/// Splits the postordered columns of L into supernodes: runs of consecutive columns with nested patterns,
/// stored and factorised as dense blocks. Fundamental supernodes (Liu, Ng &amp; Peyton 1993) are merged with
/// their parent when the explicit zeros this adds stay small (relaxed amalgamation, Ashcraft &amp; Grimes 1989).
/// </summary>
/// <remarks>
/// Liu, Ng &amp; Peyton 1993, "On finding supernodes for sparse matrix computations", SIAM J. Matrix Anal. Appl.
/// 14(1):242–252; Ashcraft &amp; Grimes 1989, "The influence of relaxed supernode partitions on the multifrontal
/// method", ACM TOMS 15(4):291–309; Davis 2006, §4.6. Thresholds: merge when the result has at most 4 columns, or
/// at most 16 with under 80 % zeros, 48 with under 10 %, otherwise under 5 % (values in common use, e.g. in
/// Davis's CHOLMOD; common practice).
/// </remarks>
internal static class SupernodePartition
{
    /// <summary>The first column of each supernode, plus n at the end.</summary>
    /// <param name="parent">Elimination tree of the postordered matrix.</param>
    /// <param name="count">Column counts of L.</param>
    public static int[] Compute(int[] parent, int[] count)
    {
        int n = parent.Length;
        var children = new int[n];
        foreach (int p in parent) if (p >= 0) children[p]++;

        // Fundamental supernodes.
        var fStart = new List<int> { 0 };
        for (int j = 1; j < n; j++)
        {
            bool joins = parent[j - 1] == j && count[j - 1] == count[j] + 1 && children[j] == 1;
            if (!joins) fStart.Add(j);
        }
        fStart.Add(n);
        int nf = fStart.Count - 1;
        if (nf == 0) return [0];

        var fOf = new int[n];
        for (int s = 0; s < nf; s++) for (int j = fStart[s]; j < fStart[s + 1]; j++) fOf[j] = s;

        // Relaxed amalgamation along chains (a supernode with its parent when contiguous).
        var result = new List<int> { 0 };
        int gFirst = fStart[0];
        long gTrue = 0;
        for (int j = fStart[0]; j < fStart[1]; j++) gTrue += count[j];
        for (int s = 0; s + 1 < nf; s++)
        {
            int last = fStart[s + 1] - 1;
            int p = parent[last] >= 0 ? fOf[parent[last]] : -1;
            int pFirst = fStart[s + 1];
            long pTrue = 0;
            for (int j = pFirst; j < fStart[s + 2]; j++) pTrue += count[j];
            bool merge = false;
            if (p == s + 1 && parent[last] == pFirst)
            {
                long kg = pFirst - gFirst, kp = fStart[s + 2] - pFirst;
                long k = kg + kp, m = kg + count[pFirst];
                long stored = (k * m) - (k * (k - 1) / 2);
                double zeros = (stored - (gTrue + pTrue)) / (double)stored;
                merge = k <= 4 || (k <= 16 && zeros < 0.8) || (k <= 48 && zeros < 0.1) || zeros < 0.05;
            }
            if (merge) gTrue += pTrue;
            else { result.Add(pFirst); gFirst = pFirst; gTrue = pTrue; }
        }
        result.Add(n);
        return result.ToArray();
    }
}
