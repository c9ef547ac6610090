namespace Sibyl.Perturbation.Spectra;

/// <summary>
/// Which terms make up which observables and how each depends on the nuisance parameters. Every
/// observable is linear in these monomials, so a sampler can marginalise linear parameters analytically
/// and an emulator need only learn the cosmology dependence of each term.
/// </summary>
public sealed class BasisLayout
{
    /// <summary>Creates a layout, checking that every index points at an observable or parameter.</summary>
    /// <exception cref="ArgumentException">An index is out of range or a name repeats.</exception>
    public BasisLayout(IReadOnlyList<string> observables, IReadOnlyList<string> nuisance, IReadOnlyList<BasisTerm> terms)
    {
        ArgumentNullException.ThrowIfNull(observables);
        ArgumentNullException.ThrowIfNull(nuisance);
        ArgumentNullException.ThrowIfNull(terms);
        foreach (var term in terms)
        {
            if (term.Observable < 0 || term.Observable >= observables.Count || term.NuisanceFactors.Any(i => i < 0 || i >= nuisance.Count))
            {
                throw new ArgumentException($"term {term.Name} refers to an observable or nuisance parameter that does not exist", nameof(terms));
            }
        }

        if (terms.Select(t => t.Name).Distinct(StringComparer.Ordinal).Count() != terms.Count)
        {
            throw new ArgumentException("term names must be unique", nameof(terms));
        }

        Observables = observables;
        Nuisance = nuisance;
        Terms = terms;
    }

    /// <summary>Observable names, for example ["P"] or ["P0", "P2", "P4"].</summary>
    public IReadOnlyList<string> Observables { get; }

    /// <summary>Nuisance-parameter names, in the order assembly expects their values.</summary>
    public IReadOnlyList<string> Nuisance { get; }

    /// <summary>The terms.</summary>
    public IReadOnlyList<BasisTerm> Terms { get; }

    /// <summary>Coefficient of term <paramref name="index"/> for the given nuisance values.</summary>
    public double Coefficient(int index, ReadOnlySpan<double> nuisance)
    {
        var term = Terms[index];
        double c = term.Prefactor;
        foreach (int factor in term.NuisanceFactors)
        {
            c *= nuisance[factor];
        }

        return c;
    }

    /// <summary>
    /// destination = Σ_t coefficients[t] × row t over the terms of <paramref name="observable"/>, in term order, terms
    /// with a zero coefficient skipped. Rows are term-major, <paramref name="rowLength"/> numbers each: values over k,
    /// or anything laid out per term the same way (variances with squared coefficients, gradients over k × parameters).
    /// The one assembly every consumer shares, so an observable is the same to the last bit wherever it is built.
    /// </summary>
    /// <exception cref="ArgumentException">Wrong number of coefficients, rows or destination length.</exception>
    public void Combine(ReadOnlySpan<double> rows, int rowLength, ReadOnlySpan<double> coefficients, int observable, Span<double> destination)
    {
        if (coefficients.Length != Terms.Count || rows.Length < Terms.Count * rowLength || destination.Length != rowLength)
        {
            throw new ArgumentException($"need {Terms.Count} coefficients, {Terms.Count} rows of {rowLength} and a destination of {rowLength}");
        }

        destination.Clear();
        for (int t = 0; t < Terms.Count; t++)
        {
            double c = coefficients[t];
            if (Terms[t].Observable != observable || c == 0.0)
            {
                continue;
            }

            var row = rows.Slice(t * rowLength, rowLength);
            for (int i = 0; i < rowLength; i++)
            {
                destination[i] += c * row[i];
            }
        }
    }

    /// <summary>Index of a nuisance parameter by name.</summary>
    /// <exception cref="KeyNotFoundException">Unknown name.</exception>
    public int NuisanceIndex(string name)
    {
        for (int i = 0; i < Nuisance.Count; i++)
        {
            if (string.Equals(Nuisance[i], name, StringComparison.Ordinal))
            {
                return i;
            }
        }

        throw new KeyNotFoundException($"unknown nuisance parameter '{name}'; known: {string.Join(", ", Nuisance)}");
    }
}
