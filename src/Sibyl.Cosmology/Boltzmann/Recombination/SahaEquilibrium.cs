using static Sibyl.Cosmology.Boltzmann.Recombination.PhysicalConstants;

namespace Sibyl.Cosmology.Boltzmann.Recombination;

/// <summary>
/// Ionisation equilibrium of hydrogen and helium with the radiation (Saha equation), all three stages coupled
/// through the common electron density: n_e n_{i+1} / n_i = (g_e g_{i+1} / g_i) (2π m_e k T/h²)^{3/2} e^{−χ_i/kT},
/// with statistical-weight factors 1 for H, 4 for He I → He II and 1 for He II → He III.
/// </summary>
internal static class SahaEquilibrium
{
    /// <summary>Relative accuracy of x_e.</summary>
    private const double Tolerance = 1e-14;

    /// <summary>Ionisation in equilibrium with black-body radiation.</summary>
    /// <param name="temperature">Temperature of radiation and gas in K.</param>
    /// <param name="hydrogenDensity">n_H in m⁻³.</param>
    /// <param name="heliumRatio">f_He = n_He / n_H.</param>
    public static IonizationState Solve(double temperature, double hydrogenDensity, double heliumRatio)
    {
        double kT = BoltzmannConstant * temperature, phaseSpace = AtomicRates.PhaseSpaceDensity(temperature);
        var saha = new SahaFactors(
            phaseSpace * Math.Exp(-HydrogenIonization / kT),
            4.0 * phaseSpace * Math.Exp(-HeliumIonization / kT),
            phaseSpace * Math.Exp(-HeliumIIIonization / kT));

        // g(x_e) = x_e − F(x_e) rises with slope ≥ 1 from −F(0) < 0 to ≥ 0 at full ionisation: Newton's method
        // from full ionisation, kept inside the bracket by bisection, converges in a few steps. Full ionisation
        // itself is accepted at once, which covers all the early grid.
        double low = 0.0, high = 1.0 + 2.0 * heliumRatio, x = high;
        for (int iteration = 0; iteration < 200; iteration++)
        {
            double g = x - saha.FreeElectrons(x, hydrogenDensity, heliumRatio, out double slope);
            if (Math.Abs(g) <= Tolerance * x)
            {
                break;
            }

            if (g > 0.0)
            {
                high = x;
            }
            else
            {
                low = x;
            }

            double next = x - g / (1.0 - slope);
            x = next > low && next < high ? next : 0.5 * (low + high);
        }

        return saha.State(x * hydrogenDensity, heliumRatio);
    }

    /// <summary>Right-hand sides S_i of the three Saha equations in m⁻³.</summary>
    private readonly record struct SahaFactors(double Hydrogen, double HeliumI, double HeliumII)
    {
        /// <summary>Ionisation for electron density <paramref name="electrons"/> in m⁻³.</summary>
        public IonizationState State(double electrons, double heliumRatio)
        {
            // Written with n_e² in the denominator rather than ratios r_i = S_i/n_e so that nothing overflows
            // when the S_i are huge early on.
            double heliumDenominator = electrons * electrons + HeliumI * electrons + HeliumI * HeliumII;
            return new IonizationState(
                Hydrogen / (Hydrogen + electrons),
                heliumRatio * HeliumI * electrons / heliumDenominator,
                heliumRatio * HeliumI * HeliumII / heliumDenominator);
        }

        /// <summary>F(x_e), the x_e implied by electron fraction <paramref name="x"/>, and dF/dx_e in <paramref name="slope"/>.</summary>
        public double FreeElectrons(double x, double hydrogenDensity, double heliumRatio, out double slope)
        {
            double n = x * hydrogenDensity;
            double hydrogenDenominator = Hydrogen + n;
            double numerator = HeliumI * n + 2.0 * HeliumI * HeliumII;
            double denominator = n * n + HeliumI * n + HeliumI * HeliumII;
            slope = hydrogenDensity * (-Hydrogen / (hydrogenDenominator * hydrogenDenominator)
                    + heliumRatio * (HeliumI * denominator - numerator * (2.0 * n + HeliumI)) / (denominator * denominator));
            return Hydrogen / hydrogenDenominator + heliumRatio * numerator / denominator;
        }
    }
}
