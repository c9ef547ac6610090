namespace Sibyl.Perturbation.RedshiftSpace;

/// <summary>
/// P_22 of the redshift-space galaxy spectrum by bias monomial, from the cosmology-independent pair integrals of
/// <see cref="RedshiftP22Quadrature"/>. With Z2 = b1 U + V + b2/2 + bG2 W,
/// U = α_s + b̃ γ + f L1, V = f μ² α_s + ṽ μ² γ + f² L2, W = −γ (see <see cref="RedshiftP22Structure"/>),
/// 2∫Z2² P P splits into b1² [UU] + b1 2[UV] + [VV] + b1b2 [U1] + b2 [V1] + b2² [11]/4 + b1bG2 2[UW] + bG2 2[VW]
/// + b2bG2 [1W] + bG2² [WW], where [XY] = Σ_ab X_a Y_b J_ab over ordered pairs.
/// </summary>
internal static class RedshiftP22Terms
{
    /// <summary>Adds P_22 at wavenumber index <paramref name="i"/> into a <see cref="MuPolynomials"/> block.</summary>
    /// <param name="block">Destination (accumulated into).</param>
    /// <param name="j">Pair integrals of the spectrum.</param>
    /// <param name="i">Index of k.</param>
    /// <param name="t">Normalised time inputs.</param>
    /// <param name="constantB2B2">The k → 0 limit of the b2² term, removed (degenerate with the constant stochastic term).</param>
    public static void Add(Span<double> block, RedshiftP22Integrals j, int i, RedshiftTimeInputs t, double constantB2B2)
    {
        double f = t.MappedGrowthRate, v = t.MappedVelocityGamma;
        Span<(RedshiftP22Structure S, double C)> u = [(RedshiftP22Structure.AlphaS, 1.0), (RedshiftP22Structure.Gamma, t.DensityGamma), (RedshiftP22Structure.L1, f)];
        Span<(RedshiftP22Structure S, double C)> vv = [(RedshiftP22Structure.Mu2AlphaS, f), (RedshiftP22Structure.Mu2Gamma, v), (RedshiftP22Structure.L2, f * f)];
        Span<(RedshiftP22Structure S, double C)> one = [(RedshiftP22Structure.One, 1.0)];
        Span<(RedshiftP22Structure S, double C)> w = [(RedshiftP22Structure.Gamma, -1.0)];

        AddPair(block, GalaxyMonomial.B1B1, 1.0, u, u, j, i);
        AddPair(block, GalaxyMonomial.B1, 2.0, u, vv, j, i);
        AddPair(block, GalaxyMonomial.One, 1.0, vv, vv, j, i);
        AddPair(block, GalaxyMonomial.B1B2, 1.0, u, one, j, i);
        AddPair(block, GalaxyMonomial.B2, 1.0, vv, one, j, i);
        AddPair(block, GalaxyMonomial.B2B2, 0.25, one, one, j, i);
        MuPolynomials.Add(block, GalaxyMonomial.B2B2, 0, -0.25 * constantB2B2);
        AddPair(block, GalaxyMonomial.B1BG2, 2.0, u, w, j, i);
        AddPair(block, GalaxyMonomial.BG2, 2.0, vv, w, j, i);
        AddPair(block, GalaxyMonomial.B2BG2, 1.0, one, w, j, i);
        AddPair(block, GalaxyMonomial.BG2BG2, 1.0, w, w, j, i);
    }

    private static void AddPair(
        Span<double> block, GalaxyMonomial m, double factor,
        ReadOnlySpan<(RedshiftP22Structure S, double C)> x, ReadOnlySpan<(RedshiftP22Structure S, double C)> y,
        RedshiftP22Integrals j, int i)
    {
        foreach (var (a, ca) in x)
        {
            foreach (var (b, cb) in y)
            {
                double c = factor * ca * cb;
                if (c == 0.0)
                {
                    continue;
                }

                for (int n = 0; n < MuPolynomials.Powers; n++)
                {
                    MuPolynomials.Add(block, m, n, c * j.Get(a, b, n)[i]);
                }
            }
        }
    }
}
