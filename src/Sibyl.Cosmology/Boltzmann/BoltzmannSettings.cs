namespace Sibyl.Cosmology.Boltzmann;

/// <summary>
/// Accuracy knobs of the Boltzmann solver. With the defaults the matter spectrum moves by at most 3e-4 for
/// k ≤ 1 h/Mpc when the tolerance is halved and the hierarchies doubled, and by less than 1e-3 when the
/// approximations switch later; the convergence tests hold both to 1e-3. Truncating the photon hierarchy at ℓ = 10
/// or the neutrino one at 30 would already cost 1e-3 near k = 0.1 h/Mpc: truncation reflects power back down the
/// hierarchy, and the neutrinos stream freely while kτ grows to hundreds before decoupling.
/// </summary>
public sealed record BoltzmannSettings
{
    /// <summary>Highest photon temperature multipole ℓ kept before truncation (Ma &amp; Bertschinger 1995, eq. 65).</summary>
    public int PhotonMultipoles { get; init; } = 16;

    /// <summary>Highest photon polarisation multipole.</summary>
    public int PolarizationMultipoles { get; init; } = 8;

    /// <summary>Highest massless-neutrino multipole.</summary>
    public int NeutrinoMultipoles { get; init; } = 36;

    /// <summary>Relative tolerance per integration step.</summary>
    public double RelativeTolerance { get; init; } = 1e-5;

    /// <summary>
    /// Tight coupling holds while τ_c·𝓗 stays below this (τ_c = 1/κ' the photon mean free time) …
    /// </summary>
    public double TightCouplingLimit { get; init; } = 0.01;

    /// <summary>
    /// … and τ_c·k below this. Modes this far inside the horizon are Silk-damped in the photon–baryon fluid
    /// before the first-order scheme's error, of order (τ_c k)², matters for the matter spectrum.
    /// </summary>
    public double TightCouplingWavenumberLimit { get; init; } = 0.1;

    /// <summary>
    /// After tight coupling, the linearly implicit <see cref="Numerics.LinearRosenbrock2"/> integrates while the
    /// photon–baryon slip rate (1 + R)κ' (R = 4ρ_γ/3ρ_b) exceeds this multiple of max(k, 𝓗), where an explicit step
    /// would be held to about 3/((1 + R)κ') by stability. With the default tight-coupling limits and baryon densities
    /// near ω_b = 0.022 that rate is below 1000 max(k, 𝓗) when the hierarchy starts, so the explicit
    /// <see cref="Numerics.DormandPrince54"/> does all the work (it is 3–20× cheaper per mode there); with tight coupling
    /// switched off (limits of 1e-5) the explicit integrator cannot finish in 10⁶ steps while the implicit one takes
    /// 0.1–0.6 s per mode.
    /// </summary>
    public double ImplicitOpacityRatio { get; init; } = 1000.0;

    /// <summary>The free-streaming approximation for radiation starts once k·τ exceeds this …</summary>
    public double StreamingMinKTau { get; init; } = 45.0;

    /// <summary>… and photons have decoupled: κ'/𝓗 below this.</summary>
    public double StreamingMaxOpacity { get; init; } = 0.05;

    /// <summary>Modes start when k·τ equals this (deep outside the horizon, where the initial series holds).</summary>
    public double InitialKTau { get; init; } = 0.01;

    /// <summary>Checks every field.</summary>
    /// <exception cref="ArgumentOutOfRangeException">A field is outside its allowed range.</exception>
    public void Validate()
    {
        Require(PhotonMultipoles >= 4 && PhotonMultipoles <= 200, nameof(PhotonMultipoles), PhotonMultipoles, "[4, 200]");
        Require(PolarizationMultipoles >= 4 && PolarizationMultipoles <= 200, nameof(PolarizationMultipoles), PolarizationMultipoles, "[4, 200]");
        Require(NeutrinoMultipoles >= 4 && NeutrinoMultipoles <= 200, nameof(NeutrinoMultipoles), NeutrinoMultipoles, "[4, 200]");
        Require(RelativeTolerance >= 1e-12 && RelativeTolerance <= 1e-2, nameof(RelativeTolerance), RelativeTolerance, "[1e-12, 1e-2]");
        Require(TightCouplingLimit > 0 && TightCouplingLimit <= 0.1, nameof(TightCouplingLimit), TightCouplingLimit, "(0, 0.1]");
        Require(TightCouplingWavenumberLimit > 0 && TightCouplingWavenumberLimit <= 0.5, nameof(TightCouplingWavenumberLimit), TightCouplingWavenumberLimit, "(0, 0.5]");
        Require(ImplicitOpacityRatio >= 1, nameof(ImplicitOpacityRatio), ImplicitOpacityRatio, "[1, ∞)");
        Require(StreamingMinKTau >= 10, nameof(StreamingMinKTau), StreamingMinKTau, "[10, ∞)");
        Require(StreamingMaxOpacity > 0 && StreamingMaxOpacity <= 1, nameof(StreamingMaxOpacity), StreamingMaxOpacity, "(0, 1]");
        Require(InitialKTau > 0 && InitialKTau <= 0.1, nameof(InitialKTau), InitialKTau, "(0, 0.1]");
    }

    private static void Require(bool ok, string name, double value, string range)
    {
        if (!ok)
        {
            throw new ArgumentOutOfRangeException(name, value, $"{name} must lie in {range}");
        }
    }
}
