namespace NetAdjust.LinearAlgebra.Sparse;

/// <summary>
/// A postorder of a forest (children numbered before their parent, each subtree contiguous). Renumbering the
/// columns of C in a postorder of its elimination tree leaves the fill unchanged and makes supernodes contiguous.
/// </summary>
/// <remarks>Liu 1990 (SIAM J. Matrix Anal. Appl. 11(1)), §3; Davis 2006, §4.3 (cs_post). Non-recursive depth-first
/// search; O(n).</remarks>
internal static class TreePostorder
{
    /// <summary>post[k] = the node numbered k-th.</summary>
    /// <param name="parent">Parent of each node, −1 at roots.</param>
    public static int[] Compute(int[] parent)
    {
        int n = parent.Length;
        var head = new int[n];
        var next = new int[n];
        Array.Fill(head, -1);
        // Children lists in increasing order: insert in reverse.
        for (int j = n - 1; j >= 0; j--)
        {
            int p = parent[j];
            if (p == -1) continue;
            next[j] = head[p];
            head[p] = j;
        }
        var post = new int[n];
        var stack = new int[n];
        int k = 0;
        for (int root = 0; root < n; root++)
        {
            if (parent[root] != -1) continue;
            int top = 0;
            stack[0] = root;
            while (top >= 0)
            {
                int p = stack[top];
                int child = head[p];
                if (child == -1) { top--; post[k++] = p; }
                else { head[p] = next[child]; stack[++top] = child; }
            }
        }
        return post;
    }
}
