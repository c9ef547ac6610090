using Sibyl.Cosmology.Boltzmann;
using Sibyl.Cosmology.Boltzmann.Perturbations;
using Sibyl.Cosmology.Linear;
using Sibyl.Cosmology.Parameters;

namespace Sibyl.Cosmology.Tests.Boltzmann;

public class BoltzmannLinearTests
{
    // Planck 2018 VI (A&A 641, A6) Table 2 base ΛCDM, TT,TE,EE+lowE+lensing, values from memory.
    private static readonly CosmologyParameters Planck = new()
    {
        H = 0.6736,
        OmegaBaryon = 0.02237,
        OmegaCdm = 0.1200,
        SpectralIndex = 0.9649,
        Ln10As = 3.044,
        Sigma8 = null,
    };

    private static readonly Lazy<(LinearSpectrum Solver, LinearSpectrum Fit)> Spectra = new(() =>
    {
        var fitModel = CosmologyModel.Create(Planck);
        return (BoltzmannLinear.Compute(Planck, fitModel.LcdmGrowthToday), fitModel.Linear);
    });

    [Fact]
    public void Spectrum_matches_the_fitting_formula_within_its_stated_accuracy()
    {
        // Eisenstein & Hu (1998, ApJ 496, 605) quote (from memory) residuals of a few per cent in T(k) against
        // Boltzmann-code transfer functions for standard parameters, worst around the BAO. Both spectra share
        // ln10As, so the ratio of transfer functions is √(P_solver/P_fit): within 4 % for 1e-4 ≤ k ≤ 5 h/Mpc (the solver's
        // last wavenumber), and
        // within 0.5 % on the largest scales where both reduce to the same matter-era Poisson limit.
        var (solver, fit) = Spectra.Value;
        foreach (double k in LogGridFunction.LogGrid(1e-4, BoltzmannLinear.SolverKMax, 200))
        {
            double transferRatio = Math.Sqrt(solver.Shape.Evaluate(k) / fit.Shape.Evaluate(k));
            Assert.InRange(transferRatio, 0.96, 1.04);
        }

        Assert.Equal(1.0, Math.Sqrt(solver.Shape.Evaluate(1e-4) / fit.Shape.Evaluate(1e-4)), 5e-3);
    }

    [Fact]
    public void Baryon_acoustic_peaks_are_spaced_by_two_pi_over_the_drag_sound_horizon()
    {
        // The baryon transfer function oscillates as sin(k s)/(k s) with s the sound horizon at the drag epoch
        // (Eisenstein & Hu 1998, eqs. 21–22), so maxima of P/P_nw sit about 2π/s apart. The phase drifts as the
        // baryon velocity term takes over from the density term at higher k (the local spacing measured here runs
        // from 0.99 to 1.04 × 2π/r_drag between the 1st and the 6th peak), so the mean spacing of the first five maxima
        // must lie within 2 % of 2π/r_drag: spectra whose peaks followed the fit's 3 % larger sound horizon would fail.
        var (solver, fit) = Spectra.Value;
        Assert.InRange(fit.BaoScale / solver.BaoScale, 1.025, 1.045);
        var maxima = new List<double>();
        double previous = double.NaN, current = double.NaN;
        foreach (double k in LogGridFunction.LogGrid(0.03, 0.4, 4000))
        {
            double wiggle = solver.Shape.Evaluate(k) / solver.NoWiggleShape.Evaluate(k);
            if (current > previous && current > wiggle)
            {
                maxima.Add(k);
            }

            previous = current;
            current = wiggle;
        }

        Assert.True(maxima.Count >= 5, $"found {maxima.Count} maxima");
        double spacing = (maxima[4] - maxima[0]) / 4.0;
        Assert.Equal(1.0, spacing * solver.BaoScale / (2.0 * Math.PI), 0.02);
    }

    [Fact]
    public void Sigma8_normalisation_reproduces_the_ln10As_spectrum_with_the_same_sigma8()
    {
        // The two normalisations are two ways of fixing one amplitude: the σ8 of the ln10As spectrum, given back as
        // σ8, must reproduce that spectrum. Only the top-hat quadrature's rounding separates them: 1e-9 relative.
        var (solver, _) = Spectra.Value;
        var model = CosmologyModel.Create(Planck);
        double sigma8 = model.LcdmGrowthToday * Math.Sqrt(TopHat.Variance(solver.Shape, 8.0));
        var parameters = Planck with { Ln10As = null, Sigma8 = sigma8 };
        var rescaled = BoltzmannLinear.Compute(parameters, model.LcdmGrowthToday);
        foreach (double k in new[] { 1e-4, 0.01, 0.1, 1.0, 10.0 })
        {
            Assert.Equal(1.0, rescaled.Shape.Evaluate(k) / solver.Shape.Evaluate(k), 1e-9);
        }
    }

    [Fact]
    public void Spectrum_comes_out_of_the_solver_with_its_own_drag_scale()
    {
        // The BAO scale reported with the spectrum is the solver's r_drag in Mpc/h (Planck 2018 VI: 147.09 Mpc, from
        // memory), not the fit's eq. 26 value; 0.5 % separates the two at these parameters.
        var (solver, fit) = Spectra.Value;
        Assert.Equal("Boltzmann solver", solver.Source);
        Assert.Equal(147.09 * Planck.H, solver.BaoScale, 147.09 * Planck.H * 2e-3);
        Assert.NotEqual(fit.BaoScale, solver.BaoScale, 1e-6);
    }

    [Fact]
    public void Spectrum_between_solver_wavenumbers_matches_direct_solves()
    {
        // The spectrum is splined between solver nodes through its ratio to the fit; solving the modes directly at
        // 60 wavenumbers off the nodes (P = 2π²/k³ A_s (k/k_p)^{n_s−1} δ_m², over D(1)² for growth units) must agree
        // to the 1e-3 the convergence tests allow for the spectrum itself.
        var (solver, _) = Spectra.Value;
        var model = CosmologyModel.Create(Planck);
        var transfer = new TransferSolver(new RadiationBackground(Planck), Planck.HeliumFraction);
        var modes = new ModeSolver(transfer.Background, new BoltzmannSettings());
        double h = Planck.H, growth = model.LcdmGrowthToday;
        foreach (double kh in LogGridFunction.LogGrid(1.1e-4, 1.0, 60))
        {
            double k = kh * h, contrast = modes.MatterContrast(k);
            double direct = 2.0 * Math.PI * Math.PI / (k * k * k) * Math.Exp(3.044) * 1e-10 * Math.Pow(k / 0.05, Planck.SpectralIndex - 1.0)
                            * contrast * contrast * h * h * h / (growth * growth);
            Assert.Equal(1.0, solver.Shape.Evaluate(kh) / direct, 1e-3);
        }
    }
}
