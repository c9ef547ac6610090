using Sibyl.Cosmology;
using Sibyl.Cosmology.Linear;
using Sibyl.Cosmology.Parameters;
using Sibyl.Perturbation.Matter;
using Sibyl.Perturbation.TimeDependence;

namespace Sibyl.Perturbation.Tests.Matter;

public class OneLoopMatterTests
{
    private static readonly double[] K = LogGridFunction.LogGrid(0.005, 0.5, 100);
    private static readonly OneLoopMatter Calculator = new(K);
    private static readonly CosmologyModel Planck = CosmologyModel.Create(new CosmologyParameters());

    [Fact]
    public void Total_is_exactly_linear_in_the_sound_speed()
    {
        // P(cs2) = P(0) − 2 cs2 k² P_IR by construction (the check); to rounding, 1e-12 relative.
        var spectrum = Calculator.Compute(Planck, 0.5);
        var p0 = spectrum.Total(0.0);
        var p1 = spectrum.Total(1.0);
        var p3 = spectrum.Total(3.0);

        for (int i = 0; i < K.Length; i++)
        {
            Assert.Equal(p0[i] + 3.0 * (p1[i] - p0[i]), p3[i], Math.Abs(p3[i]) * 1e-12);
        }
    }

    [Fact]
    public void Resummation_damps_the_wiggles_and_keeps_the_broadband_on_large_scales()
    {
        // IR resummation (Baldauf et al. 2015; Blas et al. 2016): for k < 0.02 h/Mpc the resummed tree
        // equals P_lin to 1e-3 (the figure; the shift is ~(k²Σ²)² P_w there); across the BAO
        // the wiggle amplitude of the resummed tree is below the linear one by about e^{−k²Σ²}
        // (1 + k²Σ²) at k ≈ 0.2 h/Mpc — we ask for at least a 10 % reduction there.
        var spectrum = Calculator.Compute(Planck, 0.0);
        for (int i = 0; i < K.Length && K[i] < 0.02; i++)
        {
            Assert.Equal(1.0, spectrum.TreeIr[i] / spectrum.Linear[i], 1e-3);
        }

        double linearWiggle = 0.0, resummedWiggle = 0.0;
        for (int i = 0; i < K.Length; i++)
        {
            if (K[i] > 0.15 && K[i] < 0.3)
            {
                linearWiggle = Math.Max(linearWiggle, Math.Abs(spectrum.Linear[i] / spectrum.NoWiggle[i] - 1.0));
                resummedWiggle = Math.Max(resummedWiggle, Math.Abs(spectrum.TreeIr[i] / spectrum.NoWiggle[i] - 1.0));
            }
        }

        Assert.True(resummedWiggle < 0.9 * linearWiggle, $"wiggle amplitude {resummedWiggle} vs linear {linearWiggle}");
    }

    [Fact]
    public void Exact_time_dependence_changes_the_LCDM_loop_by_well_under_a_percent()
    {
        // Known size of the effect (Takahashi 2008, PTP 120, 549; Fasiello et al. 2022, JCAP 11, 039;
        // common practice): replacing the EdS kernels by the exact ΛCDM ones moves the one-loop term by
        // ≲ 1 % for k ≤ 0.3 h/Mpc. Here the EdS kernels are the same solver on an Ω_m = 1 background,
        // evaluated with ΛCDM's D so only the kernel shapes differ.
        var prepared = Calculator.Prepare(Planck.Linear);
        var exact = TimeCoefficientSolver.Solve(Planck.Background, Planck.Gravity, 1.0);
        var eds = Rescaled(TimeCoefficientSolver.Solve(new Cosmology.Background.ExpansionHistory(1.0), Planck.Gravity, 1.0), exact.D);
        var a = Calculator.Evaluate(prepared, exact);
        var b = Calculator.Evaluate(prepared, eds);

        double maxShift = 0.0;
        for (int i = 0; i < K.Length && K[i] <= 0.3; i++)
        {
            double loopExact = a.P22[i] + a.P13[i], loopEds = b.P22[i] + b.P13[i];
            maxShift = Math.Max(maxShift, Math.Abs(loopExact - loopEds) / Math.Abs(a.Total(0)[i]));
        }

        Assert.InRange(maxShift, 1e-5, 1e-2);
    }

    [Fact]
    public void Ndgp_tends_to_LCDM_as_Omega_rc_vanishes_and_is_enhanced_otherwise()
    {
        var dgp0 = CosmologyModel.Create(new CosmologyParameters { Gravity = GravityKind.Ndgp, OmegaRc = 1e-8 });
        var dgp = CosmologyModel.Create(new CosmologyParameters { Gravity = GravityKind.Ndgp, OmegaRc = 0.25 });
        var lcdm = Calculator.Compute(Planck, 0.5).Total(0);
        var nearly = Calculator.Compute(dgp0, 0.5).Total(0);
        var enhanced = Calculator.Compute(dgp, 0.5).Total(0);

        for (int i = 0; i < K.Length; i++)
        {
            Assert.Equal(1.0, nearly[i] / lcdm[i], 1e-4);
            Assert.True(enhanced[i] > lcdm[i]);
        }
    }

    private static TimeCoefficients Rescaled(TimeCoefficients eds, double d)
    {
        // EdS shapes (B/D², X/D³ fixed) at the ΛCDM amplitude.
        double s = d / eds.D;
        return TimeCoefficients.Scaled(eds, s);
    }
}
