using Sibyl.Cosmology.Parameters;
using Sibyl.Perturbation.Spectra;

namespace Sibyl.Perturbation.RedshiftSpace;

/// <summary>
/// Basis of the redshift-space galaxy multipoles P0, P2, P4. Every term multiplies a product of the nuisance
/// parameters below (names of our own):
/// <list type="bullet">
/// <item>b1, b2, bG2, bGamma3 — bias (Assassi et al. 2014 basis);</item>
/// <item>c0, c2, c4 [(Mpc/h)²] — counterterms −2 (c0 + c2 f μ² + c4 f² μ⁴) k² P_IR;</item>
/// <item>ck4 [(Mpc/h)⁴] — the finger-of-God counterterm −ck4 f⁴ μ⁴ k⁴ (b1 + f μ²)² P_IR;</item>
/// <item>stoch0 [(Mpc/h)³], stoch_k2, stoch_k2mu2 [(Mpc/h)⁵] — stochastic stoch0 + stoch_k2 k² + stoch_k2mu2 k² μ².</item>
/// </list>
/// P_IR = P_nw + e^{−k²Σ²_tot(μ)} P_w is the IR-resummed linear spectrum.
/// </summary>
public static class GalaxyLayout
{
    /// <summary>The multipoles, in order.</summary>
    public static readonly int[] Multipoles = [0, 2, 4];

    /// <summary>Nuisance parameters with defaults and ranges, in assembly order.</summary>
    public static IReadOnlyList<ParameterDefinition> Nuisance { get; } =
    [
        new("b1", 2.0, 0.0, false, 10.0, true, "", "linear bias"),
        new("b2", 0.0, -50.0, true, 50.0, true, "", "quadratic bias"),
        new("bG2", 0.0, -50.0, true, 50.0, true, "", "tidal bias"),
        new("bGamma3", 0.0, -50.0, true, 50.0, true, "", "third-order nonlocal bias"),
        new("c0", 0.0, -1000.0, true, 1000.0, true, "(Mpc/h)^2", "counterterm -2 c0 k^2 P_IR"),
        new("c2", 0.0, -1000.0, true, 1000.0, true, "(Mpc/h)^2", "counterterm -2 c2 f mu^2 k^2 P_IR"),
        new("c4", 0.0, -1000.0, true, 1000.0, true, "(Mpc/h)^2", "counterterm -2 c4 f^2 mu^4 k^2 P_IR"),
        new("ck4", 0.0, -1e5, true, 1e5, true, "(Mpc/h)^4", "counterterm -ck4 f^4 mu^4 k^4 (b1 + f mu^2)^2 P_IR"),
        new("stoch0", 0.0, -1e6, true, 1e6, true, "(Mpc/h)^3", "constant stochastic term"),
        new("stoch_k2", 0.0, -1e6, true, 1e6, true, "(Mpc/h)^5", "stochastic term stoch_k2 k^2"),
        new("stoch_k2mu2", 0.0, -1e6, true, 1e6, true, "(Mpc/h)^5", "stochastic term stoch_k2mu2 k^2 mu^2"),
    ];

    /// <summary>Index of each nuisance parameter.</summary>
    internal const int B1 = 0, B2 = 1, BG2 = 2, BGamma3 = 3, C0 = 4, C2 = 5, C4 = 6, Ck4 = 7, Stoch0 = 8, StochK2 = 9, StochK2Mu2 = 10;

    /// <summary>The layout.</summary>
    public static BasisLayout Layout { get; } = Build();

    /// <summary>Term index of monomial <paramref name="m"/>'s tree plus loop in multipole slot <paramref name="l"/> (0, 1, 2 for ℓ = 0, 2, 4).</summary>
    internal static int LoopTerm(GalaxyMonomial m, int l) => ((int)m * 3) + l;

    /// <summary>First counterterm term; then c0, c2, c4, ck4, ck4·b1, ck4·b1² each over the three multipoles.</summary>
    internal static int CountertermStart => MuPolynomials.Monomials * 3;

    /// <summary>First stochastic term: P0 stoch0, P0 stoch_k2, P0 stoch_k2mu2, P2 stoch_k2mu2.</summary>
    internal static int StochasticStart => CountertermStart + (6 * 3);

    private static BasisLayout Build()
    {
        var terms = new List<BasisTerm>();
        foreach (var m in Enum.GetValues<GalaxyMonomial>())
        {
            for (int l = 0; l < 3; l++)
            {
                terms.Add(new BasisTerm($"P{Multipoles[l]}_{Name(m)}", l, 1.0, Factors(m)));
            }
        }

        foreach (var (name, prefactor, factors) in new[]
                 {
                     ("c0", -2.0, new[] { C0 }), ("c2", -2.0, new[] { C2 }), ("c4", -2.0, new[] { C4 }),
                     ("ck4", -1.0, new[] { Ck4 }), ("ck4_b1", -1.0, new[] { Ck4, B1 }), ("ck4_b1b1", -1.0, new[] { Ck4, B1, B1 }),
                 })
        {
            for (int l = 0; l < 3; l++)
            {
                terms.Add(new BasisTerm($"P{Multipoles[l]}_{name}", l, prefactor, factors));
            }
        }

        terms.Add(new BasisTerm("P0_stoch0", 0, 1.0, [Stoch0]));
        terms.Add(new BasisTerm("P0_stoch_k2", 0, 1.0, [StochK2]));
        terms.Add(new BasisTerm("P0_stoch_k2mu2", 0, 1.0, [StochK2Mu2]));
        terms.Add(new BasisTerm("P2_stoch_k2mu2", 1, 1.0, [StochK2Mu2]));
        return new BasisLayout(["P0", "P2", "P4"], Nuisance.Select(d => d.Name).ToArray(), terms);
    }

    private static string Name(GalaxyMonomial m) => m switch
    {
        GalaxyMonomial.One => "1",
        GalaxyMonomial.B1 => "b1",
        GalaxyMonomial.B1B1 => "b1b1",
        GalaxyMonomial.B2 => "b2",
        GalaxyMonomial.B1B2 => "b1b2",
        GalaxyMonomial.B2B2 => "b2b2",
        GalaxyMonomial.BG2 => "bG2",
        GalaxyMonomial.B1BG2 => "b1bG2",
        GalaxyMonomial.B2BG2 => "b2bG2",
        GalaxyMonomial.BG2BG2 => "bG2bG2",
        GalaxyMonomial.BGamma3 => "bGamma3",
        GalaxyMonomial.B1BGamma3 => "b1bGamma3",
        _ => throw new ArgumentOutOfRangeException(nameof(m)),
    };

    private static int[] Factors(GalaxyMonomial m) => m switch
    {
        GalaxyMonomial.One => [],
        GalaxyMonomial.B1 => [B1],
        GalaxyMonomial.B1B1 => [B1, B1],
        GalaxyMonomial.B2 => [B2],
        GalaxyMonomial.B1B2 => [B1, B2],
        GalaxyMonomial.B2B2 => [B2, B2],
        GalaxyMonomial.BG2 => [BG2],
        GalaxyMonomial.B1BG2 => [B1, BG2],
        GalaxyMonomial.B2BG2 => [B2, BG2],
        GalaxyMonomial.BG2BG2 => [BG2, BG2],
        GalaxyMonomial.BGamma3 => [BGamma3],
        GalaxyMonomial.B1BGamma3 => [B1, BGamma3],
        _ => throw new ArgumentOutOfRangeException(nameof(m)),
    };
}
