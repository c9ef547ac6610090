namespace Sibyl.Perturbation.RedshiftSpace;

/// <summary>The products of bias parameters that multiply the tree-level and one-loop galaxy terms.</summary>
public enum GalaxyMonomial
{
    /// <summary>No bias factor (pure velocity terms).</summary>
    One,

    /// <summary>b1.</summary>
    B1,

    /// <summary>b1².</summary>
    B1B1,

    /// <summary>b2.</summary>
    B2,

    /// <summary>b1 b2.</summary>
    B1B2,

    /// <summary>b2² (its k → 0 constant is removed: it is degenerate with the constant stochastic term).</summary>
    B2B2,

    /// <summary>bG2.</summary>
    BG2,

    /// <summary>b1 bG2.</summary>
    B1BG2,

    /// <summary>b2 bG2.</summary>
    B2BG2,

    /// <summary>bG2².</summary>
    BG2BG2,

    /// <summary>bΓ3.</summary>
    BGamma3,

    /// <summary>b1 bΓ3.</summary>
    B1BGamma3,
}
