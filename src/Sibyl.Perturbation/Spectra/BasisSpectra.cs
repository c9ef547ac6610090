namespace Sibyl.Perturbation.Spectra;

/// <summary>
/// Every nuisance-independent term of an observable over a k grid, and the one function that assembles
/// the observable for given nuisance values. The direct calculation and the emulator both produce this
/// type, so everything downstream is written once.
/// </summary>
public sealed class BasisSpectra
{
    private readonly double[] _k;
    private readonly double[] _terms;

    /// <summary>Creates the spectra; <paramref name="terms"/> holds term-major rows of length k.Length.</summary>
    /// <exception cref="ArgumentException">Sizes disagree.</exception>
    public BasisSpectra(BasisLayout layout, double[] k, double[] terms)
    {
        ArgumentNullException.ThrowIfNull(layout);
        ArgumentNullException.ThrowIfNull(k);
        ArgumentNullException.ThrowIfNull(terms);
        if (terms.Length != layout.Terms.Count * k.Length)
        {
            throw new ArgumentException($"expected {layout.Terms.Count} terms × {k.Length} k values, got {terms.Length} numbers", nameof(terms));
        }

        Layout = layout;
        _k = k;
        _terms = terms;
    }

    /// <summary>What the terms are.</summary>
    public BasisLayout Layout { get; }

    /// <summary>Wavenumbers in h/Mpc.</summary>
    public ReadOnlySpan<double> K => _k;

    /// <summary>Term <paramref name="index"/> over k, in (Mpc/h)³.</summary>
    public ReadOnlySpan<double> Term(int index) => _terms.AsSpan(index * _k.Length, _k.Length);

    /// <summary>Term by name.</summary>
    /// <exception cref="KeyNotFoundException">Unknown name.</exception>
    public ReadOnlySpan<double> Term(string name)
    {
        for (int t = 0; t < Layout.Terms.Count; t++)
        {
            if (string.Equals(Layout.Terms[t].Name, name, StringComparison.Ordinal))
            {
                return Term(t);
            }
        }

        throw new KeyNotFoundException($"no basis term '{name}'");
    }

    /// <summary>Writes observable <paramref name="observable"/> for <paramref name="nuisance"/> (in layout order) into <paramref name="destination"/>.</summary>
    /// <exception cref="ArgumentException">Wrong number of nuisance values or destination length.</exception>
    public void Assemble(ReadOnlySpan<double> nuisance, int observable, Span<double> destination)
    {
        if (nuisance.Length != Layout.Nuisance.Count || destination.Length != _k.Length)
        {
            throw new ArgumentException($"need {Layout.Nuisance.Count} nuisance values and {_k.Length} outputs");
        }

        // A few dozen terms at most, so the coefficients fit on the stack.
        Span<double> coefficients = stackalloc double[Layout.Terms.Count];
        for (int t = 0; t < coefficients.Length; t++)
        {
            coefficients[t] = Layout.Terms[t].Observable == observable ? Layout.Coefficient(t, nuisance) : 0.0;
        }

        Layout.Combine(_terms, _k.Length, coefficients, observable, destination);
    }
}
