namespace Sibyl.Cosmology.Boltzmann.Perturbations;

/// <summary>Which approximation the mode equations use, in the order a mode passes through them.</summary>
public enum ModeRegime
{
    /// <summary>Photons and baryons move as one fluid (first order in τ_c = 1/κ').</summary>
    TightCoupling,

    /// <summary>The full photon, polarisation and neutrino hierarchies.</summary>
    FullHierarchy,

    /// <summary>Radiation inside the horizon after decoupling follows the metric (its free oscillations average out).</summary>
    FreeStreaming,
}
