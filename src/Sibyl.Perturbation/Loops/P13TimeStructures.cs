using Sibyl.Perturbation.TimeDependence;

namespace Sibyl.Perturbation.Loops;

/// <summary>Which third-order time coefficient multiplies which P_13 momentum integral (same names, kept explicit).</summary>
internal static class P13TimeStructures
{
    /// <summary>The six pairs; <see cref="ThirdOrderStructure.AlphaGammaOdd"/> has no integral (it vanishes in P_13).</summary>
    public static readonly (ThirdOrderStructure Time, P13Structure Loop)[] Pairs =
    [
        (ThirdOrderStructure.AlphaAlpha, P13Structure.AlphaAlpha),
        (ThirdOrderStructure.AlphaGamma, P13Structure.AlphaGamma),
        (ThirdOrderStructure.BetaAlpha, P13Structure.BetaAlpha),
        (ThirdOrderStructure.BetaGamma, P13Structure.BetaGamma),
        (ThirdOrderStructure.GammaAlpha, P13Structure.GammaAlpha),
        (ThirdOrderStructure.GammaGamma, P13Structure.GammaGamma),
    ];
}
