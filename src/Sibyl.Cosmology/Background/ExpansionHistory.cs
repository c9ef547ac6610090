namespace Sibyl.Cosmology.Background;

/// <summary>
/// Expansion history of a flat universe with matter and a dark-energy fluid with the
/// Chevallier–Polarski–Linder equation of state w(a) = w0 + wa (1 − a) (Linder 2003, PRL 90, 091301).
/// Radiation is neglected: this background serves late-time growth (z ≲ 20, where radiation is below
/// 0.5 % of the density for Planck-like ω_m); the early universe enters only through the transfer function.
/// </summary>
public sealed class ExpansionHistory
{
    /// <summary>Creates the expansion history.</summary>
    /// <param name="omegaMatter">Ω_m today, in (0, 1].</param>
    /// <param name="w0">Dark-energy equation of state today.</param>
    /// <param name="wa">Its CPL slope; w0 + wa &lt; 0 so that matter dominates at early times.</param>
    /// <exception cref="ArgumentOutOfRangeException">A value is outside its range.</exception>
    public ExpansionHistory(double omegaMatter, double w0 = -1.0, double wa = 0.0)
    {
        if (!(omegaMatter > 0.0 && omegaMatter <= 1.0))
        {
            throw new ArgumentOutOfRangeException(nameof(omegaMatter), omegaMatter, "Omega_m must lie in (0, 1]");
        }

        if (!double.IsFinite(w0) || !double.IsFinite(wa) || !(w0 + wa < 0.0))
        {
            throw new ArgumentOutOfRangeException(nameof(wa), wa, "w0 + wa must be finite and below 0 so that matter dominates early");
        }

        OmegaMatter = omegaMatter;
        W0 = w0;
        Wa = wa;
    }

    /// <summary>Ω_m today.</summary>
    public double OmegaMatter { get; }

    /// <summary>Ω_DE today, 1 − Ω_m (flat).</summary>
    public double OmegaDarkEnergy => 1.0 - OmegaMatter;

    /// <summary>CPL w0.</summary>
    public double W0 { get; }

    /// <summary>CPL wa.</summary>
    public double Wa { get; }

    /// <summary>True for a cosmological constant (w0 = −1, wa = 0).</summary>
    public bool IsCosmologicalConstant => W0 == -1.0 && Wa == 0.0;

    /// <summary>Dark-energy equation of state w(a).</summary>
    public double EquationOfState(double a) => W0 + Wa * (1.0 - a);

    /// <summary>Dark-energy density in units of today's critical density: Ω_DE a^{−3(1+w0+wa)} e^{−3 wa (1 − a)}.</summary>
    public double DarkEnergyDensity(double a) =>
        OmegaDarkEnergy * Math.Exp(-3.0 * (1.0 + W0 + Wa) * Math.Log(a) - 3.0 * Wa * (1.0 - a));

    /// <summary>E²(a) = H²/H0².</summary>
    public double HubbleSquared(double a) => OmegaMatter / (a * a * a) + DarkEnergyDensity(a);

    /// <summary>E(a) = H/H0.</summary>
    public double Hubble(double a) => Math.Sqrt(HubbleSquared(a));

    /// <summary>Ω_m(a) = Ω_m a^{−3} / E².</summary>
    public double OmegaMatterAt(double a) => OmegaMatter / (a * a * a) / HubbleSquared(a);

    /// <summary>Ω_DE(a) = 1 − Ω_m(a).</summary>
    public double OmegaDarkEnergyAt(double a) => DarkEnergyDensity(a) / HubbleSquared(a);

    /// <summary>d ln H / d ln a = −(3/2)[Ω_m(a) + (1 + w(a)) Ω_DE(a)], equal to Ḣ/H².</summary>
    public double HubbleLogSlope(double a) =>
        -1.5 * (OmegaMatterAt(a) + (1.0 + EquationOfState(a)) * OmegaDarkEnergyAt(a));
}
