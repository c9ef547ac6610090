using Sibyl.Cosmology.Parameters;
using Sibyl.Perturbation.Spectra;

namespace Sibyl.Perturbation.Matter;

/// <summary>
/// Basis of the one-loop matter spectrum: P = [P_tree,IR + P_1loop,IR] − 2 c_s² [k² P_IR], with one
/// nuisance parameter, the EFT sound speed c_s² in (Mpc/h)².
/// </summary>
public static class MatterLayout
{
    /// <summary>Name of the counterterm parameter.</summary>
    public const string SoundSpeed = "cs2";

    /// <summary>c_s² with its default and allowed range, for command lines and grid specs.</summary>
    public static ParameterDefinition SoundSpeedDefinition { get; } =
        new(SoundSpeed, 0.0, -1000.0, true, 1000.0, true, "(Mpc/h)^2", "EFT counterterm: adds -2 cs2 k^2 P_IR");

    /// <summary>Index of the resummed tree plus one-loop term.</summary>
    public const int TreePlusLoop = 0;

    /// <summary>Index of the counterterm shape k² P_IR.</summary>
    public const int Counterterm = 1;

    /// <summary>The layout: one observable "P".</summary>
    public static BasisLayout Layout { get; } = new(
        ["P"],
        [SoundSpeed],
        [
            new BasisTerm("P_tree_plus_loop", 0, 1.0, []),
            new BasisTerm("P_ct_basis", 0, -2.0, [0]),
        ]);
}
