namespace NetAdjust.Network;

/// <summary>Whether directions are observed in both faces (face left and face right) or one face only.</summary>
public enum Faces
{
    /// <summary>Both faces: each set is the mean of face left and face right.</summary>
    Both,

    /// <summary>One face only.</summary>
    One,
}
