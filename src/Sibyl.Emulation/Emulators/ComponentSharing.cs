namespace Sibyl.Emulation.Emulators;

/// <summary>Which principal-component coefficients share one Gaussian process (one kernel, one Cholesky factor).</summary>
public enum ComponentSharing
{
    /// <summary>One process per basis term and redshift: its components share hyperparameters, so a prediction costs
    /// one kernel vector per term. The default: fast, and the leading component dominates the fit.</summary>
    PerTerm,

    /// <summary>One process per component: each coefficient gets its own length scales; slower to fit and predict.</summary>
    PerComponent,
}
