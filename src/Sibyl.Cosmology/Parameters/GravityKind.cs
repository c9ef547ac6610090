namespace Sibyl.Cosmology.Parameters;

/// <summary>The gravity models Sibyl knows; see DEVELOPERS.md for how to add one.</summary>
public enum GravityKind
{
    /// <summary>General relativity (any w0wa background): <c>lcdm</c>.</summary>
    Lcdm,

    /// <summary>Normal-branch DGP on a ΛCDM background: <c>ndgp</c>.</summary>
    Ndgp,

    /// <summary>Generic quasi-static modification: <c>qs</c>.</summary>
    QuasiStatic,
}
