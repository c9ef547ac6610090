namespace Sibyl.Emulation.Emulators;

/// <summary>How a parameter's unit-box coordinate u = (θ − min)/(max − min) is mapped before the Gaussian processes see it.</summary>
public enum InputWarp
{
    /// <summary>u itself.</summary>
    Identity,

    /// <summary>
    /// √u: for nDGP's Ω_rc on a box starting at 0. The modification of gravity is μ − 1 = 1/(3β) with
    /// β ≈ (H/H0)/√Ω_rc for small Ω_rc (Koyama, Taruya &amp; Hiramatsu 2009), so spectra go as √Ω_rc near the
    /// general-relativity edge of the box, a square-root cusp no smooth kernel fits in u but a straight line in √u.
    /// </summary>
    SquareRoot,
}
