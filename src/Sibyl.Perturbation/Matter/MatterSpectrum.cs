using Sibyl.Perturbation.Spectra;

namespace Sibyl.Perturbation.Matter;

/// <summary>
/// The one-loop matter spectrum at one redshift: its <see cref="BasisSpectra"/> and the pieces that make it
/// up, in (Mpc/h)³ over <see cref="Basis"/>.K.
/// </summary>
/// <param name="Basis">Terms in <see cref="MatterLayout"/>; assemble with c_s².</param>
/// <param name="Linear">P_L(k, z).</param>
/// <param name="NoWiggle">P_nw(k, z).</param>
/// <param name="TreeIr">P_nw + e^{−k²Σ²}(1 + k²Σ²) P_w.</param>
/// <param name="P22">P_22 of the IR-resummed linear input.</param>
/// <param name="P13">P_13 of the IR-resummed linear input.</param>
/// <param name="Sigma2">Σ²(z) in (Mpc/h)².</param>
public sealed record MatterSpectrum(
    BasisSpectra Basis, double[] Linear, double[] NoWiggle, double[] TreeIr, double[] P22, double[] P13, double Sigma2)
{
    /// <summary>The total for a given c_s² in (Mpc/h)².</summary>
    public double[] Total(double cs2)
    {
        var total = new double[Linear.Length];
        Basis.Assemble([cs2], 0, total);
        return total;
    }
}
