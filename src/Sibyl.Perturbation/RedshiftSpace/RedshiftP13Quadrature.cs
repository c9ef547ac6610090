using Sibyl.Perturbation.Loops;

namespace Sibyl.Perturbation.RedshiftSpace;

/// <summary>
/// The P_13 integrals that redshift space adds to the six matter ones: I_X(k) = (1/4π²)∫dq q² K_X(q/k) P(q)
/// for the two <see cref="DisplacementKernels"/>, and the displacement variance σ_v² = (1/6π²)∫dq P(q),
/// by the same product integration as <see cref="LoopQuadrature"/> (same grid and truncation).
/// </summary>
public sealed class RedshiftP13Quadrature
{
    private readonly ProductGrid _grid;
    private readonly P13WeightTable _table;
    private readonly double[] _varianceWeights;

    /// <summary>Builds the plan for output wavenumbers <paramref name="k"/> (validated by <see cref="LoopQuadrature"/>'s rules).</summary>
    public RedshiftP13Quadrature(ReadOnlySpan<double> k, double qMin = LogSampledSpectrum.DefaultQMin, double qMax = LogSampledSpectrum.DefaultQMax)
    {
        PlanArguments.ValidateRange(qMin, qMax);
        PlanArguments.ValidateWavenumbers(k, qMin, qMax);
        KCount = k.Length;
        _grid = new ProductGrid(qMin, qMax);
        _table = new P13WeightTable(_grid, k, DisplacementKernels.Count, DisplacementKernels.Evaluate);
        _varianceWeights = LinearIntegralWeights(_grid);
    }

    /// <summary>Number of output wavenumbers.</summary>
    public int KCount { get; }

    /// <summary>
    /// Writes I_DisplacementAlpha and I_DisplacementGamma (structure-major, length 2·KCount) and returns σ_v² in (Mpc/h)².
    /// </summary>
    public double Compute(LogSampledSpectrum spectrum, Span<double> integrals)
    {
        ArgumentNullException.ThrowIfNull(spectrum);
        if (integrals.Length != DisplacementKernels.Count * KCount)
        {
            throw new ArgumentException($"need {DisplacementKernels.Count * KCount} slots, got {integrals.Length}", nameof(integrals));
        }

        Span<double> resampled = stackalloc double[_grid.Count];
        _grid.Resample(spectrum, resampled);
        _table.Accumulate(resampled, integrals);
        double sum = 0.0;
        for (int i = 0; i < resampled.Length; i++)
        {
            sum += _varianceWeights[i] * resampled[i];
        }

        return sum / (6.0 * Math.PI * Math.PI);
    }

    /// <summary>Weights w_i with ∫dq P(q) = Σ_i w_i P(q_i) for the grid's cubic interpolant (Gauss–Legendre per cell in ln q).</summary>
    private static double[] LinearIntegralWeights(ProductGrid grid)
    {
        var weights = new double[grid.Count];
        var rule = GaussLegendreRule.Create(6);
        Span<double> basis = stackalloc double[4];
        for (int cell = 0; cell < grid.CellCount; cell++)
        {
            double a = grid.LnQ[cell], b = grid.LnQ[cell + 1], half = 0.5 * (b - a);
            int first = grid.StencilStart(cell);
            for (int n = 0; n < rule.Count; n++)
            {
                double u = a + half * (rule.Nodes[n] + 1.0);
                grid.Basis(cell, u, basis);
                double measure = half * rule.Weights[n] * Math.Exp(u);
                for (int m = 0; m < 4; m++)
                {
                    weights[first + m] += measure * basis[m];
                }
            }
        }

        return weights;
    }
}
