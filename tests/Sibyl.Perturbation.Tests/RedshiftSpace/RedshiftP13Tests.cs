using MathNet.Numerics.Integration;
using Sibyl.Perturbation.Kernels;
using Sibyl.Perturbation.Loops;
using Sibyl.Perturbation.RedshiftSpace;
using Sibyl.Perturbation.TimeDependence;

namespace Sibyl.Perturbation.Tests.RedshiftSpace;

public class RedshiftP13Tests
{
    private static readonly TimeCoefficients Time = PlanckAtHalf.Time;
    private static readonly LogSampledSpectrum Spectrum = PlanckAtHalf.Spectrum;

    [Theory]
    [InlineData(0.05, 0.3, 1.5, 0.0, 0.0)]
    [InlineData(0.15, 0.9, 1.5, 0.0, 0.0)]
    [InlineData(0.15, 0.6, 1.8, -0.4, 0.3)]
    [InlineData(0.3, 0.95, 2.0, 0.5, -0.2)]
    public void Reduced_P13_matches_brute_force_integration_of_Z3(double k, double mu, double b1, double bG2, double bGamma3)
    {
        // Referee: 6 Z1 P(k) ∫d³q/(2π)³ Z3(k, q, −q) P(q) with Z3 evaluated from vectors
        // (RedshiftSpaceKernels, checked against EdS forms and the soft limit), integrated adaptively in
        // ln q and k̂·q̂ (MathNet Gauss–Kronrod, 1e-5 relative, well inside the target) and exactly in azimuth
        // (Z3 is a cubic trigonometric polynomial in φ, so 5 equally spaced points are exact). Target of the
        // issue: 1e-3.
        var bias = new GalaxyBias(b1, 0.0, bG2, bGamma3);
        double fast = Fast(k, mu, bias, mappingScale: 1.0);

        double referee = Referee(k, mu, bias);

        Assert.Equal(1.0, fast / referee, 1e-3);
    }

    [Fact]
    public void Real_space_mapping_gives_the_matter_P13_for_unit_bias()
    {
        // f → 0 in the mapping, b1 = 1: P_13 = 4 P Σ x_s I_s, the matter result (same integrals): 1e-12.
        double k = 0.1;
        var loops = new LoopQuadrature([k]);
        var matter = new MomentumIntegrals(1);
        loops.Compute(Spectrum, matter);
        var x = new RedshiftTimeInputs(Time).Density;
        double expected = 0.0;
        foreach (var (time, loop) in P13TimeStructures.Pairs)
        {
            expected += x[(int)time] * matter[loop][0];
        }

        expected *= 4.0 * Spectrum.Evaluate(k);

        Assert.Equal(expected, Fast(k, 0.7, GalaxyBias.Matter, mappingScale: 0.0), Math.Abs(expected) * 1e-12);
    }

    private static double Fast(double k, double mu, GalaxyBias bias, double mappingScale)
    {
        var matter = new MomentumIntegrals(1);
        new LoopQuadrature([k]).Compute(Spectrum, matter);
        var displacement = new double[DisplacementKernels.Count];
        double sigma2 = new RedshiftP13Quadrature([k]).Compute(Spectrum, displacement);
        var block = new double[MuPolynomials.BlockSize];
        RedshiftP13Terms.Add(block, matter, displacement, sigma2, 0, k, Spectrum.Evaluate(k), new RedshiftTimeInputs(Time, mappingScale));
        double mu2 = mu * mu, sum = 0.0;
        foreach (var m in Enum.GetValues<GalaxyMonomial>())
        {
            sum += Monomials.Product(m, bias) * MuPolynomials.Evaluate(block, m, mu2);
        }

        return sum;
    }

    private static double Referee(double k, double mu, GalaxyBias bias)
    {
        var z = new RedshiftSpaceKernels(new MatterKernels(Time), bias);
        var kv = new Wavevector(k * Math.Sqrt(1.0 - mu * mu), 0.0, k * mu);
        var e1 = new Wavevector(kv.X / k, 0.0, kv.Z / k);
        var e2 = new Wavevector(-e1.Z, 0.0, e1.X);
        var e3 = new Wavevector(0.0, 1.0, 0.0);
        const int Azimuths = 5;

        double Angular(double q, double x)
        {
            double s = Math.Sqrt(Math.Max(0.0, 1.0 - x * x)), sum = 0.0;
            for (int j = 0; j < Azimuths; j++)
            {
                double phi = 2.0 * Math.PI * j / Azimuths;
                double c = s * Math.Cos(phi), d = s * Math.Sin(phi);
                var qv = new Wavevector(q * (x * e1.X + c * e2.X + d * e3.X), q * (x * e1.Y + c * e2.Y + d * e3.Y), q * (x * e1.Z + c * e2.Z + d * e3.Z));
                sum += z.Z3(kv, qv, -qv);
            }

            return sum / Azimuths * 2.0 * Math.PI;
        }

        double Radial(double u)
        {
            double q = Math.Exp(u);
            double inner = GaussKronrodRule.Integrate(x => Angular(q, x), -1.0, 1.0, out _, out _, 1e-6, 10, 15);
            return q * q * q * Spectrum.Evaluate(q) * inner;
        }

        double lnK = Math.Log(k);
        double integral = GaussKronrodRule.Integrate(Radial, Math.Log(Spectrum.QMin), lnK, out _, out _, 1e-5, 10, 15)
                          + GaussKronrodRule.Integrate(Radial, lnK, Math.Log(Spectrum.QMax), out _, out _, 1e-5, 10, 15);
        return 6.0 * z.Z1(kv) * Spectrum.Evaluate(k) * integral / Math.Pow(2.0 * Math.PI, 3);
    }
}
