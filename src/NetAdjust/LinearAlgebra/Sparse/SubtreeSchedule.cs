namespace NetAdjust.LinearAlgebra.Sparse;

/// <summary>
/// A deterministic split of the supernodal elimination tree for a tree-level parallel factorisation: disjoint
/// subtrees, and the top part (the ancestors of those subtrees), factorised after them. Subtrees share no front, so
/// they run concurrently, each on one thread (<see cref="ForEachSubtree"/>: the workers take them heaviest first as
/// they come free); each front's arithmetic and the order of its children's extend-add are those of the sequential
/// factorisation, so the factor is the same bits whichever worker takes which subtree.
/// </summary>
/// <remarks>
/// Subtree-to-processor mapping after Geist &amp; Ng 1989, "Task scheduling for parallel sparse Cholesky
/// factorization", Int. J. Parallel Programming 18(4):291–314: the heaviest subtree is split (its root moves to the
/// top part, its children become subtrees) while that shortens the estimated critical path, the largest set's work
/// plus the top part's; the sets are the subtrees packed by the longest-first rule (Graham 1969, "Bounds on
/// multiprocessing timing anomalies", SIAM J. Appl. Math. 17(2):416–429), and the workers follow the same rule with
/// the real durations: each takes the heaviest subtree left when it comes free, so a subtree that runs longer than
/// its estimate, or a core slowed by the rest of the machine, holds up only the subtrees it is working on. A subtree
/// is a contiguous range of supernodes in postorder. Work of a front with k columns and m rows is estimated as k·m²
/// (its dense factorisation and update; Liu 1992, §5). O(ns + splits·ns_c log ns_c) with ns_c the subtrees
/// considered.
/// </remarks>
internal sealed class SubtreeSchedule
{
    private const int MaxSplits = 256;

    private SubtreeSchedule(int workers, int[] subtrees, int[][] sets, int[] top, double[] setWork, double topWork,
        double total)
    {
        Workers = workers; Subtrees = subtrees; Sets = sets; Top = top; SetWork = setWork; TopWork = topWork;
        TotalWork = total;
    }

    /// <summary>The number of workers (and of sets the subtrees were packed into).</summary>
    public int Workers { get; }

    /// <summary>Every subtree as a pair (first supernode, root supernode), heaviest first (ties: the lower root):
    /// the order in which the workers of <see cref="ForEachSubtree"/> take them.</summary>
    public int[] Subtrees { get; }

    /// <summary>Per set, its subtrees as pairs (first supernode, root supernode), in ascending postorder: the packing
    /// of the estimates by the rule the workers follow, which gives <see cref="SetWork"/> and
    /// <see cref="CriticalPath"/>.</summary>
    public int[][] Sets { get; }

    /// <summary>The supernodes of the top part, ascending (a postorder: children before parents).</summary>
    public int[] Top { get; }

    /// <summary>Estimated work of each set.</summary>
    public double[] SetWork { get; }

    /// <summary>Estimated work of the top part.</summary>
    public double TopWork { get; }

    /// <summary>Estimated work of the whole factorisation.</summary>
    public double TotalWork { get; }

    /// <summary>Estimated critical path: the largest set plus the top part.</summary>
    public double CriticalPath => SetWork.Max() + TopWork;

    /// <summary>True when the tree-level split is worth its threads: the work reaches <paramref name="minimumWork"/>
    /// (below it the hand-over costs more than it saves) and the critical path is under 90 % of the work.</summary>
    /// <param name="minimumWork">The least estimated work for a split.</param>
    public bool Worthwhile(double minimumWork) => TotalWork >= minimumWork && CriticalPath < 0.9 * TotalWork;

    /// <summary>
    /// Runs the subtrees on <see cref="Workers"/> threads (the calling thread one of them): each worker takes the
    /// heaviest subtree left, runs on it what <paramref name="worker"/> gave it, and takes the next when done, until
    /// none is left.
    /// Every subtree is run exactly once. When a call throws, no worker takes another subtree, and the exceptions
    /// come back in an <see cref="AggregateException"/>.
    /// </summary>
    /// <param name="worker">Called once on each worker's thread; returns what that worker does with a subtree
    /// (first supernode, root supernode), e.g. with scratch memory of its own.</param>
    public void ForEachSubtree(Func<Action<int, int>> worker)
    {
        int next = -1, count = Subtrees.Length / 2;
        Parallel.For(0, Workers, _ =>
        {
            var subtree = worker();
            for (int i; (i = Interlocked.Increment(ref next)) < count;)
            {
                try
                {
                    subtree(Subtrees[2 * i], Subtrees[(2 * i) + 1]);
                }
                catch
                {
                    Volatile.Write(ref next, count); // the others stop at their next subtree
                    throw;
                }
            }
        });
    }

    /// <summary>Splits the tree of an analysis for the given number of workers (at least 2).</summary>
    /// <param name="sym">The symbolic analysis.</param>
    /// <param name="workers">Number of concurrent sets.</param>
    public static SubtreeSchedule Compute(SymbolicCholesky sym, int workers)
    {
        int ns = sym.SupernodeCount;
        var parent = sym.SnParent;
        var sub = new double[ns];   // work of the subtree rooted at s
        var first = new int[ns];    // first supernode of that subtree (postorder: the subtree is first..s)
        double total = 0;
        for (int s = 0; s < ns; s++)
        {
            long k = sym.SnStart[s + 1] - sym.SnStart[s], m = sym.SnRowStart[s + 1] - sym.SnRowStart[s];
            double w = (double)k * m * m;
            sub[s] += w;
            total += w;
        }
        // first and subtree work from the children (children are numbered before their parent)
        for (int s = 0; s < ns; s++) first[s] = s;
        for (int s = 0; s < ns; s++)
        {
            int p = parent[s];
            if (p < 0) continue;
            sub[p] += sub[s];
            first[p] = Math.Min(first[p], first[s]);
        }

        var candidates = new List<int>();
        for (int s = 0; s < ns; s++) if (parent[s] < 0) candidates.Add(s);
        var top = new List<int>();
        double topWork = 0;
        var best = Pack(candidates, sub, workers);
        double bestPath = best.Loads.Max() + topWork;
        int bestSplits = 0;
        for (int split = 1; split <= MaxSplits && candidates.Count > 0; split++)
        {
            // the heaviest subtree (lowest index on ties) that has children
            int h = -1;
            foreach (int c in candidates)
                if (sym.SnChildHead[c] >= 0 && (h < 0 || sub[c] > sub[h] || (sub[c] == sub[h] && c < h))) h = c;
            if (h < 0) break;
            candidates.Remove(h);
            for (int c = sym.SnChildHead[h]; c >= 0; c = sym.SnChildNext[c]) candidates.Add(c);
            top.Add(h);
            topWork += sub[h] - ChildrenWork(sym, sub, h);
            var packed = Pack(candidates, sub, workers);
            double path = packed.Loads.Max() + topWork;
            if (path < bestPath) { best = packed; bestPath = path; bestSplits = split; }
        }
        // the top part of the best split: the first bestSplits nodes moved there
        var topNodes = top.Take(bestSplits).ToArray();
        Array.Sort(topNodes);
        double bestTop = 0;
        foreach (int s in topNodes) bestTop += sub[s] - ChildrenWork(sym, sub, s);
        var sets = new int[workers][];
        for (int b = 0; b < workers; b++)
        {
            var roots = best.Bins[b];
            roots.Sort();
            sets[b] = new int[roots.Count * 2];
            for (int i = 0; i < roots.Count; i++) { sets[b][2 * i] = first[roots[i]]; sets[b][(2 * i) + 1] = roots[i]; }
        }
        var heaviestFirst = new int[best.Order.Length * 2];
        for (int i = 0; i < best.Order.Length; i++)
            (heaviestFirst[2 * i], heaviestFirst[(2 * i) + 1]) = (first[best.Order[i]], best.Order[i]);
        return new SubtreeSchedule(workers, heaviestFirst, sets, topNodes, best.Loads, bestTop, total);
    }

    private static double ChildrenWork(SymbolicCholesky sym, double[] sub, int s)
    {
        double w = 0;
        for (int c = sym.SnChildHead[s]; c >= 0; c = sym.SnChildNext[c]) w += sub[c];
        return w;
    }

    /// <summary>Greedy packing, heaviest subtree first into the least loaded set (ties: lower index); with the
    /// subtrees' roots in that order.</summary>
    private static (List<int>[] Bins, double[] Loads, int[] Order) Pack(List<int> candidates, double[] sub,
        int workers)
    {
        var order = candidates.ToArray();
        Array.Sort(order, (a, b) => sub[a] != sub[b] ? sub[b].CompareTo(sub[a]) : a.CompareTo(b));
        var bins = new List<int>[workers];
        var loads = new double[workers];
        for (int b = 0; b < workers; b++) bins[b] = [];
        foreach (int c in order)
        {
            int least = 0;
            for (int b = 1; b < workers; b++) if (loads[b] < loads[least]) least = b;
            bins[least].Add(c);
            loads[least] += sub[c];
        }
        return (bins, loads, order);
    }
}
