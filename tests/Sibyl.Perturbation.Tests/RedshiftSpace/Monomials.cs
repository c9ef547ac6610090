using Sibyl.Perturbation.Kernels;
using Sibyl.Perturbation.RedshiftSpace;

namespace Sibyl.Perturbation.Tests.RedshiftSpace;

/// <summary>The value of each bias monomial, for comparing basis sums with kernels built from biases.</summary>
internal static class Monomials
{
    public static double Product(GalaxyMonomial m, GalaxyBias b) => m switch
    {
        GalaxyMonomial.One => 1.0,
        GalaxyMonomial.B1 => b.B1,
        GalaxyMonomial.B1B1 => b.B1 * b.B1,
        GalaxyMonomial.B2 => b.B2,
        GalaxyMonomial.B1B2 => b.B1 * b.B2,
        GalaxyMonomial.B2B2 => b.B2 * b.B2,
        GalaxyMonomial.BG2 => b.BG2,
        GalaxyMonomial.B1BG2 => b.B1 * b.BG2,
        GalaxyMonomial.B2BG2 => b.B2 * b.BG2,
        GalaxyMonomial.BG2BG2 => b.BG2 * b.BG2,
        GalaxyMonomial.BGamma3 => b.BGamma3,
        GalaxyMonomial.B1BGamma3 => b.B1 * b.BGamma3,
        _ => throw new ArgumentOutOfRangeException(nameof(m)),
    };

}
