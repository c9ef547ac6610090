using Sibyl.Cosmology.Numerics;

namespace Sibyl.Cosmology.Boltzmann.Perturbations;

/// <summary>
/// Evolves single k modes from outside the horizon to today: tight coupling while the photon mean free time
/// is short against both 1/k and 1/𝓗, then the full hierarchies (integrated implicitly while Thomson scattering
/// keeps them stiff, explicitly after), then free-streaming radiation. One solver per thread; its buffers are
/// reused mode after mode.
/// </summary>
public sealed class ModeSolver
{
    private readonly ModeBackground _background;
    private readonly BoltzmannSettings _settings;
    private readonly ModeLayout _layout;
    private readonly DormandPrince54 _integrator;
    private readonly LinearRosenbrock2 _implicitIntegrator;
    private readonly double[] _state;

    /// <summary>Creates a solver on <paramref name="background"/>.</summary>
    public ModeSolver(ModeBackground background, BoltzmannSettings settings)
    {
        ArgumentNullException.ThrowIfNull(background);
        ArgumentNullException.ThrowIfNull(settings);
        settings.Validate();
        _background = background;
        _settings = settings;
        _layout = ModeLayout.For(settings);
        _integrator = new DormandPrince54(_layout.Dimension);
        _implicitIntegrator = new LinearRosenbrock2(_layout.Dimension);
        _state = new double[_layout.Dimension];
    }

    /// <summary>
    /// The ln a at which each stage starts for wavenumber <paramref name="k"/> (1/Mpc): tight coupling, the full
    /// hierarchy (implicit integration), its explicit integration, free streaming.
    /// </summary>
    public (double Start, double FullHierarchy, double Explicit, double FreeStreaming) Schedule(double k)
    {
        double startTime = _settings.InitialKTau / k;
        double start = Math.Min(Math.Max(_background.LnAAtTime(startTime), _background.MinLnA + 1e-3), Math.Log(1e-6));
        double limit = _settings.TightCouplingLimit, wavenumberLimit = _settings.TightCouplingWavenumberLimit;
        double full = _background.FirstWhere(p => k > wavenumberLimit * p.Opacity || p.ConformalHubble > limit * p.Opacity, start);
        double streaming = _background.FirstWhere(
            p => k * p.Time > _settings.StreamingMinKTau && p.Opacity < _settings.StreamingMaxOpacity * p.ConformalHubble, full);
        // The fastest rate of the hierarchy is the photon–baryon slip, damped at (1 + R)κ' with R = 4ρ_γ/(3ρ_b).
        double ratio = _settings.ImplicitOpacityRatio, photonToBaryon = _background.PhotonToBaryonToday;
        double explicitStart = Math.Min(
            _background.FirstWhere(p => (1.0 + photonToBaryon / p.ScaleFactor) * p.Opacity < ratio * Math.Max(k, p.ConformalHubble), full),
            streaming);
        return (start, full, explicitStart, streaming);
    }

    /// <summary>
    /// The matter density contrast δ_m(k) in the CDM frame at <paramref name="lnAEnd"/> for ζ = 1 initially,
    /// <paramref name="k"/> in 1/Mpc.
    /// </summary>
    /// <exception cref="ArithmeticException">The integration failed; the message names k.</exception>
    public double MatterContrast(double k, double lnAEnd = 0.0)
    {
        var equations = new ModeEquations(_background, _layout, k);
        try
        {
            Evolve(equations, k, lnAEnd, _state);
        }
        catch (ArithmeticException e)
        {
            throw new ArithmeticException($"Boltzmann mode k = {k:G6}/Mpc: {e.Message}", e);
        }

        return equations.MatterContrast(_state);
    }

    /// <summary>Evolves mode <paramref name="k"/> to <paramref name="lnAEnd"/> and leaves the state in <paramref name="state"/>.</summary>
    public void Evolve(ModeEquations equations, double k, double lnAEnd, Span<double> state)
    {
        ArgumentNullException.ThrowIfNull(equations);
        var (start, full, explicitStart, streaming) = Schedule(k);
        equations.InitialConditions(start, state);
        // ζ = 1 sets the scale of η; the densities start at O((kτ)²) of it, so the absolute tolerance follows them down
        // for modes that start far outside the horizon (k τ_start < 1 when the start is held at a = 1e-6).
        _background.At(start, out var first);
        double kt = Math.Min(1.0, k * first.Time);
        double tolerance = _settings.RelativeTolerance, absolute = 1e-3 * tolerance * kt * kt;
        double step = 1e-3;
        int n = _layout.Dimension;

        equations.Regime = ModeRegime.TightCoupling;
        double end = Math.Min(full, lnAEnd);
        _integrator.Integrate(equations.Derivative, state, n, start, end, ref step, tolerance, absolute);
        if (end >= lnAEnd)
        {
            return;
        }

        equations.LeaveTightCoupling(full, state);
        equations.Regime = ModeRegime.FullHierarchy;
        double stiffEnd = Math.Min(explicitStart, lnAEnd);
        _implicitIntegrator.Integrate(equations.Derivative, state, n, full, stiffEnd, ref step, tolerance, absolute);
        end = Math.Min(streaming, lnAEnd);
        _integrator.Integrate(equations.Derivative, state, n, stiffEnd, end, ref step, tolerance, absolute);
        if (end >= lnAEnd)
        {
            return;
        }

        equations.Regime = ModeRegime.FreeStreaming;
        _integrator.Integrate(equations.Derivative, state, ModeEquations.FreeStreamingDimension, streaming, lnAEnd, ref step, tolerance, absolute);
    }
}
