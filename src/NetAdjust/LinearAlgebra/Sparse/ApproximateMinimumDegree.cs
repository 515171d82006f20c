namespace NetAdjust.LinearAlgebra.Sparse;

/// <summary>
/// Approximate minimum degree (AMD) ordering of the normal matrix N = AᵀPA for networks whose points have no
/// positions (level networks given by heights only, or any network where geometric nested dissection cannot run).
/// A vertex of G(N) is an unknown; eliminating unknown p in the Cholesky factorisation of N makes its remaining
/// neighbours a clique (the column of L below p). AMD picks, step by step, an unknown of least approximate external
/// degree (the number of unknowns its elimination would couple), so the filled pattern of L stays small.
/// </summary>
/// <remarks>
/// <para>Amestoy, Davis &amp; Duff 1996, "An approximate minimum degree ordering algorithm", SIAM J. Matrix Anal.
/// Appl. 17(4):886–905 (with aggressive absorption and dense-row handling), on the quotient graph of George
/// &amp; Liu 1981 ch. 5 (see also George &amp; Liu 1989, SIAM Review 31(1):1–19; Davis 2006, <i>Direct Methods for
/// Sparse Linear Systems</i>, §7.1):</para>
/// <list type="bullet">
/// <item>Quotient graph: an eliminated pivot p becomes an <i>element</i> whose variable list L_p is the clique it
/// creates (the row pattern of column p of L); a variable's list holds its adjacent elements E_i first, then its
/// remaining adjacent variables A_i. The graph never grows beyond nnz(N) plus elbow room: the workspace is compacted
/// (garbage collection) when a new element does not fit.</item>
/// <item>Element absorption: every element adjacent to the pivot is absorbed into the new element (its list is
/// contained in L_p); aggressive absorption also absorbs any element e with L_e ⊆ L_p met during the degree update
/// (|L_e \ L_p| = 0).</item>
/// <item>Supervariables (indistinguishable nodes): variables of L_p with identical element and variable lists,
/// found by a hash of their lists, are merged into one supervariable of weight nv (e.g. the easting and northing of
/// one point); mass elimination: a variable of L_p adjacent to nothing but the new element is eliminated with the
/// pivot.</item>
/// <item>Approximate external degree: d̄_i = min(n − k − nv_i, d̄_i^old + |L_p \ i|,
/// |A_i \ i| + |L_p \ i| + Σ_{e ∈ E_i \ p} |L_e \ L_p|), the |L_e \ L_p| obtained for all e in one scan of the
/// lists of L_p.</item>
/// <item>Dense rows (more than max(16, 10·√n) neighbours, the reference implementation's default) are set aside and
/// ordered last.</item>
/// </list>
/// <para>Deterministic (no randomness; ties go to the unknown most recently placed in its degree list). Time about
/// O(nnz(N)·small) in practice; memory O(nnz(N) + n) integers.</para>
/// </remarks>
internal static class ApproximateMinimumDegree
{
    private const int Empty = -1;

    /// <summary>The encoding of a link or a negative marker: Flip(Flip(i)) = i, Flip(Empty) = Empty.</summary>
    private static int Flip(int i) => -i - 2;

    /// <summary>A fill-reducing permutation p of the unknowns (p[k] = unknown eliminated k-th).</summary>
    /// <param name="graph">G(N): the full symmetric adjacency of N without its diagonal.</param>
    /// <returns>The permutation; unknowns without neighbours first, dense ones last.</returns>
    public static int[] Order(AdjacencyGraph graph) => Order(graph, -1, out _);

    /// <summary>The ordering with a chosen workspace (to exercise the compaction in tests).</summary>
    /// <param name="graph">G(N).</param>
    /// <param name="elbowRoom">Workspace beyond nnz(N), at least n + 1; negative for the default
    /// nnz/5 + 2n + 16.</param>
    /// <param name="compactions">How many times the workspace was compacted.</param>
    internal static int[] Order(AdjacencyGraph graph, int elbowRoom, out int compactions)
    {
        compactions = 0;
        int n = graph.VertexCount;
        if (n == 0) return [];
        int nz = graph.Adjacent.Length;

        // Workspace iw: the adjacency lists of G(N), then elbow room for new elements (at least n: one new element).
        long iwLong = elbowRoom < 0 ? nz + (nz / 5) + (2L * n) + 16 : nz + (long)Math.Max(elbowRoom, n + 1);
        if (iwLong > Array.MaxLength) throw new InvalidOperationException("the graph of N is too large to order");
        int iwlen = (int)iwLong;
        var iw = new int[iwlen];
        Array.Copy(graph.Adjacent, iw, nz);
        int pfree = nz;

        var pe = new int[n];      // start of each object's list in iw; Flip(parent) once absorbed or eliminated
        var len = new int[n];     // length of each list
        var elen = new int[n];    // variables: |E_i| (elements first in the list); elements: Flip(..)
        var nv = new int[n];      // supervariable weight; 0 for a non-principal variable; −nv while in L_p
        var next = new int[n];    // degree-list / hash-bucket links
        var last = new int[n];
        var head = new int[n];    // degree-list heads, also hash-bucket heads (Flip-coded)
        var degree = new int[n];  // variables: approximate external degree; elements: |L_e|
        var w = new int[n];       // marks; w[e] − wflg = |L_e \ L_p| during the degree update; 0 = dead element
        for (int i = 0; i < n; i++)
        {
            pe[i] = graph.Start[i];
            len[i] = graph.Start[i + 1] - graph.Start[i];
            last[i] = Empty; head[i] = Empty; next[i] = Empty;
            nv[i] = 1; w[i] = 1; elen[i] = 0; degree[i] = len[i];
        }
        int wbig = int.MaxValue - n;
        int wflg = ClearFlag(0, wbig, w);

        var pivots = new List<int>(n);
        int nel = 0;
        int dense = (int)Math.Min(n, Math.Max(16.0, 10.0 * Math.Sqrt(n)));
        for (int i = 0; i < n; i++)
        {
            int deg = degree[i];
            if (deg == 0)
            {
                // An unknown without neighbours: eliminated at once (no fill).
                elen[i] = Flip(1); nel++; pe[i] = Empty; w[i] = 0; pivots.Add(i);
            }
            else if (deg > dense)
            {
                // A dense row: set aside, ordered last.
                nv[i] = 0; elen[i] = Empty; nel++; pe[i] = Empty;
            }
            else
            {
                int inext = head[deg];
                if (inext != Empty) last[inext] = i;
                next[i] = inext;
                head[deg] = i;
            }
        }

        int mindeg = 0, lemax = 0;
        while (nel < n)
        {
            // Pivot: a supervariable of least approximate degree.
            int me = Empty, d0;
            for (d0 = mindeg; d0 < n; d0++)
            {
                me = head[d0];
                if (me != Empty) break;
            }
            mindeg = d0;
            {
                int inext = next[me];
                if (inext != Empty) last[inext] = Empty;
                head[d0] = inext;
            }
            pivots.Add(me);
            int elenme = elen[me];
            int nvpiv = nv[me];
            nel += nvpiv;

            // The new element L_me = (A_me ∪ ⋃_{e ∈ E_me} L_e) \ me; its members get nv negated (marker).
            nv[me] = -nvpiv;
            int degme = 0, pme1, pme2;
            if (elenme == 0)
            {
                // No adjacent elements: build L_me in place of A_me.
                pme1 = pe[me];
                pme2 = pme1 - 1;
                for (int p = pme1; p < pme1 + len[me]; p++)
                {
                    int i = iw[p], nvi = nv[i];
                    if (nvi <= 0) continue;
                    degme += nvi; nv[i] = -nvi; iw[++pme2] = i;
                    RemoveFromDegreeList(i, next, last, head, degree);
                }
            }
            else
            {
                // Build L_me at the end of iw, absorbing every adjacent element.
                int p = pe[me];
                pme1 = pfree;
                int slenme = len[me] - elenme;
                for (int knt1 = 1; knt1 <= elenme + 1; knt1++)
                {
                    int e, pj, ln;
                    if (knt1 > elenme) { e = me; pj = p; ln = slenme; }
                    else { e = iw[p++]; pj = pe[e]; ln = len[e]; }
                    for (int knt2 = 1; knt2 <= ln; knt2++)
                    {
                        int i = iw[pj++], nvi = nv[i];
                        if (nvi <= 0) continue;
                        if (pfree >= iwlen)
                        {
                            // Out of room: compact iw (garbage collection), keeping the unread parts of me and e.
                            pe[me] = p;
                            len[me] -= knt1;
                            if (len[me] == 0) pe[me] = Empty;
                            pe[e] = pj;
                            len[e] = ln - knt2;
                            if (len[e] == 0) pe[e] = Empty;
                            (pme1, pfree) = Compact(iw, pe, len, n, pme1, pfree);
                            compactions++;
                            pj = pe[e];
                            p = pe[me];
                        }
                        degme += nvi; nv[i] = -nvi; iw[pfree++] = i;
                        RemoveFromDegreeList(i, next, last, head, degree);
                    }
                    if (e != me)
                    {
                        pe[e] = Flip(me); // element e absorbed into me
                        w[e] = 0;
                    }
                }
                pme2 = pfree - 1;
            }
            degree[me] = degme;
            pe[me] = pme1;
            len[me] = pme2 - pme1 + 1;
            elen[me] = Flip(nvpiv + degme);
            wflg = ClearFlag(wflg, wbig, w);

            // |L_e \ L_me| for every element e adjacent to a member of L_me: w[e] − wflg.
            for (int pme = pme1; pme <= pme2; pme++)
            {
                int i = iw[pme], eln = elen[i];
                if (eln <= 0) continue;
                int nvi = -nv[i], wnvi = wflg - nvi;
                for (int p = pe[i]; p < pe[i] + eln; p++)
                {
                    int e = iw[p], we = w[e];
                    if (we >= wflg) we -= nvi;
                    else if (we != 0) we = degree[e] + wnvi;
                    w[e] = we;
                }
            }

            // Degree update, element absorption, mass elimination; hash of each variable's lists.
            for (int pme = pme1; pme <= pme2; pme++)
            {
                int i = iw[pme];
                int p1 = pe[i], p2 = p1 + elen[i] - 1, pn = p1;
                uint hash = 0;
                int deg = 0;
                for (int p = p1; p <= p2; p++)
                {
                    int e = iw[p], we = w[e];
                    if (we == 0) continue; // e already absorbed
                    int dext = we - wflg;
                    if (dext > 0) { deg += dext; iw[pn++] = e; hash += (uint)e; }
                    else { pe[e] = Flip(me); w[e] = 0; } // aggressive absorption: L_e ⊆ L_me
                }
                elen[i] = pn - p1 + 1; // the kept elements and me
                int p3 = pn, p4 = p1 + len[i];
                for (int p = p2 + 1; p < p4; p++)
                {
                    int j = iw[p], nvj = nv[j];
                    if (nvj <= 0) continue; // j in L_me (now covered by me) or not principal
                    deg += nvj; iw[pn++] = j; hash += (uint)j;
                }
                if (elen[i] == 1 && p3 == pn)
                {
                    // Mass elimination: i is adjacent to me only, so it is eliminated with me.
                    pe[i] = Flip(me);
                    int nvi = -nv[i];
                    degme -= nvi; nvpiv += nvi; nel += nvi;
                    nv[i] = 0; elen[i] = Empty;
                }
                else
                {
                    degree[i] = Math.Min(degree[i], deg);
                    // Put me first in the list of i (one slot was freed: me itself or an element absorbed into it).
                    iw[pn] = iw[p3];
                    iw[p3] = iw[p1];
                    iw[p1] = me;
                    len[i] = pn - p1 + 1;
                    // Hash bucket of i (shares head with the degree lists, Flip-coded).
                    int bucket = (int)(hash % (uint)n);
                    int j = head[bucket];
                    if (j <= Empty) { next[i] = Flip(j); head[bucket] = Flip(i); }
                    else { next[i] = last[j]; last[j] = i; }
                    last[i] = bucket;
                }
            }
            degree[me] = degme;
            lemax = Math.Max(lemax, degme);
            wflg += lemax;
            wflg = ClearFlag(wflg, wbig, w);

            // Supervariable detection: variables of L_me with equal hash, list lengths and lists are merged.
            for (int pme = pme1; pme <= pme2; pme++)
            {
                int i = iw[pme];
                if (nv[i] >= 0) continue;
                int bucket = last[i];
                int j = head[bucket];
                if (j == Empty) i = Empty;
                else if (j < Empty) { i = Flip(j); head[bucket] = Empty; }
                else { i = last[j]; last[j] = Empty; }
                while (i != Empty && next[i] != Empty)
                {
                    int ln = len[i], eln = elen[i];
                    for (int p = pe[i] + 1; p < pe[i] + ln; p++) w[iw[p]] = wflg;
                    int jlast = i;
                    j = next[i];
                    while (j != Empty)
                    {
                        bool same = len[j] == ln && elen[j] == eln;
                        for (int p = pe[j] + 1; same && p < pe[j] + ln; p++)
                            if (w[iw[p]] != wflg) same = false;
                        if (same)
                        {
                            pe[j] = Flip(i); // j absorbed into supervariable i
                            nv[i] += nv[j];  // both negative while in L_me
                            nv[j] = 0;
                            elen[j] = Empty;
                            j = next[j];
                            next[jlast] = j;
                        }
                        else { jlast = j; j = next[j]; }
                    }
                    wflg++;
                    i = next[i];
                }
            }

            // Restore the degree lists with d̄_i = min(d̄_i + |L_me \ i|, n − k − nv_i); drop merged variables.
            int pk = pme1, nleft = n - nel;
            for (int pme = pme1; pme <= pme2; pme++)
            {
                int i = iw[pme], nvi = -nv[i];
                if (nvi <= 0) continue;
                nv[i] = nvi;
                int deg = Math.Min(degree[i] + degme - nvi, nleft - nvi);
                int inext = head[deg];
                if (inext != Empty) last[inext] = i;
                next[i] = inext;
                last[i] = Empty;
                head[deg] = i;
                mindeg = Math.Min(mindeg, deg);
                degree[i] = deg;
                iw[pk++] = i;
            }
            nv[me] = nvpiv;
            len[me] = pk - pme1;
            if (len[me] == 0) { pe[me] = Empty; w[me] = 0; }
            if (elenme != 0) pfree = pk;
        }

        return Permute(n, pivots, pe, nv);
    }

    /// <summary>
    /// The permutation: each pivot followed by the variables merged into it or mass-eliminated with it (a parent
    /// chain of Flip links ending at the pivot), in pivot order; dense rows last.
    /// </summary>
    private static int[] Permute(int n, List<int> pivots, int[] pe, int[] nv)
    {
        var parent = new int[n];
        for (int i = 0; i < n; i++) parent[i] = Flip(pe[i]);
        var owner = new int[n];
        for (int i = 0; i < n; i++)
        {
            if (nv[i] > 0) { owner[i] = i; continue; }
            int j = parent[i];
            if (j == Empty) { owner[i] = Empty; continue; } // dense
            while (nv[j] == 0) j = parent[j];
            owner[i] = j;
            for (int k = i; nv[k] == 0;) { int kn = parent[k]; parent[k] = j; k = kn; } // path compression
        }
        var position = new int[n];
        Array.Fill(position, Empty);
        int at = 0;
        foreach (int e in pivots) { position[e] = at; at += nv[e]; }
        var perm = new int[n];
        var filled = new int[n];
        int denseAt = at;
        for (int i = 0; i < n; i++)
        {
            int e = owner[i];
            if (e == Empty) { perm[denseAt++] = i; continue; }
            if (i == e) continue;
            perm[position[e] + filled[e]++] = i;
        }
        // each pivot after the variables eliminated with it
        foreach (int e in pivots) perm[position[e] + filled[e]] = e;
        return perm;
    }

    private static void RemoveFromDegreeList(int i, int[] next, int[] last, int[] head, int[] degree)
    {
        int ilast = last[i], inext = next[i];
        if (inext != Empty) last[inext] = ilast;
        if (ilast != Empty) next[ilast] = inext;
        else head[degree[i]] = inext;
    }

    /// <summary>Resets the marks when the flag would overflow: live marks become 1, the flag 2.</summary>
    private static int ClearFlag(int wflg, int wbig, int[] w)
    {
        if (wflg >= 2 && wflg < wbig) return wflg;
        for (int x = 0; x < w.Length; x++) if (w[x] != 0) w[x] = 1;
        return 2;
    }

    /// <summary>
    /// Garbage collection of iw: moves every live list (pe ≥ 0) to the front in order, then the new element being
    /// built at iw[pme1..pfree−1]. Each list's first entry is parked in pe and its slot marks the owner (Flip-coded).
    /// </summary>
    /// <returns>The new start of the element being built and the new first free slot.</returns>
    private static (int Pme1, int Pfree) Compact(int[] iw, int[] pe, int[] len, int n, int pme1, int pfree)
    {
        for (int j = 0; j < n; j++)
        {
            int pn = pe[j];
            if (pn < 0) continue;
            pe[j] = iw[pn];
            iw[pn] = Flip(j);
        }
        int psrc = 0, pdst = 0;
        while (psrc < pme1)
        {
            int j = Flip(iw[psrc++]);
            if (j < 0) continue;
            iw[pdst] = pe[j];
            pe[j] = pdst++;
            for (int k = 0; k < len[j] - 1; k++) iw[pdst++] = iw[psrc++];
        }
        int start = pdst;
        for (psrc = pme1; psrc < pfree; psrc++) iw[pdst++] = iw[psrc];
        return (start, pdst);
    }
}
