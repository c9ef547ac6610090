using System.Globalization;
using Sibyl.Cosmology.Linear;

namespace Sibyl.Cosmology.Parameters;

/// <summary>
/// Every cosmological parameter users can set by name, with defaults and physical ranges, and the one
/// place that turns name=value text into <see cref="CosmologyParameters"/>. Ranges are physical limits
/// (or the validity of the fitting formula), not prior boxes.
/// </summary>
public static class ParameterCatalog
{
    /// <summary>Gravity-model selector name.</summary>
    public const string ModelName = "model";

    /// <summary>Linear-source selector name.</summary>
    public const string LinearName = "linear";

    /// <summary>h.</summary>
    public static ParameterDefinition H { get; } = new("h", 0.6766, 0, false, 2, true, "", "H0 / (100 km/s/Mpc)");

    /// <summary>ω_b.</summary>
    public static ParameterDefinition OmegaBaryon { get; } = new("omega_b", 0.02242, 0, false, 0.1, true, "", "baryon density Omega_b h^2");

    /// <summary>ω_cdm.</summary>
    public static ParameterDefinition OmegaCdm { get; } = new("omega_cdm", 0.11933, 0, false, 1, true, "", "cold dark matter density Omega_cdm h^2");

    /// <summary>n_s.</summary>
    public static ParameterDefinition SpectralIndex { get; } = new("n_s", 0.9665, 0.5, true, 1.5, true, "", "scalar spectral index");

    /// <summary>ln(10^10 A_s).</summary>
    public static ParameterDefinition Ln10As { get; } = new("ln10As", double.NaN, 1, true, 5, true, "", "ln(10^10 A_s), pivot 0.05/Mpc (replaces sigma8)");

    /// <summary>σ8.</summary>
    public static ParameterDefinition Sigma8 { get; } = new("sigma8", 0.8102, 0, false, 2, true, "", "sigma8 of the GR counterpart at z = 0 (used unless ln10As is given)");

    /// <summary>w0.</summary>
    public static ParameterDefinition W0 { get; } = new("w0", -1, -3, true, 1, true, "", "dark-energy equation of state today (CPL)");

    /// <summary>wa.</summary>
    public static ParameterDefinition Wa { get; } = new("wa", 0, -5, true, 5, true, "", "CPL slope; w0 + wa < 0 required");

    /// <summary>Ω_rc.</summary>
    public static ParameterDefinition OmegaRc { get; } = new("Omega_rc", 0, 0, true, 100, true, "", "nDGP crossover 1/(4 r_c^2 H0^2), model=ndgp only");

    /// <summary>qs μ0.</summary>
    public static ParameterDefinition Mu0 { get; } = new("mu0", 0, -1, false, 10, true, "", "qs: mu(z=0) - 1, scaling as Omega_DE(a)");

    /// <summary>qs quadratic vertex.</summary>
    public static ParameterDefinition Vertex2 { get; } = new("vertex2", 0, -100, true, 100, true, "", "qs: quadratic Galileon vertex today, scaling as Omega_DE(a)");

    /// <summary>qs cubic vertex.</summary>
    public static ParameterDefinition Vertex3 { get; } = new("vertex3", 0, -100, true, 100, true, "", "qs: cubic Galileon vertex today, scaling as Omega_DE(a)");

    /// <summary>T_CMB.</summary>
    public static ParameterDefinition CmbTemperature { get; } = new("T_cmb", 2.7255, 2, true, 3, true, "K", "CMB temperature");

    /// <summary>N_eff; read by the Boltzmann solver only.</summary>
    public static ParameterDefinition NEff { get; } = new("N_eff", 3.046, 0, true, 10, true, "", "effective number of massless neutrino species, linear=boltzmann only");

    /// <summary>Y_He; read by the Boltzmann solver only.</summary>
    public static ParameterDefinition HeliumFraction { get; } = new("Y_He", 0.2454, 0, false, 0.5, false, "", "primordial helium mass fraction, linear=boltzmann only");

    /// <summary>Output redshift; not part of the cosmology but set with it.</summary>
    public static ParameterDefinition Redshift { get; } = new("z", 0, 0, true, 20, true, "", "output redshift");

    /// <summary>All cosmological parameters in help order (the model selector is separate).</summary>
    public static IReadOnlyList<ParameterDefinition> All { get; } =
    [
        H, OmegaBaryon, OmegaCdm, SpectralIndex, Ln10As, Sigma8, W0, Wa, OmegaRc, Mu0, Vertex2, Vertex3, CmbTemperature, NEff, HeliumFraction,
    ];

    /// <summary>
    /// Parameters that only <see cref="LinearSource.Boltzmann"/> reads: the fit and a user's table ignore them, so
    /// setting them for another source is refused rather than silently doing nothing.
    /// </summary>
    public static IReadOnlyList<ParameterDefinition> BoltzmannOnly { get; } = [NEff, HeliumFraction];

    /// <summary>Model names accepted after <c>model=</c>.</summary>
    public static IReadOnlyDictionary<string, GravityKind> Models { get; } = new Dictionary<string, GravityKind>(StringComparer.Ordinal)
    {
        ["lcdm"] = GravityKind.Lcdm,
        ["ndgp"] = GravityKind.Ndgp,
        ["qs"] = GravityKind.QuasiStatic,
    };

    /// <summary>Linear-source names accepted after <c>linear=</c>; <c>fit</c> is the default.</summary>
    public static IReadOnlyDictionary<string, LinearSource> LinearSources { get; } = new Dictionary<string, LinearSource>(StringComparer.Ordinal)
    {
        ["fit"] = LinearSource.Fit,
        ["boltzmann"] = LinearSource.Boltzmann,
    };

    /// <summary>The name of <paramref name="source"/> after <c>linear=</c> and in grid specs.</summary>
    public static string NameOf(LinearSource source) => LinearSources.First(s => s.Value == source).Key;

    /// <summary>Parses a finite number written in the invariant culture.</summary>
    /// <exception cref="ParameterOutOfRangeException">Empty, not a number, or not finite.</exception>
    public static double ParseNumber(string name, string text)
    {
        if (string.IsNullOrWhiteSpace(text))
        {
            throw new ParameterOutOfRangeException(name, "missing value");
        }

        if (!double.TryParse(text, NumberStyles.Float, CultureInfo.InvariantCulture, out double value))
        {
            throw new ParameterOutOfRangeException(name, $"'{text}' is not a number");
        }

        if (!double.IsFinite(value))
        {
            throw new ParameterOutOfRangeException(name, $"must be finite, got {text}");
        }

        return value;
    }

    /// <summary>
    /// Builds parameters from name → text pairs; names not given take their defaults. Names outside this
    /// catalog are left to the caller (who may own further parameters such as z or nuisance values).
    /// </summary>
    /// <exception cref="ParameterOutOfRangeException">A value is invalid, or a combination is (ln10As with sigma8,
    /// w0 + wa ≥ 0, Ω_m > 1, model parameters given for another model, ndgp on a non-ΛCDM background).</exception>
    public static CosmologyParameters Build(IReadOnlyDictionary<string, string> values)
    {
        ArgumentNullException.ThrowIfNull(values);
        double Get(ParameterDefinition d) => values.TryGetValue(d.Name, out var text) ? d.Check(ParseNumber(d.Name, text)) : d.Default;

        GravityKind gravity = GravityKind.Lcdm;
        if (values.TryGetValue(ModelName, out var modelText) && !Models.TryGetValue(modelText, out gravity))
        {
            throw new ParameterOutOfRangeException(ModelName, $"must be one of {string.Join(", ", Models.Keys)}, got '{modelText}'");
        }

        bool hasAs = values.ContainsKey(Ln10As.Name);
        if (hasAs && values.ContainsKey(Sigma8.Name))
        {
            throw new ParameterOutOfRangeException(Ln10As.Name, "give either ln10As or sigma8, not both");
        }

        var parameters = new CosmologyParameters
        {
            H = Get(H),
            OmegaBaryon = Get(OmegaBaryon),
            OmegaCdm = Get(OmegaCdm),
            SpectralIndex = Get(SpectralIndex),
            Ln10As = hasAs ? Get(Ln10As) : null,
            Sigma8 = hasAs ? null : Get(Sigma8),
            W0 = Get(W0),
            Wa = Get(Wa),
            Gravity = gravity,
            OmegaRc = Get(OmegaRc),
            Mu0 = Get(Mu0),
            Vertex2 = Get(Vertex2),
            Vertex3 = Get(Vertex3),
            CmbTemperature = Get(CmbTemperature),
            NEff = Get(NEff),
            HeliumFraction = Get(HeliumFraction),
        };
        RequireModelParameters(values, gravity);
        Validate(parameters);
        return parameters;
    }

    /// <summary>Checks every value and the combinations that single ranges cannot express.</summary>
    /// <exception cref="ParameterOutOfRangeException">Something is out of range.</exception>
    public static void Validate(CosmologyParameters p)
    {
        ArgumentNullException.ThrowIfNull(p);
        H.Check(p.H);
        OmegaBaryon.Check(p.OmegaBaryon);
        OmegaCdm.Check(p.OmegaCdm);
        SpectralIndex.Check(p.SpectralIndex);
        W0.Check(p.W0);
        Wa.Check(p.Wa);
        OmegaRc.Check(p.OmegaRc);
        Mu0.Check(p.Mu0);
        Vertex2.Check(p.Vertex2);
        Vertex3.Check(p.Vertex3);
        CmbTemperature.Check(p.CmbTemperature);
        NEff.Check(p.NEff);
        HeliumFraction.Check(p.HeliumFraction);
        if ((p.Ln10As is null) == (p.Sigma8 is null))
        {
            throw new ParameterOutOfRangeException(Sigma8.Name, "exactly one of ln10As and sigma8 must be set");
        }

        if (p.Ln10As is { } lnAs)
        {
            Ln10As.Check(lnAs);
        }

        if (p.Sigma8 is { } s8)
        {
            Sigma8.Check(s8);
        }

        if (!(p.OmegaMatter <= 1.0))
        {
            throw new ParameterOutOfRangeException(
                OmegaCdm.Name, string.Create(CultureInfo.InvariantCulture, $"(omega_b + omega_cdm)/h^2 = Omega_m must be <= 1 (flat universe), got {p.OmegaMatter:G6}"));
        }

        if (!(p.W0 + p.Wa < 0.0))
        {
            throw new ParameterOutOfRangeException(Wa.Name, "w0 + wa must be < 0 so that matter dominates at early times");
        }

        if (p.Gravity == GravityKind.Ndgp && (p.W0 != -1.0 || p.Wa != 0.0))
        {
            throw new ParameterOutOfRangeException(ModelName, "ndgp lives on a LCDM background: leave w0 = -1 and wa = 0");
        }
    }

    /// <summary>
    /// The linear source named by <c>linear=</c> in <paramref name="values"/> (<see cref="LinearSource.Fit"/> when absent).
    /// </summary>
    /// <exception cref="ParameterOutOfRangeException">The name is unknown, or a parameter of <see cref="BoltzmannOnly"/>
    /// is given for another source.</exception>
    public static LinearSource LinearSourceOf(IReadOnlyDictionary<string, string> values)
    {
        ArgumentNullException.ThrowIfNull(values);
        var source = LinearSource.Fit;
        if (values.TryGetValue(LinearName, out var text) && !LinearSources.TryGetValue(text, out source))
        {
            throw new ParameterOutOfRangeException(LinearName, $"must be one of {string.Join(", ", LinearSources.Keys)}, got '{text}'");
        }

        foreach (var definition in BoltzmannOnly)
        {
            if (source != LinearSource.Boltzmann && values.ContainsKey(definition.Name))
            {
                throw new ParameterOutOfRangeException(definition.Name, $"applies only to {LinearName}={NameOf(LinearSource.Boltzmann)}");
            }
        }

        return source;
    }

    private static void RequireModelParameters(IReadOnlyDictionary<string, string> values, GravityKind gravity)
    {
        foreach (var (definition, owner) in new[]
                 {
                     (OmegaRc, GravityKind.Ndgp), (Mu0, GravityKind.QuasiStatic),
                     (Vertex2, GravityKind.QuasiStatic), (Vertex3, GravityKind.QuasiStatic),
                 })
        {
            if (values.ContainsKey(definition.Name) && gravity != owner)
            {
                string ownerName = Models.First(m => m.Value == owner).Key;
                throw new ParameterOutOfRangeException(definition.Name, $"applies only to model={ownerName}");
            }
        }
    }
}
