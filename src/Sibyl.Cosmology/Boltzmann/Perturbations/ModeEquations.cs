namespace Sibyl.Cosmology.Boltzmann.Perturbations;

/// <summary>
/// The linear equations of one Fourier mode in synchronous gauge, CDM at rest (Ma &amp; Bertschinger 1995,
/// ApJ 455, 7, eqs. 21, 42, 49, 63–66), written with ln a as the time variable: every conformal-time derivative
/// is divided by 𝓗. Dark energy has no perturbations, which is consistent for a cosmological constant only; the
/// spectrum of a w0wa model is therefore taken from its Λ counterpart (see <see cref="BoltzmannLinear"/>). Three
/// regimes share one state layout; variables a regime does not evolve keep
/// a zero derivative.
/// </summary>
public sealed class ModeEquations
{
    private readonly ModeBackground _background;
    private readonly ModeLayout _layout;
    private readonly double _k, _k2;
    private readonly double _cdmWeight, _baryonWeight, _photonWeight, _neutrinoWeight, _photonToBaryon;

    /// <summary>Equations for wavenumber <paramref name="k"/> in 1/Mpc.</summary>
    public ModeEquations(ModeBackground background, ModeLayout layout, double k)
    {
        ArgumentNullException.ThrowIfNull(background);
        ArgumentNullException.ThrowIfNull(layout);
        _background = background;
        _layout = layout;
        _k = k;
        _k2 = k * k;
        var b = background.Background;
        double h0Squared = b.HubbleToday * b.HubbleToday;
        _cdmWeight = 1.5 * h0Squared * b.OmegaCdm;
        _baryonWeight = 1.5 * h0Squared * b.OmegaBaryon;
        _photonWeight = 1.5 * h0Squared * b.OmegaPhoton;
        _neutrinoWeight = 1.5 * h0Squared * b.OmegaNeutrino;
        _photonToBaryon = background.PhotonToBaryonToday;
        Derivative = Evaluate;
    }

    /// <summary>Free streaming evolves only η, δ_c, δ_b and θ_b, the first entries of the state.</summary>
    public const int FreeStreamingDimension = 4;

    /// <summary>The regime <see cref="Derivative"/> evaluates.</summary>
    public ModeRegime Regime { get; set; }

    /// <summary>dy/d ln a for the current regime, as a delegate made once.</summary>
    public Numerics.OdeRightHandSide Derivative { get; }

    /// <summary>
    /// Total matter density contrast δ_m = (ρ_c δ_c + ρ_b δ_b)/(ρ_c + ρ_b) of a state, in the CDM rest frame
    /// (the synchronous-gauge density that defines the matter power spectrum).
    /// </summary>
    public double MatterContrast(ReadOnlySpan<double> y) =>
        (_cdmWeight * y[ModeLayout.DeltaCdm] + _baryonWeight * y[ModeLayout.DeltaBaryon]) / (_cdmWeight + _baryonWeight);

    /// <summary>
    /// Curvature on uniform-density slices, ζ = −η + δρ/(3(ρ + p)) (Bardeen, Steinhardt &amp; Turner 1983;
    /// Wands et al. 2000), conserved outside the horizon for adiabatic modes. Valid before free streaming, which
    /// stops evolving the radiation variables it reads.
    /// </summary>
    public double UniformDensityCurvature(double lnA, ReadOnlySpan<double> y)
    {
        double a = Math.Exp(lnA);
        double matter = (_cdmWeight * y[ModeLayout.DeltaCdm] + _baryonWeight * y[ModeLayout.DeltaBaryon]) / a;
        double radiation = (_photonWeight * y[ModeLayout.DeltaPhoton] + _neutrinoWeight * y[_layout.DeltaNeutrino]) / (a * a);
        double enthalpy = (_cdmWeight + _baryonWeight) / a + 4.0 / 3.0 * (_photonWeight + _neutrinoWeight) / (a * a);
        return -y[ModeLayout.Eta] + (matter + radiation) / (3.0 * enthalpy);
    }

    /// <summary>
    /// Adiabatic growing-mode initial conditions at <paramref name="lnA"/> deep in the radiation era
    /// (Ma &amp; Bertschinger 1995, eq. 96), normalised to ζ = 1 outside the horizon (C = −1/2).
    /// </summary>
    public void InitialConditions(double lnA, Span<double> y)
    {
        y.Clear();
        _background.At(lnA, out var p);
        double rNu = _background.Background.NeutrinoFraction;
        const double c = -0.5;
        double kt = _k * p.Time, kt2 = kt * kt;
        double deltaPhoton = -2.0 / 3.0 * c * kt2;
        double thetaPhoton = -c * kt2 * kt2 / (18.0 * p.Time);
        y[ModeLayout.Eta] = 2.0 * c - (5.0 + 4.0 * rNu) / (6.0 * (15.0 + 4.0 * rNu)) * c * kt2;
        y[ModeLayout.DeltaCdm] = 0.75 * deltaPhoton;
        y[ModeLayout.DeltaBaryon] = 0.75 * deltaPhoton;
        y[ModeLayout.ThetaBaryon] = thetaPhoton;
        y[ModeLayout.DeltaPhoton] = deltaPhoton;
        y[ModeLayout.ThetaPhoton] = thetaPhoton;
        y[_layout.DeltaNeutrino] = deltaPhoton;
        y[_layout.ThetaNeutrino] = (23.0 + 4.0 * rNu) / (15.0 + 4.0 * rNu) * thetaPhoton;
        y[_layout.NeutrinoQuadrupole] = 2.0 * 4.0 * c / (3.0 * (15.0 + 4.0 * rNu)) * kt2;
    }

    /// <summary>
    /// Leaves tight coupling: fills the photon quadrupole and polarisation with their first-order tight-coupling
    /// values, σ_γ = (16/45) τ_c (θ_γ + h'/2 + 3η'), G_γ0 = (5/4) F_γ2, G_γ2 = (1/4) F_γ2 (the steady state of
    /// eqs. 63–64 for large κ', polarisation included).
    /// </summary>
    public void LeaveTightCoupling(double lnA, Span<double> y)
    {
        _background.At(lnA, out var p);
        var (hPrime, etaPrime) = Metric(p, y);
        double shear = 16.0 / 45.0 / p.Opacity * (y[ModeLayout.ThetaPhoton] + 0.5 * hPrime + 3.0 * etaPrime);
        double quadrupole = 2.0 * shear;
        y[ModeLayout.PhotonQuadrupole] = quadrupole;
        y[_layout.Polarization] = 1.25 * quadrupole;
        y[_layout.Polarization + 2] = 0.25 * quadrupole;
    }

    private void Evaluate(double lnA, ReadOnlySpan<double> y, Span<double> dy)
    {
        _background.At(lnA, out var p);
        switch (Regime)
        {
            case ModeRegime.TightCoupling:
                TightCoupling(p, y, dy);
                break;
            case ModeRegime.FullHierarchy:
                FullHierarchy(p, y, dy);
                break;
            default:
                FreeStreaming(p, y, dy);
                break;
        }
    }

    /// <summary>h' from the energy constraint and η' from the momentum constraint (eq. 21a, b).</summary>
    private (double HPrime, double EtaPrime) Metric(in ModePoint p, ReadOnlySpan<double> y)
    {
        double a = p.ScaleFactor, a2 = a * a;
        double densityTerm = (_cdmWeight * y[ModeLayout.DeltaCdm] + _baryonWeight * y[ModeLayout.DeltaBaryon]) / a
                             + (_photonWeight * y[ModeLayout.DeltaPhoton] + _neutrinoWeight * y[_layout.DeltaNeutrino]) / a2;
        double momentumTerm = _baryonWeight * y[ModeLayout.ThetaBaryon] / a
                              + 4.0 / 3.0 * (_photonWeight * y[ModeLayout.ThetaPhoton] + _neutrinoWeight * y[_layout.ThetaNeutrino]) / a2;
        double hPrime = 2.0 * (_k2 * y[ModeLayout.Eta] + densityTerm) / p.ConformalHubble;
        return (hPrime, momentumTerm / _k2);
    }

    private void FullHierarchy(in ModePoint p, ReadOnlySpan<double> y, Span<double> dy)
    {
        var (hPrime, etaPrime) = Metric(p, y);
        double k = _k, opacity = p.Opacity, inverseHubble = 1.0 / p.ConformalHubble;
        double photonToBaryon = _photonToBaryon / p.ScaleFactor;
        double thetaBaryon = y[ModeLayout.ThetaBaryon], thetaPhoton = y[ModeLayout.ThetaPhoton];
        double quadrupole = y[ModeLayout.PhotonQuadrupole], shear = 0.5 * quadrupole;

        dy[ModeLayout.Eta] = etaPrime;
        dy[ModeLayout.DeltaCdm] = -0.5 * hPrime;
        dy[ModeLayout.DeltaBaryon] = -thetaBaryon - 0.5 * hPrime;
        dy[ModeLayout.ThetaBaryon] = -p.ConformalHubble * thetaBaryon + p.BaryonSoundSpeedSquared * _k2 * y[ModeLayout.DeltaBaryon]
                                     + photonToBaryon * opacity * (thetaPhoton - thetaBaryon);
        dy[ModeLayout.DeltaPhoton] = -4.0 / 3.0 * thetaPhoton - 2.0 / 3.0 * hPrime;
        dy[ModeLayout.ThetaPhoton] = _k2 * (0.25 * y[ModeLayout.DeltaPhoton] - shear) + opacity * (thetaBaryon - thetaPhoton);

        int g0 = _layout.Polarization;
        double source = quadrupole + y[g0] + y[g0 + 2];
        dy[ModeLayout.PhotonQuadrupole] = 8.0 / 15.0 * thetaPhoton - 0.6 * k * y[_layout.Photon(3)] + 4.0 / 15.0 * hPrime + 1.6 * etaPrime
                                          - 1.8 * opacity * shear + 0.1 * opacity * (y[g0] + y[g0 + 2]);
        double truncation = 1.0 / p.Time;
        Hierarchy(y, dy, _layout.Photon(3), 3, _layout.PhotonMultipoles, k, opacity, truncation);

        dy[g0] = -k * y[g0 + 1] + opacity * (-y[g0] + 0.5 * source);
        dy[g0 + 1] = k / 3.0 * (y[g0] - 2.0 * y[g0 + 2]) - opacity * y[g0 + 1];
        dy[g0 + 2] = k / 5.0 * (2.0 * y[g0 + 1] - 3.0 * y[g0 + 3]) + opacity * (-y[g0 + 2] + 0.1 * source);
        Hierarchy(y, dy, g0 + 3, 3, _layout.PolarizationMultipoles, k, opacity, truncation);

        Neutrinos(y, dy, hPrime, etaPrime, truncation);
        Scale(dy, inverseHubble, _layout.Dimension);
    }

    private void TightCoupling(in ModePoint p, ReadOnlySpan<double> y, Span<double> dy)
    {
        var (hPrime, etaPrime) = Metric(p, y);
        double hubble = p.ConformalHubble, cs2 = p.BaryonSoundSpeedSquared, k2 = _k2;
        double photonToBaryon = _photonToBaryon / p.ScaleFactor;
        double meanFreeTime = 1.0 / p.Opacity;
        double thetaBaryon = y[ModeLayout.ThetaBaryon], thetaPhoton = y[ModeLayout.ThetaPhoton];
        double deltaBaryon = y[ModeLayout.DeltaBaryon], deltaPhoton = y[ModeLayout.DeltaPhoton];
        double shear = 16.0 / 45.0 * meanFreeTime * (thetaPhoton + 0.5 * hPrime + 3.0 * etaPrime);

        double deltaBaryonPrime = -thetaBaryon - 0.5 * hPrime;
        double deltaPhotonPrime = -4.0 / 3.0 * thetaPhoton - 2.0 / 3.0 * hPrime;
        double forcing = -hubble * thetaBaryon + cs2 * k2 * deltaBaryon + photonToBaryon * k2 * (0.25 * deltaPhoton - shear);

        // Slip S = θ_b − θ_γ to first order in τ_c: S = −P X with P = τ_c/(1 + R), X = 𝓗θ_b + k²(δ_γ/4 − c_s² δ_b),
        // from eliminating κ'(θ_γ − θ_b) between the baryon and photon Euler equations; S' follows by differentiating,
        // with the zeroth-order θ' and c_s² ∝ 1/a (T_b = T_γ while coupled).
        double onePlusR = 1.0 + photonToBaryon;
        double slipWeight = meanFreeTime / onePlusR;
        double x = hubble * thetaBaryon + k2 * (0.25 * deltaPhoton - cs2 * deltaBaryon);
        double zerothThetaPrime = forcing / onePlusR;
        double xPrime = p.ConformalHubbleDerivative * thetaBaryon + hubble * zerothThetaPrime
                        + k2 * (0.25 * deltaPhotonPrime - cs2 * deltaBaryonPrime + hubble * cs2 * deltaBaryon);
        double logWeightPrime = -hubble * p.OpacityLogSlope + hubble * photonToBaryon / onePlusR;
        double slipPrime = -slipWeight * (xPrime + x * logWeightPrime);

        double thetaBaryonPrime = (forcing + photonToBaryon * slipPrime) / onePlusR;
        dy[ModeLayout.Eta] = etaPrime;
        dy[ModeLayout.DeltaCdm] = -0.5 * hPrime;
        dy[ModeLayout.DeltaBaryon] = deltaBaryonPrime;
        dy[ModeLayout.ThetaBaryon] = thetaBaryonPrime;
        dy[ModeLayout.DeltaPhoton] = deltaPhotonPrime;
        dy[ModeLayout.ThetaPhoton] = -(thetaBaryonPrime + hubble * thetaBaryon - cs2 * k2 * deltaBaryon) / photonToBaryon
                                     + k2 * (0.25 * deltaPhoton - shear);
        dy.Slice(ModeLayout.PhotonQuadrupole, _layout.DeltaNeutrino - ModeLayout.PhotonQuadrupole).Clear();
        Neutrinos(y, dy, hPrime, etaPrime, 1.0 / p.Time);
        Scale(dy, 1.0 / hubble, _layout.Dimension);
    }

    private void FreeStreaming(in ModePoint p, ReadOnlySpan<double> y, Span<double> dy)
    {
        // Inside the horizon after decoupling, radiation follows the metric: δ_r = 4𝓗h'/k² − 4η, θ_r = −h'/2
        // (the non-oscillating solution of the free-streaming hierarchy; Blas, Lesgourgues & Tram 2011, JCAP 07, 034,
        // §5), so h' solves h'(1 − 8w_r/k²) = (2/𝓗)(k²η + w_m δ_m − 4 w_r η) with w_r = 4πG a² ρ_r.
        double a = p.ScaleFactor, hubble = p.ConformalHubble, eta = y[ModeLayout.Eta];
        double radiationWeight = (_photonWeight + _neutrinoWeight) / (a * a);
        double matterTerm = (_cdmWeight * y[ModeLayout.DeltaCdm] + _baryonWeight * y[ModeLayout.DeltaBaryon]) / a;
        double hPrime = 2.0 / hubble * (_k2 * eta + matterTerm - 4.0 * radiationWeight * eta) / (1.0 - 8.0 * radiationWeight / _k2);
        double thetaRadiation = -0.5 * hPrime;
        double thetaBaryon = y[ModeLayout.ThetaBaryon];
        double etaPrime = (_baryonWeight * thetaBaryon / a + 4.0 / 3.0 * radiationWeight * thetaRadiation) / _k2;

        dy[ModeLayout.Eta] = etaPrime;
        dy[ModeLayout.DeltaCdm] = -0.5 * hPrime;
        dy[ModeLayout.DeltaBaryon] = -thetaBaryon - 0.5 * hPrime;
        dy[ModeLayout.ThetaBaryon] = -hubble * thetaBaryon + p.BaryonSoundSpeedSquared * _k2 * y[ModeLayout.DeltaBaryon]
                                     + _photonToBaryon / a * p.Opacity * (thetaRadiation - thetaBaryon);
        Scale(dy, 1.0 / hubble, FreeStreamingDimension);
    }

    private void Neutrinos(ReadOnlySpan<double> y, Span<double> dy, double hPrime, double etaPrime, double truncation)
    {
        int d = _layout.DeltaNeutrino, t = _layout.ThetaNeutrino, q = _layout.NeutrinoQuadrupole;
        double theta = y[t];
        dy[d] = -4.0 / 3.0 * theta - 2.0 / 3.0 * hPrime;
        dy[t] = _k2 * (0.25 * y[d] - 0.5 * y[q]);
        dy[q] = 8.0 / 15.0 * theta - 0.6 * _k * y[q + 1] + 4.0 / 15.0 * hPrime + 1.6 * etaPrime;
        Hierarchy(y, dy, q + 1, 3, _layout.NeutrinoMultipoles, _k, 0.0, truncation);
    }

    /// <summary>
    /// Free-streaming recursion F_ℓ' = k/(2ℓ+1)[ℓF_{ℓ−1} − (ℓ+1)F_{ℓ+1}] − κ'F_ℓ from ℓ = <paramref name="firstL"/>
    /// (stored at <paramref name="first"/>) to ℓmax, closed by F_ℓmax' = kF_{ℓmax−1} − (ℓmax+1)F_ℓmax/τ − κ'F_ℓmax (eq. 65).
    /// </summary>
    private static void Hierarchy(ReadOnlySpan<double> y, Span<double> dy, int first, int firstL, int lMax, double k, double opacity, double truncation)
    {
        int index = first;
        for (int l = firstL; l < lMax; l++, index++)
        {
            dy[index] = k / (2 * l + 1) * (l * y[index - 1] - (l + 1) * y[index + 1]) - opacity * y[index];
        }

        dy[index] = k * y[index - 1] - ((lMax + 1) * truncation + opacity) * y[index];
    }

    private static void Scale(Span<double> dy, double factor, int count)
    {
        for (int i = 0; i < count; i++)
        {
            dy[i] *= factor;
        }
    }
}
