using static Sibyl.Cosmology.Boltzmann.Recombination.PhysicalConstants;

namespace Sibyl.Cosmology.Boltzmann.Recombination;

/// <summary>
/// Ionisation and temperature of the baryons from a = e^−23 ≈ 1e-10 to today, tabulated on a uniform grid in
/// ln a with spacing 1e-3 and read back by cubic interpolation in O(1) without allocation.
/// Hydrogen follows the effective three-level atom of Peebles (1968, ApJ 153, 1) with the fudge factor
/// F = 1.14 and He I its singlet analogue, both as in Seager, Sasselov &amp; Scott (1999, ApJ 523, L1; 2000,
/// ApJS 128, 407); He III → He II is in Saha equilibrium. No reionisation: the gas stays as recombination
/// leaves it down to z = 0, so <see cref="OpticalDepth"/> lacks the late contribution (τ_reio ≈ 0.05).
/// Lengths in Mpc, rates in 1/Mpc (c = 1), temperatures in K.
/// </summary>
public sealed partial class ThermalHistory
{
    /// <summary>ln a of the first table node (a ≈ 1.03e-10, z ≈ 9.7e9).</summary>
    public const double LnAStart = -23.0;

    /// <summary>Spacing of the tables in ln a.</summary>
    public const double LnAStep = 1e-3;

    private const int NodeCount = 23001;

    private readonly LnAGrid _grid = new(LnAStart, LnAStep, NodeCount);
    private readonly double[] _ionizedHydrogen = new double[NodeCount], _freeElectrons = new double[NodeCount];
    private readonly double[] _temperatureRatio = new double[NodeCount];
    private readonly double[] _opacity = new double[NodeCount], _soundSpeedSquared = new double[NodeCount];
    private readonly double[] _opticalDepth = new double[NodeCount], _dragDepth = new double[NodeCount];
    private readonly double[] _soundHorizon = new double[NodeCount];
    private readonly double _cmbTemperature;

    private ThermalHistory(RadiationBackground background, double heliumFraction)
    {
        _cmbTemperature = background.CmbTemperature;
        HeliumToHydrogen = heliumFraction / (HeliumToHydrogenMass * (1.0 - heliumFraction));
        double hubbleTodaySi = background.HubbleToday * SpeedOfLight / Megaparsec;
        double baryonDensity = background.OmegaBaryon * 3.0 * hubbleTodaySi * hubbleTodaySi / (8.0 * Math.PI * GravitationalConstant);
        double hydrogenDensity = (1.0 - heliumFraction) * baryonDensity / HydrogenMass;

        var conformalHubble = new double[NodeCount];
        var hubble = new double[NodeCount];
        for (int i = 0; i < NodeCount; i++)
        {
            double a = Math.Exp(_grid.LnA(i));
            conformalHubble[i] = background.ConformalHubble(a);
            hubble[i] = conformalHubble[i] / a * SpeedOfLight / Megaparsec;
        }

        var temperatureSlope = new double[NodeCount];
        var rates = new RecombinationRates(hydrogenDensity, HeliumToHydrogen, _cmbTemperature);
        RecombinationSolver.Solve(_grid, hubble, rates, hydrogenDensity, HeliumToHydrogen, _cmbTemperature,
            _ionizedHydrogen, _freeElectrons, _temperatureRatio, temperatureSlope);

        // One scratch array holds dτ/d ln a, then the drag integrand, then the sound-horizon integrand.
        double thomsonToday = hydrogenDensity * ThomsonCrossSection * Megaparsec;
        double baryonToPhoton = 3.0 * background.OmegaBaryon / (4.0 * background.OmegaPhoton);
        double restEnergy = HydrogenMass * SpeedOfLight * SpeedOfLight;
        var integrand = new double[NodeCount];
        for (int i = 0; i < NodeCount; i++)
        {
            double a = Math.Exp(_grid.LnA(i)), xe = _freeElectrons[i];
            _opacity[i] = thomsonToday * xe / (a * a);
            double inverseMolecularWeight = (1.0 - heliumFraction) * (1.0 + HeliumToHydrogen + xe);
            double temperature = _temperatureRatio[i] * _cmbTemperature / a;
            _soundSpeedSquared[i] = BoltzmannConstant * temperature * inverseMolecularWeight / restEnergy
                                    * (1.0 - temperatureSlope[i] / 3.0);
            integrand[i] = _opacity[i] / conformalHubble[i];
        }

        _grid.IntegrateToEnd(integrand, _opticalDepth);
        for (int i = 0; i < NodeCount; i++)
        {
            integrand[i] /= baryonToPhoton * Math.Exp(_grid.LnA(i));
        }

        _grid.IntegrateToEnd(integrand, _dragDepth);
        for (int i = 0; i < NodeCount; i++)
        {
            double a = Math.Exp(_grid.LnA(i));
            integrand[i] = 1.0 / (conformalHubble[i] * Math.Sqrt(3.0 * (1.0 + baryonToPhoton * a)));
        }

        // Before the first node R ≈ 1e-7 and radiation dominates: τ = a / (H0 √Ω_r), r_s = τ / √3.
        double start = Math.Exp(LnAStart) / (background.HubbleToday * Math.Sqrt(3.0 * background.OmegaRadiation));
        _grid.IntegrateFromStart(integrand, start, _soundHorizon);

        PhotonDecouplingRedshift = RedshiftOfUnitDepth(_opticalDepth);
        DragRedshift = RedshiftOfUnitDepth(_dragDepth);
        SoundHorizonAtDecoupling = _grid.Interpolate(_soundHorizon, -Math.Log(1.0 + PhotonDecouplingRedshift));
        SoundHorizonAtDrag = _grid.Interpolate(_soundHorizon, -Math.Log(1.0 + DragRedshift));
    }

    /// <summary>Largest redshift of the tables, 1/a − 1 at <see cref="LnAStart"/>.</summary>
    public static double MaximumRedshift { get; } = Math.Exp(-LnAStart) - 1.0;

    /// <summary>
    /// Solves the thermal history of <paramref name="background"/> with primordial helium mass fraction
    /// <paramref name="heliumFraction"/>. Takes about 10 ms (two-core machine, Release build).
    /// </summary>
    /// <param name="background">Flat background; Ω_b and T_CMB must be positive.</param>
    /// <param name="heliumFraction">Y_He in (0, 0.5); 0.2454 for Planck 2018.</param>
    /// <exception cref="ArgumentNullException"><paramref name="background"/> is null.</exception>
    /// <exception cref="ArgumentOutOfRangeException">Y_He, Ω_b or T_CMB is out of range.</exception>
    public static ThermalHistory Solve(RadiationBackground background, double heliumFraction)
    {
        ArgumentNullException.ThrowIfNull(background);
        if (!(heliumFraction > 0.0 && heliumFraction < 0.5))
        {
            throw new ArgumentOutOfRangeException(nameof(heliumFraction), heliumFraction,
                "HeliumFraction (Y_He) must lie in (0, 0.5)");
        }

        if (!(background.OmegaBaryon > 0.0 && background.OmegaBaryon < 1.0))
        {
            throw new ArgumentOutOfRangeException(nameof(background), background.OmegaBaryon,
                "OmegaBaryon (Ω_b) must lie in (0, 1)");
        }

        if (!(background.CmbTemperature > 0.0 && background.CmbTemperature < 10.0))
        {
            throw new ArgumentOutOfRangeException(nameof(background), background.CmbTemperature,
                "CmbTemperature (T_CMB) must lie in (0, 10) K");
        }

        return new ThermalHistory(background, heliumFraction);
    }

    /// <summary>f_He = n_He / n_H = Y_He / (3.9715 (1 − Y_He)), with the He/H mass ratio of SSS (1999).</summary>
    public double HeliumToHydrogen { get; }
}
