namespace NetAdjust.LinearAlgebra.Sparse;

/// <summary>
/// Permutation helpers. Convention (Davis 2006, §2.2): a permutation p lists the original indices in their new
/// order, p[k] = the original index placed at position k; its inverse q = p⁻¹ gives q[p[k]] = k.
/// C = P N Pᵀ then has C(k, l) = N(p[k], p[l]).
/// </summary>
internal static class Permutation
{
    /// <summary>The inverse permutation q with q[p[k]] = k.</summary>
    /// <param name="p">A permutation of 0..n−1.</param>
    /// <exception cref="ArgumentException">When p is not a permutation.</exception>
    public static int[] Invert(ReadOnlySpan<int> p)
    {
        var q = new int[p.Length];
        Array.Fill(q, -1);
        for (int k = 0; k < p.Length; k++)
        {
            int v = p[k];
            if ((uint)v >= (uint)p.Length || q[v] >= 0)
                throw new ArgumentException($"not a permutation: entry {k} = {v}");
            q[v] = k;
        }
        return q;
    }

    /// <summary>True when p holds each of 0..n−1 exactly once.</summary>
    /// <param name="p">The candidate.</param>
    public static bool IsPermutation(ReadOnlySpan<int> p)
    {
        var seen = new bool[p.Length];
        foreach (int v in p)
        {
            if ((uint)v >= (uint)p.Length || seen[v]) return false;
            seen[v] = true;
        }
        return true;
    }

    /// <summary>The composition r[k] = p[s[k]] (first p, then reorder its positions by s).</summary>
    /// <param name="p">The outer permutation.</param>
    /// <param name="s">The inner permutation of positions.</param>
    public static int[] Compose(ReadOnlySpan<int> p, ReadOnlySpan<int> s)
    {
        var r = new int[p.Length];
        for (int k = 0; k < r.Length; k++) r[k] = p[s[k]];
        return r;
    }
}
